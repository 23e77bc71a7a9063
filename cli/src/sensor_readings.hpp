// Sensor readings files named in [[sensors]]: read, checked and converted to the quantity the
// model gives at the sensor (pressure head at a tensiometer cup, water content at a probe).
//
// Layout (docs/site-file.md, "Sensor readings files"): comment lines start with '#'; the
// header has a `time` column (ISO 8601 date or date-time, increasing) and one reading column
// with its unit:
//   tensiometer:          `tension` in kPa, cbar, centibar, hPa, mbar, mm, cm or m (of water)
//   water content probe:  `water content` in %, cm3/cm3 or m3/m3, or `permittivity`
//                         (apparent relative permittivity, no unit; Topp et al. 1980)
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "site_file.hpp"
#include "wetfront/observations/observation.hpp"

namespace wetfront::cli {

struct SensorRecord {
  std::string name;
  std::string kind;                    // "tensiometer" or "water content probe"
  double depth_cm = 0;
  std::string quantity;                // "pressure head" or "water content"
  std::string unit;                    // internal unit of the values: "cm" or "cm3/cm3"
  std::string file;                    // the readings file, for messages
  observations::SensorSeries series;   // one observation per reading, converted
  std::vector<std::size_t> lines;      // file line of each reading
  int beyond_working_limit = 0;        // tensiometer readings marked unreliable
  double working_limit_kpa = 0;        // tensiometers only
};

// Reads every sensor's file. Throws InputError naming the file, line and column for a
// missing column, a unit that does not fit, a time that does not parse or does not increase,
// or a reading that is not a number (or a permittivity below 1).
std::vector<SensorRecord> read_sensor_readings(const SiteSetup& site);

}  // namespace wetfront::cli
