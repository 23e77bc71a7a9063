// Darcy flux from a tensiometer pair.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <vector>

#include "wetfront/observations/recharge_estimates.hpp"

namespace wetfront::observations {
namespace {

soils::GardnerExponential gardner(double ks_cm_per_d, double a_per_cm) { return {0.05, 0.40, a_per_cm, ks_cm_per_d}; }

TEST(DarcyFlux, SteadyGardnerProfileGivesBackTheFlux) {
  // Steady downward flux q above a water table in a Gardner (1958) soil, K = Ks exp(a h).
  // With z upward from the table (h = 0 there), q = K (dh/dz + 1) and dK/dz = a K dh/dz give
  // dK/dz = a (q - K), so K*(z) = q* - (q* - 1) exp(-a z) with K* = K/Ks, q* = q/Ks, and
  // h(z) = ln(K*(z)) / a. (Derived here; common practice for the Gardner soil.)
  const double ks = 25.0, a = 0.02, q = 0.5, table_depth = 400.0;
  const double q_star = q / ks;
  auto head_at_depth = [&](double depth_cm) {
    const double z = table_depth - depth_cm;
    return std::log(q_star - (q_star - 1.0) * std::exp(-a * z)) / a;
  };
  // Pair at 250 and 280 cm: h = -133.83 and -110.86 cm, so the head gradient (0.766) and
  // gravity both matter; the finite difference and K at the mean head give 0.5071 cm/d.
  const double upper = 250.0, lower = 280.0;
  const double estimate = darcy_flux_cm_per_d(gardner(ks, a), upper, head_at_depth(upper), lower, head_at_depth(lower));
  EXPECT_NEAR(estimate, q, 0.02 * q);
  EXPECT_GT(estimate, 0.0);
}

TEST(DarcyFlux, SignFollowsTheTotalHead) {
  const auto soil = gardner(10.0, 0.01);
  // Equal heads: unit gradient, q = K(-100) = 10 exp(-1) = 3.678794 cm/d downward.
  EXPECT_NEAR(darcy_flux_cm_per_d(soil, 100, -100, 130, -100), 10 * std::exp(-1.0), 1e-12);
  // Drier above by more than the spacing: water moves up.
  // q = 10 exp(-0.015 * 100) (1 - (-100 - -200)/30) = 2.231302 * (1 - 3.3333) = -5.206370
  EXPECT_NEAR(darcy_flux_cm_per_d(soil, 100, -200, 130, -100), 10 * std::exp(-1.5) * (1 - 100.0 / 30.0), 1e-12);
  EXPECT_LT(darcy_flux_cm_per_d(soil, 100, -200, 130, -100), 0.0);
  EXPECT_THROW(darcy_flux_cm_per_d(soil, 130, -100, 100, -100), wetfront::base::InputError);
}

TEST(DarcyRecharge, IntervalTakesTheMeanOfTheEndFluxes) {
  // Gardner Ks = 10 cm/d, a = 0.01 /cm; cups at 100 and 130 cm.
  // Day 0: heads -100, -100: q0 = 10 exp(-1) * 1 = 3.678794 cm/d
  // Day 2: heads -50, -80: mean -65, K = 10 exp(-0.65) = 5.220458; gradient -30/30 = -1,
  //        q2 = 5.220458 * 2 = 10.440916 cm/d
  // Interval: (3.678794 + 10.440916) / 2 = 7.059855 cm/d; over 2 days 14.119710 cm
  const TensiometerPair pair{gardner(10.0, 0.01), 100.0, 130.0};
  const std::vector<PairHeads> visits = {{0.0, -100, -100}, {2.0, -50, -80}};
  const auto rows = darcy_recharge(pair, visits);
  ASSERT_EQ(rows.size(), 1u);
  EXPECT_DOUBLE_EQ(rows[0].start_day, 0.0);
  EXPECT_DOUBLE_EQ(rows[0].end_day, 2.0);
  EXPECT_NEAR(rows[0].mean_flux_cm_per_d, 7.059855, 1e-6);
  EXPECT_NEAR(rows[0].amount_cm, 14.119710, 1e-6);

  const std::vector<PairHeads> backwards = {{2.0, -100, -100}, {1.0, -50, -80}};
  EXPECT_THROW(darcy_recharge(pair, backwards), wetfront::base::InputError);
}

}  // namespace
}  // namespace wetfront::observations
