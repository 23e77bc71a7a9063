// Observed profile storage by the trapezoidal rule and its change between visits.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <vector>

#include "wetfront/observations/profile_storage.hpp"

namespace wetfront::observations {
namespace {

TEST(ProfileStorage, TrapezoidOverProbeDepths) {
  // (0.30 + 0.25)/2 * 20 + (0.25 + 0.20)/2 * 30 = 5.5 + 6.75 = 12.25 cm
  const std::vector<double> depths = {10, 30, 60};
  const std::vector<double> theta = {0.30, 0.25, 0.20};
  EXPECT_NEAR(profile_storage_cm(depths, theta), 12.25, 1e-12);
}

TEST(ProfileStorage, ChangeBetweenVisits) {
  // Visit 2: (0.32 + 0.27)/2 * 20 + (0.27 + 0.20)/2 * 30 = 5.9 + 7.05 = 12.95 cm (+0.70)
  // Visit 3: (0.28 + 0.24)/2 * 20 + (0.24 + 0.21)/2 * 30 = 5.2 + 6.75 = 11.95 cm (-1.00)
  const std::vector<ProbeProfile> visits = {
      {0.0, {10, 30, 60}, {0.30, 0.25, 0.20}},
      {14.0, {10, 30, 60}, {0.32, 0.27, 0.20}},
      {28.0, {10, 30, 60}, {0.28, 0.24, 0.21}},
  };
  const auto rows = storage_changes(visits);
  ASSERT_EQ(rows.size(), 2u);
  EXPECT_DOUBLE_EQ(rows[0].start_day, 0.0);
  EXPECT_DOUBLE_EQ(rows[0].end_day, 14.0);
  EXPECT_NEAR(rows[0].start_storage_cm, 12.25, 1e-12);
  EXPECT_NEAR(rows[0].end_storage_cm, 12.95, 1e-12);
  EXPECT_NEAR(rows[0].change_cm, 0.70, 1e-12);
  EXPECT_NEAR(rows[1].change_cm, -1.00, 1e-12);
}

TEST(ProfileStorage, RejectsBadInput) {
  const std::vector<double> one = {10}, two = {10, 30}, reversed = {30, 10};
  const std::vector<double> theta1 = {0.3}, theta2 = {0.3, 0.2};
  EXPECT_THROW(profile_storage_cm(one, theta1), wetfront::base::InputError);
  EXPECT_THROW(profile_storage_cm(two, theta1), wetfront::base::InputError);
  EXPECT_THROW(profile_storage_cm(reversed, theta2), wetfront::base::InputError);
  const std::vector<ProbeProfile> different_depths = {{0.0, {10, 30}, {0.3, 0.2}}, {7.0, {10, 40}, {0.3, 0.2}}};
  EXPECT_THROW(storage_changes(different_depths), wetfront::base::InputError);
}

}  // namespace
}  // namespace wetfront::observations
