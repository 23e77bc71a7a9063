// Depths of water per time interval (rain, irrigation, pan evaporation) and their conversion
// to a piecewise-constant rate in cm/d.
//
// rate on [start, end) = depth / (end - start). A gap (time in the run with no interval, or an
// interval whose depth is missing) is never filled silently: the caller chooses an error, zero
// input, or stopping the run at the start of the first gap.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "wetfront/forcing/step_series.hpp"
#include "wetfront/base/time_point.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

struct DepthInterval {
  double start_day = 0;            // days since run start
  double end_day = 0;              // > start_day
  std::optional<double> depth_cm;  // >= 0; nothing when the record is missing
  int source_line = 0;             // line in the source file, 0 when not from a file
};

struct DepthSeries {
  std::string quantity;                  // "rain", "irrigation", "pan_evaporation", ...
  std::string source_file;               // for messages; may be empty
  base::TimePoint run_start{};           // to print days back as dates in messages
  std::vector<DepthInterval> intervals;  // in time order, not overlapping
};

enum class GapPolicy {
  error,            // any gap is an error naming where it is
  fill_with_zero,   // a gap means no water (no rain fell, no irrigation given)
  stop_run_at_gap,  // the series ends where the first gap begins
};

struct GapReport {
  double start_day = 0;
  double end_day = 0;
};

struct RateConversion {
  CoveredSeries rate_cm_per_day;  // on [0, end_day)
  std::vector<GapReport> gaps;    // gaps found (filled with zero, or the one stopped at)
};

// Checks order, overlap and signs (throws base::InputError naming the line) and converts the series
// to a rate on [0, run_length_days). Intervals partly outside the run are clipped to it.
RateConversion depth_series_to_rate(const DepthSeries& series, double run_length_days, GapPolicy policy);

// Throws base::InputError when intervals are out of order, overlapping, empty, or have negative depth.
void check_depth_series(const DepthSeries& series);

}  // namespace wetfront::forcing
