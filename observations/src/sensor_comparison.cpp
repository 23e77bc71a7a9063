// Pairs each usable observation with the simulated value at its time and depth.
#include "wetfront/observations/sensor_comparison.hpp"

namespace wetfront::observations {

ComparisonReport compare_with_simulation(std::span<const SensorSeries> sensors, const SimulatedProfiles& profiles,
                                         ComparisonOptions options) {
  check_profiles(profiles);
  ComparisonReport report;
  std::vector<double> all_simulated, all_observed;
  for (const SensorSeries& sensor : sensors) {
    SensorFit fit;
    fit.name = sensor.name;
    std::vector<double> simulated, observed;
    for (const Observation& obs : sensor.observations) {
      // Outside the run first: such a reading could not be compared whatever its quality.
      if (!(obs.day >= profiles.times_day.front() && obs.day <= profiles.times_day.back())) {
        ++fit.outside_simulation;
        continue;
      }
      const auto value = simulated_value_at(profiles, obs.day, obs.depth_cm);
      if (!value) {
        ++fit.outside_depth;
        continue;
      }
      if (!obs.reliable && !options.include_unreliable) {
        ++fit.unreliable_left_out;
        continue;
      }
      simulated.push_back(*value);
      observed.push_back(obs.value);
    }
    fit.metrics = fit_metrics(simulated, observed);
    all_simulated.insert(all_simulated.end(), simulated.begin(), simulated.end());
    all_observed.insert(all_observed.end(), observed.begin(), observed.end());
    report.unreliable_left_out += fit.unreliable_left_out;
    report.outside_simulation += fit.outside_simulation;
    report.outside_depth += fit.outside_depth;
    report.sensors.push_back(std::move(fit));
  }
  report.overall = fit_metrics(all_simulated, all_observed);
  return report;
}

}  // namespace wetfront::observations
