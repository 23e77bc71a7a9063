// Water stored in the observed profile, from probe readings at several depths.
//
// Trapezoidal rule over the probe depths (common practice):
//   S = sum_i (theta_i + theta_(i+1)) / 2 * (d_(i+1) - d_i)          [cm of water]
// It covers the layer from the shallowest to the deepest probe only; nothing is extrapolated.
#pragma once

#include <span>
#include <vector>
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

// Throws base::InputError for fewer than two depths, mismatched sizes or depths not
// strictly increasing.
double profile_storage_cm(std::span<const double> depths_cm, std::span<const double> water_content);

struct ProbeProfile {
  double day = 0;                     // days since the run start
  std::vector<double> depths_cm;      // strictly increasing
  std::vector<double> water_content;  // cm3/cm3
};

struct StorageChange {
  double start_day = 0;
  double end_day = 0;
  double start_storage_cm = 0;
  double end_storage_cm = 0;
  double change_cm = 0;  // end minus start; positive when the profile gained water
};

// One row per consecutive pair of visits. Throws base::InputError when visits are not in
// increasing time or use different depths (storages over different layers do not compare).
std::vector<StorageChange> storage_changes(std::span<const ProbeProfile> visits);

}  // namespace wetfront::observations
