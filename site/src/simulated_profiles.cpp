#include "wetfront/site/simulated_profiles.hpp"

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

}  // namespace wetfront::site
