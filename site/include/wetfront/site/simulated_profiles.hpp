// The solver's output profiles as the observation library takes them.
#pragma once

#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {

// Pressure head (cm) per output time and cell when `heads`, else water content (cm3/cm3).
observations::SimulatedProfiles simulated_profiles(const solver::ColumnRun& run, bool heads);

}  // namespace wetfront::site
