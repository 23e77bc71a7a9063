// What `wetfront run` set beside the model from field data alone, kept in the run file so that
// `wetfront show` can print it again (groups /recharge_estimates and /stored_water,
// docs/hdf5-layout.md): per visit interval the Darcy estimate from a tensiometer pair and the
// water-table-fluctuation estimate from a well, and the water stored over the probe depths.
//
// Units: cm of water, days since the run start; amounts positive downward. Vectors marked
// [interval] have one entry per row of RunRecord::visit_balance; NaN marks a missing value.
#pragma once

#include <string>
#include <vector>

namespace wetfront::profiles {

// Darcy flux from a tensiometer pair below the roots, averaged over each visit interval.
struct DarcyEstimateRecord {
  std::string upper_sensor, lower_sensor;
  double upper_depth_cm = 0, lower_depth_cm = 0;
  std::string conductivity_note;       // which layer's hydraulic model gives K
  std::vector<double> amount_cm;       // [interval]; NaN without an estimate
  std::vector<std::string> agreement;  // [interval]: "agree", "differ" or "no estimate"
  std::vector<std::string> missing;    // [interval]: why there is no estimate, else empty
};

// Water-table fluctuation (Healy & Cook 2002): specific yield x rise of the water table.
struct WaterTableEstimateRecord {
  std::string well;
  double specific_yield = 0;           // 1
  double recession_cm_per_d = 0;       // antecedent fall rate without recharge
  std::string specific_yield_note;     // where the specific yield comes from
  std::vector<double> start_depth_cm;  // [interval]: water-table depth read at its start; NaN: none
  std::vector<double> end_depth_cm;    // [interval]: at its end
  std::vector<double> amount_cm;       // [interval]; NaN without an estimate
  std::vector<std::string> agreement;  // [interval]: against the model's drainage
  std::vector<std::string> missing;    // [interval]
};

// Water stored between the shallowest and the deepest water-content depth (trapezoid over
// depth), from the readings and from the model, at the run start and every interval end.
struct StoredWaterRecord {
  std::vector<double> depths_cm;            // increasing
  std::vector<std::string> sources;         // probes (and core samples) that give the readings
  std::vector<double> visit_days;           // [interval + 1]
  std::vector<double> observed_cm;          // [interval + 1]; NaN where a depth has no reading
  std::vector<double> simulated_cm;         // [interval + 1]
  std::vector<double> observed_change_cm;   // [interval]: end minus start; NaN without both ends
  std::vector<double> simulated_change_cm;  // [interval]
};

}  // namespace wetfront::profiles
