// Water-table fluctuation recharge (Healy & Cook 2002): R = Sy * rise, rises only.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <vector>

#include "wetfront/observations/recharge_estimates.hpp"

namespace wetfront::observations {
namespace {

const std::vector<WaterTableReading> kSeries = {{0, 200}, {10, 180}, {20, 190}, {30, 150}};

void expect_amounts(const std::vector<IntervalRecharge>& rows, const std::vector<double>& amounts_cm) {
  ASSERT_EQ(rows.size(), amounts_cm.size());
  for (std::size_t i = 0; i < rows.size(); ++i) EXPECT_NEAR(rows[i].amount_cm, amounts_cm[i], 1e-12) << "interval " << i;
}

TEST(WaterTableRecharge, PlainRises) {
  // Sy = 0.1. Depth 200 -> 180: rise 20 cm, R = 2.0 cm; 180 -> 190: a fall, R = 0;
  // 190 -> 150: rise 40 cm, R = 4.0 cm. Season 6.0 cm.
  const auto rows = water_table_recharge({0.1, 0.0}, kSeries);
  expect_amounts(rows, {2.0, 0.0, 4.0});
  EXPECT_NEAR(rows[0].mean_flux_cm_per_d, 0.2, 1e-12);
  EXPECT_DOUBLE_EQ(rows[2].start_day, 20.0);
  EXPECT_DOUBLE_EQ(rows[2].end_day, 30.0);
}

TEST(WaterTableRecharge, RiseAgainstTheAntecedentRecession) {
  // Recession 0.5 cm/d: without recharge the table would reach start + 5 cm in 10 days.
  // 200 -> expected 205, found 180: rise 25, R = 2.5 cm
  // 180 -> expected 185, found 190: below the recession, R = 0
  // 190 -> expected 195, found 150: rise 45, R = 4.5 cm
  expect_amounts(water_table_recharge({0.1, 0.5}, kSeries), {2.5, 0.0, 4.5});
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
