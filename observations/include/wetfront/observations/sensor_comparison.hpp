// Observed series against simulated profiles: fit metrics per sensor and over all sensors.
#pragma once

#include <span>
#include <string>
#include <vector>

#include "wetfront/observations/fit_metrics.hpp"
#include "wetfront/observations/observation.hpp"
#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

struct ComparisonOptions {
  bool include_unreliable = false;  // by default readings marked unreliable are left out
};

struct SensorFit {
  std::string name;
  FitMetrics metrics;
  // Each left-out reading is counted once, under the first reason in this order: outside the
  // simulated times, outside the simulated depths, marked unreliable.
  int unreliable_left_out = 0;
  int outside_simulation = 0;  // observation times the profiles do not cover
  int outside_depth = 0;       // within the times, at a depth the profiles do not cover
};

struct ComparisonReport {
  std::vector<SensorFit> sensors;
  FitMetrics overall;  // all used pairs of all sensors pooled
  int unreliable_left_out = 0;
  int outside_simulation = 0;
  int outside_depth = 0;
};

// Throws base::InputError when the profiles fail check_profiles.
ComparisonReport compare_with_simulation(std::span<const SensorSeries> sensors, const SimulatedProfiles& profiles,
                                         ComparisonOptions options = {});

}  // namespace wetfront::observations
