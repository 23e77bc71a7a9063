// Sensor readings files named in [[sensors]]: read, checked and converted to the quantity the
// model gives at the sensor (pressure head at a tensiometer cup, water content at a probe).
//
// Layout (docs/site-file.md, "Sensor readings files"): comment lines start with '#'; the
// header has a `time` column (ISO 8601 date or date-time, increasing) and one reading column
// with its unit:
//   tensiometer:          `tension` in kPa, cbar, centibar, hPa, mbar, mm, cm or m (of water)
//   water content probe:  `water content` in %, cm3/cm3 or m3/m3, or `permittivity`
//                         (apparent relative permittivity, no unit; Topp et al. 1980)
//   observation well:     `depth to water` in mm, cm or m below the ground surface
//   core samples:         `depth` (mm, cm, m) and either `water content` (%, cm3/cm3, m3/m3)
//                         or `wet mass`, `dry mass` (g, kg), `ring volume` (cm3, mL) and an
//                         optional `tare mass` (g, kg) weighed with them (oven-dried cores)
#pragma once

#include <cmath>
#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

#include "wetfront/site/site_file.hpp"
#include "wetfront/observations/observation.hpp"

namespace wetfront::site {

// The kinds of [[sensors]] entry and the quantities their readings give.
inline constexpr std::string_view kTensiometer = "tensiometer";
inline constexpr std::string_view kWaterContentProbe = "water content probe";
inline constexpr std::string_view kObservationWell = "observation well";
inline constexpr std::string_view kCoreSamples = "core samples";
inline constexpr std::string_view kPressureHead = "pressure head";
inline constexpr std::string_view kWaterContent = "water content";
inline constexpr std::string_view kWaterTableDepth = "water-table depth";

struct SensorRecord {
  std::string name;
  std::string kind;      // one of the kinds above
  double depth_cm = 0;   // 0 for a well and for core samples (each reading has its depth)
  std::string quantity;  // "pressure head", "water content" or "water-table depth"
  std::string unit;      // internal unit of the values: "cm" or "cm3/cm3"
  std::string file;      // the readings file, for messages
  // One observation per reading, converted. A well's value and depth are both the depth of the
  // water table below the surface; a core's depth is its sampling depth.
  observations::SensorSeries series;
  std::vector<std::size_t> lines;  // file line of each reading
  int beyond_working_limit = 0;    // tensiometer readings marked unreliable
  double working_limit_kpa = 0;    // tensiometers only
};

// Reads every sensor's file. Throws base::InputError naming the file, line and column for a
// missing column, a unit that does not fit, a time that does not parse or does not increase,
// or a reading that is not a number (or a permittivity below 1).
std::vector<SensorRecord> read_sensor_readings(const SiteSetup& site);

// The readers for one observation well and one core-samples file (well_core_readings.cpp).
// Core times must not decrease (several cores share a visit time). Core depths are rounded to
// kCoreDepthStepCm and must lie within the column (0 < depth <= column_depth_cm).
SensorRecord read_well_levels(const SensorSetup& well, base::TimePoint run_start);
SensorRecord read_core_samples(const SensorSetup& cores, base::TimePoint run_start, double column_depth_cm);

// Sensor and core depths closer than this are the same depth (a depth in m or mm converted to
// cm carries binary rounding, 0.55 m -> 55.00000000000001 cm).
inline constexpr double kCoreDepthStepCm = 1e-6;  // must stay 1e-6: well_core_readings.cpp rounds to it
inline bool same_depth(double a_cm, double b_cm) { return std::abs(a_cm - b_cm) <= kCoreDepthStepCm; }

}  // namespace wetfront::site
