#include "wetfront/base/time_point.hpp"

#include <cmath>
#include <sstream>

namespace wetfront::base {

namespace {
template <class Duration>
bool parse_whole(std::string_view text, const char* format, date::sys_time<Duration>& out) {
  std::istringstream in{std::string(text)};
  in >> date::parse(format, out);
  return !in.fail() && in.peek() == std::char_traits<char>::eof();
}
}  // namespace

std::optional<TimePoint> parse_timestamp(std::string_view text) {
  std::string s(text);
  if (s.size() > 10 && s[10] == ' ') s[10] = 'T';
  if (s.size() == 10) {
    date::sys_days day;
    if (parse_whole(s, "%Y-%m-%d", day)) return TimePoint{day};
    return std::nullopt;
  }
  // date::parse accepts fewer digits than the ISO form; insist on the exact lengths.
  if (s.size() != 16 && s.size() != 19) return std::nullopt;
  TimePoint t;
  const char* format = s.size() == 16 ? "%Y-%m-%dT%H:%M" : "%Y-%m-%dT%H:%M:%S";
  if (parse_whole(s, format, t)) return t;
  return std::nullopt;
}

double days_since(TimePoint run_start, TimePoint t) {
  return std::chrono::duration<double, std::ratio<86400>>(t - run_start).count();
}

TimePoint time_after(TimePoint run_start, double days) {
  return run_start + std::chrono::seconds(std::llround(days * 86400.0));
}

std::string format_timestamp(TimePoint t) {
  const auto day = date::floor<date::days>(t);
  if (t == day) return date::format("%Y-%m-%d", day);
  return date::format("%Y-%m-%dT%H:%M:%S", t);
}

}  // namespace wetfront::base
