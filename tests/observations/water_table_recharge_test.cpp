// Water-table fluctuation recharge (Healy & Cook 2002): R = Sy * rise, rises only.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <vector>

#include "wetfront/observations/recharge_estimates.hpp"

namespace wetfront::observations {
namespace {

const std::vector<WaterTableReading> kSeries = {{0, 200}, {10, 180}, {20, 190}, {30, 150}};

TEST(WaterTableRecharge, PlainRises) {
  // Sy = 0.1. Depth 200 -> 180: rise 20 cm, R = 2.0 cm; 180 -> 190: a fall, R = 0;
  // 190 -> 150: rise 40 cm, R = 4.0 cm. Season 6.0 cm.
  const auto rows = water_table_recharge({0.1, 0.0}, kSeries);
  ASSERT_EQ(rows.size(), 3u);
  EXPECT_NEAR(rows[0].amount_cm, 2.0, 1e-12);
  EXPECT_NEAR(rows[1].amount_cm, 0.0, 1e-12);
  EXPECT_NEAR(rows[2].amount_cm, 4.0, 1e-12);
  EXPECT_NEAR(rows[0].mean_flux_cm_per_d, 0.2, 1e-12);
  EXPECT_DOUBLE_EQ(rows[2].start_day, 20.0);
  EXPECT_DOUBLE_EQ(rows[2].end_day, 30.0);
}

TEST(WaterTableRecharge, RiseAgainstTheAntecedentRecession) {
  // Recession 0.5 cm/d: without recharge the table would reach start + 5 cm in 10 days.
  // 200 -> expected 205, found 180: rise 25, R = 2.5 cm
  // 180 -> expected 185, found 190: below the recession, R = 0
  // 190 -> expected 195, found 150: rise 45, R = 4.5 cm
  const auto rows = water_table_recharge({0.1, 0.5}, kSeries);
  ASSERT_EQ(rows.size(), 3u);
  EXPECT_NEAR(rows[0].amount_cm, 2.5, 1e-12);
  EXPECT_NEAR(rows[1].amount_cm, 0.0, 1e-12);
  EXPECT_NEAR(rows[2].amount_cm, 4.5, 1e-12);
}

TEST(WaterTableRecharge, RejectsBadInput) {
  EXPECT_THROW(water_table_recharge({0.0, 0.0}, kSeries), wetfront::base::InputError);
  EXPECT_THROW(water_table_recharge({1.2, 0.0}, kSeries), wetfront::base::InputError);
  EXPECT_THROW(water_table_recharge({0.1, -1.0}, kSeries), wetfront::base::InputError);
  const std::vector<WaterTableReading> repeated = {{0, 200}, {0, 190}};
  EXPECT_THROW(water_table_recharge({0.1, 0.0}, repeated), wetfront::base::InputError);
}

}  // namespace
}  // namespace wetfront::observations
