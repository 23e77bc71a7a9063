// Depth per interval -> rate: q = depth / duration on each interval, in cm/d.
#include "wetfront/forcing/depth_series.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

namespace {

// Times are read to the second; one millisecond is well below any meaningful difference.
constexpr double time_tolerance_days = 1e-8;

std::string when(const DepthSeries& s, double day) {
  return fmt::format("{} (day {:g})", base::format_timestamp(base::time_after(s.run_start, day)), day);
}

// An input error at a line of the series' file.
base::InputError error_at_line(const DepthSeries& s, int line, const std::string& problem) {
  return base::InputError(s.source_file, static_cast<std::size_t>(std::max(line, 0)), "", problem);
}

}  // namespace

void check_depth_series(const DepthSeries& s) {
  for (std::size_t i = 0; i < s.intervals.size(); ++i) {
    const auto& r = s.intervals[i];
    if (!std::isfinite(r.start_day) || !std::isfinite(r.end_day))
      throw error_at_line(s, r.source_line, fmt::format("{}: interval times must be finite", s.quantity));
    if (!(r.end_day > r.start_day))
      throw error_at_line(
          s, r.source_line,
          fmt::format("{}: interval ends at {} which is not after its start {}; expected end after start", s.quantity,
                      when(s, r.end_day), when(s, r.start_day)));
    if (r.depth_cm && (!std::isfinite(*r.depth_cm) || *r.depth_cm < 0))
      throw error_at_line(
          s, r.source_line,
          fmt::format("{}: depth {:g} cm is negative or not a number; expected a depth >= 0", s.quantity, *r.depth_cm));
    if (i > 0 && r.start_day < s.intervals[i - 1].end_day - time_tolerance_days)
      throw error_at_line(
          s, r.source_line,
          fmt::format("{}: interval starting {} overlaps or comes before the previous one (line {}, ending {}); "
                      "expected intervals in time order without overlap",
                      s.quantity, when(s, r.start_day), s.intervals[i - 1].source_line,
                      when(s, s.intervals[i - 1].end_day)));
  }
}

RateConversion depth_series_to_rate(const DepthSeries& s, double run_length_days, GapPolicy policy) {
  check_depth_series(s);
  if (!(run_length_days > 0)) throw base::InputError("depth_series_to_rate: run length must be positive");

  RateConversion out;
  std::vector<double> starts;
  std::vector<double> rates;
  auto add = [&](double from, double rate) {
    if (!starts.empty() && from <= starts.back() + time_tolerance_days) {
      rates.back() = rate;  // zero-length piece replaced
      return;
    }
    starts.push_back(from);
    rates.push_back(rate);
  };

  double t = 0;  // covered up to here
  bool stopped = false;
  // Handles a gap [from, to); returns false when the series stops there.
  auto gap = [&](double from, double to, int line, const char* what) {
    if (policy == GapPolicy::error)
      throw error_at_line(s, line,
                          fmt::format("{}: {} from {} to {}; the run needs {} for every interval "
                                      "(or choose to fill gaps with zero or to stop the run at the first gap)",
                                      s.quantity, what, when(s, from), when(s, to), s.quantity));
    out.gaps.push_back({from, to});
    if (policy == GapPolicy::stop_run_at_gap) {
      stopped = true;
      return false;
    }
    add(from, 0.0);
    t = to;
    return true;
  };

  for (const auto& r : s.intervals) {
    const double start = std::max(r.start_day, 0.0);
    const double end = std::min(r.end_day, run_length_days);
    if (end <= start + time_tolerance_days) continue;  // outside the run
    if (start > t + time_tolerance_days && !gap(t, start, r.source_line, "no record")) break;
    if (!r.depth_cm) {
      if (!gap(std::max(start, t), end, r.source_line, "missing value")) break;
      continue;
    }
    add(std::max(start, t), *r.depth_cm / (r.end_day - r.start_day));
    t = end;
  }
  if (!stopped && t < run_length_days - time_tolerance_days) {
    const int last_line = s.intervals.empty() ? 0 : s.intervals.back().source_line;
    gap(t, run_length_days, last_line, "no record after the last one");
  }
  if (!stopped)
    t = run_length_days;
  else
    t = out.gaps.back().start_day;

  if (starts.empty()) {
    starts.push_back(0.0);
    rates.push_back(0.0);
  }
  out.rate_cm_per_day = {{std::move(starts), std::move(rates)}, t};
  return out;
}

}  // namespace wetfront::forcing
