// The readings of each visit, for the analysis of an anchored season (anchored_season.hpp).
#pragma once

#include <cstddef>
#include <vector>

#include "wetfront/site/anchored_season.hpp"

namespace wetfront::site::detail {

struct ReadingsAtVisit {
  std::size_t visit = 0;  // index into the visit days given
  std::vector<VisitReading> readings;
};

// The compared readings (fit_readings.hpp) grouped by the visit nearest to each, if that lies
// within kVisitReadingWindowDays; readings above the shallowest or below the deepest cell centre
// cannot be compared. Visits without readings are left out; `unused` counts the readings
// no visit takes.
std::vector<ReadingsAtVisit> readings_by_visit(const std::vector<SensorRecord>& sensors,
                                               const std::vector<double>& visit_days, const FitWeights& weights,
                                               double end_day, const std::vector<double>& cell_centres_cm,
                                               std::size_t& unused);

}  // namespace wetfront::site::detail
