// One observed value at a time and depth, in the units of the quantity compared
// (pressure head in cm of water, or water content as a volume fraction).
#pragma once

#include <string>
#include <vector>

namespace wetfront::observations {

struct Observation {
  double day = 0;        // days since the run start
  double depth_cm = 0;   // positive downward from the soil surface
  double value = 0;      // cm of water (head) or cm3/cm3 (water content)
  bool reliable = true;  // false: kept for the record, left out of fit statistics by default
};

// The readings of one sensor (one tensiometer or one probe depth), named for reports.
struct SensorSeries {
  std::string name;
  std::vector<Observation> observations;
};

}  // namespace wetfront::observations
