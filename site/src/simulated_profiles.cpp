#include "wetfront/site/simulated_profiles.hpp"

#include <algorithm>
#include <cmath>

namespace wetfront::site {

observations::SimulatedProfiles simulated_profiles(const solver::ColumnRun& run, bool heads) {
  observations::SimulatedProfiles profiles;
  profiles.depths_cm = run.cell_depths_cm;
  for (const auto& snapshot : run.profiles) {
    profiles.times_day.push_back(snapshot.time_days);
    profiles.values.push_back(heads ? snapshot.head_cm : snapshot.water_content);
  }
  return profiles;
}

SensorProfiles sensor_profiles(const solver::ColumnRun& run) {
  return {simulated_profiles(run, true), simulated_profiles(run, false)};
}

SensorProfileGatherer::SensorProfileGatherer(std::span<const double> cell_depths_cm,
                                             std::span<const double> reading_depths_cm) {
  const std::size_t cells = cell_depths_cm.size();
  if (cells > 0) cells_ = {0, cells - 1};
  for (const double depth : reading_depths_cm) {
    if (!(depth >= cell_depths_cm.front() && depth <= cell_depths_cm.back()) || cells < 2) continue;
    // The bracket observations::simulated_value_at takes: the last centre at or above the depth
    // (the last pair at the deepest centre).
    const auto upper = std::upper_bound(cell_depths_cm.begin(), cell_depths_cm.end(), depth);
    const std::size_t lower =
        upper == cell_depths_cm.end() ? cells - 2 : static_cast<std::size_t>(upper - cell_depths_cm.begin()) - 1;
    cells_.push_back(lower);
    cells_.push_back(lower + 1);
  }
  std::sort(cells_.begin(), cells_.end());
  cells_.erase(std::unique(cells_.begin(), cells_.end()), cells_.end());
  for (const std::size_t cell : cells_) {
    profiles_.heads.depths_cm.push_back(cell_depths_cm[cell]);
    profiles_.water_contents.depths_cm.push_back(cell_depths_cm[cell]);
  }
}

void SensorProfileGatherer::add(const solver::ProfileSnapshot& snapshot) {
  const auto keep = [&](const std::vector<double>& values, observations::SimulatedProfiles& into) {
    into.times_day.push_back(snapshot.time_days);
    std::vector<double>& row = into.values.emplace_back();
    row.reserve(cells_.size());
    for (const std::size_t cell : cells_) row.push_back(values[cell]);
  };
  keep(snapshot.head_cm, profiles_.heads);
  keep(snapshot.water_content, profiles_.water_contents);
}

std::vector<double> reading_depths(const std::vector<SensorRecord>& readings) {
  std::vector<double> depths;
  for (const SensorRecord& record : readings) {
    if (std::isfinite(record.depth_cm)) depths.push_back(record.depth_cm);
    for (const auto& observation : record.series.observations)
      if (std::isfinite(observation.depth_cm)) depths.push_back(observation.depth_cm);
  }
  std::sort(depths.begin(), depths.end());
  depths.erase(std::unique(depths.begin(), depths.end()), depths.end());
  return depths;
}

}  // namespace wetfront::site
