#include "wetfront/profiles/time_axis.hpp"

#include <date/date.h>
#include <fmt/format.h>

#include <stdexcept>

#include "wetfront/base/time_point.hpp"

namespace wetfront::profiles {

std::string days_since_units(std::string_view run_start_date) {
  // The record holds the ISO form with 'T' (no space), as the run file's attribute shows it.
  const bool iso_form = run_start_date.size() <= 10 || run_start_date[10] == 'T';
  const auto start = base::parse_timestamp(run_start_date);
  if (!iso_form || !start) {
    throw std::invalid_argument(
        fmt::format("run start date '{}' is not an ISO 8601 date; expected {}", run_start_date, base::kTimestampForms));
  }
  // A date alone stays a date; a date-time keeps its time of day, even at midnight.
  if (run_start_date.size() == 10) return fmt::format("days since {}", date::format("%F", *start));
  return fmt::format("days since {}", date::format("%F %T", *start));
}

}  // namespace wetfront::profiles
