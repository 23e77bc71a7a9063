// Class A pan water balance between hook-gauge readings:
//   E = (level_start - level_end) + P_caught
// with a refill splitting the record into separate intervals.
#include "wetfront/forcing/pan_gauge.hpp"

#include <cmath>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

namespace {

std::string_view kind_name(PanReadingKind k) {
  switch (k) {
    case PanReadingKind::reading: return "reading";
    case PanReadingKind::before_refill: return "before_refill";
    case PanReadingKind::after_refill: return "after_refill";
  }
  return "?";
}

bool in_operating_range(double level_mm, const PanGeometry& g) {
  return level_mm <= g.rim_height_mm - g.operating_top_below_rim_mm &&
         level_mm >= g.rim_height_mm - g.operating_bottom_below_rim_mm;
}

}  // namespace

std::vector<PanInterval> pan_intervals_from_readings(std::span<const PanReading> readings, const PanGeometry& g,
                                                     const std::string& file) {
  if (!(g.rim_height_mm > 0) || !(g.operating_top_below_rim_mm >= 0) ||
      !(g.operating_bottom_below_rim_mm > g.operating_top_below_rim_mm) ||
      !(g.operating_bottom_below_rim_mm < g.rim_height_mm))
    throw base::InputError(
        fmt::format("pan geometry: expected rim height > 0 and 0 <= operating top < operating bottom < rim height "
                    "(got rim {:g} mm, top {:g} mm and bottom {:g} mm below the rim)",
                    g.rim_height_mm, g.operating_top_below_rim_mm, g.operating_bottom_below_rim_mm));

  for (const auto& r : readings) {
    if (!std::isfinite(r.time_day)) throw base::InputError(file, r.source_line, "time", "time must be finite");
    if (!std::isfinite(r.level_mm) || r.level_mm < 0 || r.level_mm > g.rim_height_mm)
      throw base::InputError(
          file, r.source_line, "level",
          fmt::format("water level {:g} mm is outside the pan; expected 0 to {:g} mm above the pan floor", r.level_mm,
                      g.rim_height_mm));
    if (!std::isfinite(r.rain_since_previous_mm) || r.rain_since_previous_mm < 0)
      throw base::InputError(
          file, r.source_line, "rain",
          fmt::format("rain {:g} mm is negative or not a number; expected a depth >= 0", r.rain_since_previous_mm));
  }

  std::vector<PanInterval> intervals;
  if (readings.empty()) return intervals;
  if (readings.front().kind == PanReadingKind::before_refill)
    throw base::InputError(
        file, readings.front().source_line, "event",
        "the record starts with before_refill; expected the first reading to be 'reading' or 'after_refill'");

  const PanReading* open = &readings.front();  // the reading that starts the current interval
  for (std::size_t i = 1; i < readings.size(); ++i) {
    const PanReading& r = readings[i];
    const PanReading& previous = readings[i - 1];
    if (previous.kind == PanReadingKind::before_refill) {
      if (r.kind != PanReadingKind::after_refill)
        throw base::InputError(
            file, r.source_line, "event",
            fmt::format("'{}' follows before_refill (line {}); expected the after_refill reading next",
                        kind_name(r.kind), previous.source_line));
      if (r.time_day < previous.time_day)
        throw base::InputError(file, r.source_line, "time", "after_refill is earlier than its before_refill reading");
      if (r.rain_since_previous_mm > 0)
        throw base::InputError(file, r.source_line, "rain",
                               "after_refill carries rain; rain belongs on the reading that closes an interval, "
                               "expected 0 or empty here");
      open = &r;
      continue;
    }
    if (r.kind == PanReadingKind::after_refill)
      throw base::InputError(
          file, r.source_line, "event",
          fmt::format("after_refill follows '{}' (line {}); expected a before_refill reading just before it",
                      kind_name(previous.kind), previous.source_line));
    if (!(r.time_day > open->time_day))
      throw base::InputError(
          file, r.source_line, "time",
          fmt::format("reading is not later than the previous one (line {}); expected times to increase",
                      open->source_line));

    PanInterval iv;
    iv.start_day = open->time_day;
    iv.end_day = r.time_day;
    iv.level_fall_mm = open->level_mm - r.level_mm;
    iv.rain_mm = r.rain_since_previous_mm;
    iv.evaporation_mm = iv.level_fall_mm + iv.rain_mm;
    iv.overflow_possible = open->level_mm + iv.rain_mm > g.rim_height_mm;
    iv.outside_operating_range = !in_operating_range(open->level_mm, g) || !in_operating_range(r.level_mm, g);
    iv.level_rose_beyond_rain = iv.evaporation_mm < 0;
    const double days = iv.end_day - iv.start_day;
    // Rain only raises the level and a spill loses at most the rain, so the fall alone is bounded
    // by evaporation.
    if (iv.level_fall_mm > kMaxPanEvaporation_mm_per_day * days + kPanReadingTolerance_mm)
      throw base::InputError(
          file, r.source_line, "level",
          fmt::format("the level fell {:g} mm since line {}, {:.1f} mm/d over {:.2f} d: faster than a pan evaporates "
                      "(at most {:g} mm/d); a leak, a refill without before_refill/after_refill rows, or a misread "
                      "level",
                      iv.level_fall_mm, open->source_line, iv.level_fall_mm / days, days,
                      kMaxPanEvaporation_mm_per_day));
    iv.starts_at_refill = open->kind == PanReadingKind::after_refill;
    iv.start_line = open->source_line;
    iv.end_line = r.source_line;
    intervals.push_back(iv);
    open = &r;
  }
  if (readings.back().kind == PanReadingKind::before_refill)
    throw base::InputError(file, readings.back().source_line, "event",
                           "the record ends with before_refill; expected the after_refill reading to follow");
  return intervals;
}

