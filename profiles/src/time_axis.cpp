#include "wetfront/profiles/time_axis.hpp"

#include <date/date.h>
#include <fmt/format.h>

#include <chrono>
#include <sstream>
#include <stdexcept>

namespace wetfront::profiles {

namespace {

// Parses the whole text with one format; false when the format does not match it all.
template <typename TimePoint>
bool parse_whole(std::string_view text, const char* format, TimePoint& value) {
  std::istringstream stream{std::string(text)};
  stream >> date::parse(format, value);
  return !stream.fail() && stream.peek() == std::char_traits<char>::eof();
}

}  // namespace

std::string days_since_units(std::string_view run_start_date) {
  date::sys_days day;
  if (parse_whole(run_start_date, "%Y-%m-%d", day)) return fmt::format("days since {}", date::format("%F", day));
  date::sys_seconds instant;
  if (parse_whole(run_start_date, "%Y-%m-%dT%H:%M:%S", instant) ||
      parse_whole(run_start_date, "%Y-%m-%dT%H:%M", instant))
    return fmt::format("days since {}", date::format("%F %T", instant));
  throw std::invalid_argument(fmt::format(
      "run start date '{}' is not an ISO 8601 date; expected YYYY-MM-DD, YYYY-MM-DDThh:mm or YYYY-MM-DDThh:mm:ss",
      run_start_date));
}

}  // namespace wetfront::profiles
