// Simulated values at observation times and depths, from output profiles given as plain
// vectors, by linear interpolation in depth (between cell centres) and then in time (between
// output profiles).
//
// Time interpolation is exact only at output times. The run should therefore list every
// observation time among its output times; the integrator's dense output then gives the
// state there to the integration tolerance, and the linear step in time does nothing.
// Between output times the linear step misses any curvature of the state in time.
// The grid puts cell faces on sensor depths, so a sensor lies between two cell centres and
// the depth interpolation is between those two.
#pragma once

#include <optional>
#include <vector>
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

struct SimulatedProfiles {
  std::vector<double> times_day;            // strictly increasing
  std::vector<double> depths_cm;            // cell centres, strictly increasing, positive down
  std::vector<std::vector<double>> values;  // values[time index][depth index]
};

// Throws base::InputError when the sizes disagree, an axis is empty or not increasing.
void check_profiles(const SimulatedProfiles& profiles);

// The value at (day, depth); nullopt outside [first, last] time or [first, last] centre depth
// (for example after the end of an incomplete run). Assumes check_profiles passed.
std::optional<double> simulated_value_at(const SimulatedProfiles& profiles, double day, double depth_cm);

}  // namespace wetfront::observations
