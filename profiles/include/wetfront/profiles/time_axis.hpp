// The calendar origin of a run's time axes.
#pragma once

#include <string>
#include <string_view>

namespace wetfront::profiles {

// Units text for times counted in days from the run start, in the form CF-aware readers
// decode ("days since 2025-04-01" or "days since 2025-04-01 06:30:00").
// run_start_date: ISO 8601 "YYYY-MM-DD", "YYYY-MM-DDThh:mm" or "YYYY-MM-DDThh:mm:ss".
// Throws std::invalid_argument naming the text and the accepted forms otherwise.
std::string days_since_units(std::string_view run_start_date);

}  // namespace wetfront::profiles
