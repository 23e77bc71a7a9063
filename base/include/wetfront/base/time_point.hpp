// Calendar times at the boundary, days since the run start inside.
//
// Accepted text forms (ISO 8601 calendar dates, no time-zone designator; every time in a
// run is read in the same civil time as the run start):
//   2024-05-01            midnight at the start of that day
//   2024-05-01T06:30      hours and minutes
//   2024-05-01T06:30:15   with seconds
// A space may replace the 'T'.
#pragma once

#include <chrono>
#include <optional>
#include <string>
#include <string_view>

#include <date/date.h>

namespace wetfront::base {

using TimePoint = date::sys_seconds;

// The accepted forms, for error messages.
inline constexpr std::string_view kTimestampForms = "YYYY-MM-DD, YYYY-MM-DDThh:mm or YYYY-MM-DDThh:mm:ss";

// The time written in `text`, or nothing when the text is not one of the accepted forms.
std::optional<TimePoint> parse_timestamp(std::string_view text);

// (t - run_start) in days, fractional.
double days_since(TimePoint run_start, TimePoint t);

// The time `days` after run_start, rounded to the second.
TimePoint time_after(TimePoint run_start, double days);

// ISO 8601 text of a time, "YYYY-MM-DD" when it falls on midnight, else "YYYY-MM-DDTHH:MM:SS".
std::string format_timestamp(TimePoint t);

}  // namespace wetfront::base
