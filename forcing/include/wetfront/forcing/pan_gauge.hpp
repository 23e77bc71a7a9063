// Class A pan evaporation from hook-gauge readings of the water level.
//
// Over an interval between two readings with no refill in between, the water balance of the
// pan is
//     evaporation = (level at start - level at end) + rain caught,
// the pan catching rain at its own depth (common practice). A refill (topping up, or bailing
// after heavy rain) is recorded as two readings at the same time, one before and one after;
// the interval before the refill ends at the "before" reading and the next interval starts
// at the "after" reading.
//
// The level is read as the height of the water surface above the floor of the pan, in mm.
// A Class A pan is 254 mm (10 in) deep and is kept with its water surface between about 50
// and 75 mm below the rim (common practice; both configurable).
#pragma once

#include <span>
#include <vector>

#include "wetfront/forcing/depth_series.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

enum class PanReadingKind {
  reading,        // an ordinary reading
  before_refill,  // the last reading before the level was changed by hand
  after_refill,   // the first reading after the level was changed by hand
};

struct PanReading {
  double time_day = 0;                // days since run start
  double level_mm = 0;                // water surface above the pan floor, mm
  double rain_since_previous_mm = 0;  // rain caught since the previous reading, mm, >= 0
  PanReadingKind kind = PanReadingKind::reading;
  int source_line = 0;
};

struct PanGeometry {
  double rim_height_mm = 254.0;                 // depth of the pan, floor to rim
  double operating_top_below_rim_mm = 50.0;     // highest intended water surface
  double operating_bottom_below_rim_mm = 75.0;  // lowest intended water surface
};

struct PanInterval {
  double start_day = 0;
  double end_day = 0;
  double level_fall_mm = 0;              // level at start - level at end
  double rain_mm = 0;                    // rain caught over the interval
  double evaporation_mm = 0;             // level_fall_mm + rain_mm
  bool overflow_possible = false;        // start level + rain above the rim: water may have spilled
  bool outside_operating_range = false;  // start or end level outside the operating band
  bool level_rose_beyond_rain = false;   // evaporation_mm < 0: a reading or the rain is wrong
  bool starts_at_refill = false;         // opened by an after_refill reading
  int start_line = 0;
  int end_line = 0;
};

// Hard limit of Class A pan evaporation: 30 mm/d, about twice the highest daily means reported
// for hot dry climates (common practice), plus kPanReadingTolerance_mm for the gauge readings.
inline constexpr double kMaxPanEvaporation_mm_per_day = 30.0;
inline constexpr double kPanReadingTolerance_mm = 2.0;

// Throws base::InputError (naming the line) when times go backwards, a before_refill reading is not
// followed by its after_refill reading, an after_refill reading has rain, a level or rain
// is negative or non-finite, or the level falls faster than
// kMaxPanEvaporation_mm_per_day (rain only raises it; a leak, a pan emptied without before_refill, a typing error).
std::vector<PanInterval> pan_intervals_from_readings(std::span<const PanReading> readings, const PanGeometry& geometry,
                                                     const std::string& source_file = {});

// What to do with intervals whose result is doubtful.
struct PanIntervalUse {
  enum class Flagged { use, treat_as_missing, error };
  Flagged overflow = Flagged::treat_as_missing;     // evaporation overestimated by the spill
  Flagged outside_operating_range = Flagged::use;   // a quality warning only
  Flagged level_rose_beyond_rain = Flagged::error;  // negative evaporation
};

// Pan evaporation depths per interval, ready for depth_series_to_rate. The minutes spent on a
// refill belong to no interval of readings; the pan still evaporates then, so an interval that
// starts at a refill is taken to start where the previous interval ended.
DepthSeries pan_evaporation_depths(std::span<const PanInterval> intervals, const PanIntervalUse& use,
                                   base::TimePoint run_start, const std::string& source_file = {});

}  // namespace wetfront::forcing