DepthSeries pan_evaporation_depths(std::span<const PanInterval> intervals, const PanIntervalUse& use,
                                   base::TimePoint run_start, const std::string& file) {
  DepthSeries out;
  out.quantity = "pan evaporation";
  out.source_file = file;
  out.run_start = run_start;
  for (std::size_t i = 0; i < intervals.size(); ++i) {
    const PanInterval& iv = intervals[i];
    const double start = (iv.starts_at_refill && i > 0) ? intervals[i - 1].end_day : iv.start_day;
    DepthInterval d{start, iv.end_day, iv.evaporation_mm / 10.0, iv.end_line};
    auto apply = [&](bool flagged, PanIntervalUse::Flagged choice, const char* what) {
      if (!flagged) return;
      if (choice == PanIntervalUse::Flagged::error)
        throw base::InputError(file, iv.end_line, "",
                               fmt::format("pan interval from {} to {} (lines {} to {}): {}; "
                                           "expected a clean interval, or choose to use it or treat it as missing",
                                           base::format_timestamp(base::time_after(run_start, iv.start_day)),
                                           base::format_timestamp(base::time_after(run_start, iv.end_day)),
                                           iv.start_line, iv.end_line, what));
      if (choice == PanIntervalUse::Flagged::treat_as_missing) d.depth_cm.reset();
    };
    apply(iv.overflow_possible, use.overflow, "rain may have made the pan overflow");
    apply(iv.outside_operating_range, use.outside_operating_range, "water level outside the operating range");
    apply(
        iv.level_rose_beyond_rain, use.level_rose_beyond_rain,
        fmt::format("level rose {:g} mm more than the rain caught (negative evaporation)", -iv.evaporation_mm).c_str());
    if (d.depth_cm && *d.depth_cm < 0)
      throw base::InputError(
          file, iv.end_line, "",
          "negative pan evaporation cannot be used as a depth; choose to treat such intervals as missing");
    out.intervals.push_back(d);
  }
  return out;
}

}  // namespace wetfront::forcing
