// The solver's output profiles as the observation library takes them.
#pragma once

#include <span>
#include <vector>

#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/site/sensor_readings.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {

// Pressure head (cm) per output time and cell when `heads`, else water content (cm3/cm3).
observations::SimulatedProfiles simulated_profiles(const solver::ColumnRun& run, bool heads);

// The simulated heads (cm) and water contents (cm3/cm3) the field checks read.
struct SensorProfiles {
  observations::SimulatedProfiles heads;
  observations::SimulatedProfiles water_contents;
};

// Both at every cell, from a run that kept its profiles.
SensorProfiles sensor_profiles(const solver::ColumnRun& run);

// Both, gathered from each profile as the run reaches it, at only the cells that linear
// interpolation between cell centres reads at the given depths (the two centres around each)
// and the first and last cell (the depth range the checks test against). Values at those depths
// are then exactly those from every cell, for a few numbers per output time.
class SensorProfileGatherer {
 public:
  SensorProfileGatherer(std::span<const double> cell_depths_cm, std::span<const double> reading_depths_cm);
  void add(const solver::ProfileSnapshot& snapshot);
  const SensorProfiles& profiles() const { return profiles_; }

 private:
  std::vector<std::size_t> cells_;
  SensorProfiles profiles_;
};

// Every depth a reading of `readings` was taken at, and each sensor's own depth.
std::vector<double> reading_depths(const std::vector<SensorRecord>& readings);

}  // namespace wetfront::site
