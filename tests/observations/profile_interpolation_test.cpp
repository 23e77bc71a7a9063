// Simulated values at observation times and depths.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include "wetfront/observations/profile_interpolation.hpp"

namespace wetfront::observations {
namespace {

// f(t, d) = 1 + 2 t - 0.5 d + 0.1 t d is bilinear, so linear interpolation in depth and then
// in time reproduces it exactly anywhere inside the grid.
double bilinear(double day, double depth) { return 1 + 2 * day - 0.5 * depth + 0.1 * day * depth; }

SimulatedProfiles sample_profiles() {
  SimulatedProfiles p;
  p.times_day = {0.0, 1.0, 3.0};
  p.depths_cm = {5.0, 15.0, 25.0};
  for (double t : p.times_day) {
    std::vector<double> row;
    for (double d : p.depths_cm) row.push_back(bilinear(t, d));
    p.values.push_back(row);
  }
  return p;
}

TEST(ProfileInterpolation, BilinearFieldIsReproduced) {
  const SimulatedProfiles p = sample_profiles();
  ASSERT_NO_THROW(check_profiles(p));
  for (double day : {0.0, 0.5, 1.0, 2.0, 2.75, 3.0})
    for (double depth : {5.0, 7.5, 15.0, 20.0, 25.0})
      EXPECT_NEAR(*simulated_value_at(p, day, depth), bilinear(day, depth), 1e-12)
          << "day " << day << " depth " << depth;
  // By hand at day 2, depth 10: rows at day 1 and day 3, each halfway between 5 and 15 cm.
  // day 1: (f(1,5) + f(1,15)) / 2 = (1.0 + -3.0) / 2 = -1.0;  day 3: (6.0 + 4.0) / 2 = 5.0
  // halfway in time: (-1.0 + 5.0) / 2 = 2.0
  EXPECT_NEAR(*simulated_value_at(p, 2.0, 10.0), 2.0, 1e-12);
}

TEST(ProfileInterpolation, OutsideTheProfilesGivesNothing) {
  const SimulatedProfiles p = sample_profiles();
  EXPECT_FALSE(simulated_value_at(p, -0.1, 10.0));
  EXPECT_FALSE(simulated_value_at(p, 3.5, 10.0));  // after the end of the run
  EXPECT_FALSE(simulated_value_at(p, 1.0, 2.0));   // above the first cell centre
  EXPECT_FALSE(simulated_value_at(p, 1.0, 26.0));  // below the last cell centre
}

TEST(ProfileInterpolation, MalformedProfilesAreRejected) {
  SimulatedProfiles p = sample_profiles();
  p.values[1].pop_back();
  EXPECT_THROW(check_profiles(p), wetfront::base::InputError);
  p = sample_profiles();
  p.times_day = {0.0, 2.0, 1.0};
  EXPECT_THROW(check_profiles(p), wetfront::base::InputError);
  p = sample_profiles();
  p.values.pop_back();
  EXPECT_THROW(check_profiles(p), wetfront::base::InputError);
}

}  // namespace
}  // namespace wetfront::observations
