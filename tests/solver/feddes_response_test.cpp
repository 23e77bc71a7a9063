// The Feddes et al. (1978) stress response: its break points, the straight lines between them,
// the demand-dependent dry optimum, and the analytic slope used in the Jacobian.
#include <gtest/gtest.h>

#include <cmath>
#include <limits>
#include <stdexcept>

#include "wetfront/solver/root_uptake.hpp"

namespace wetfront::surface_tests {
namespace {

using solver::FeddesResponse;
using solver::feddes_stress;

// Round break points so that every expected value below is worked by hand.
FeddesResponse hand_response() {
  FeddesResponse p;
  p.too_wet_head_cm = -10.0;
  p.wet_optimum_head_cm = -30.0;
  p.dry_optimum_head_high_demand_cm = -300.0;
  p.dry_optimum_head_low_demand_cm = -700.0;
  p.wilting_head_cm = -10300.0;
  p.high_demand_cm_per_d = 0.5;
  p.low_demand_cm_per_d = 0.1;
  return p;
}

TEST(FeddesResponse, ZeroAboveTheAnaerobiosisHeadAndBelowWilting) {
  const auto p = hand_response();
  EXPECT_EQ(feddes_stress(p, 0.0, 0.5).value, 0.0);   // saturated
  EXPECT_EQ(feddes_stress(p, 5.0, 0.5).value, 0.0);   // ponded
  EXPECT_EQ(feddes_stress(p, -10.0, 0.5).value, 0.0); // at the too-wet head
  EXPECT_EQ(feddes_stress(p, -10300.0, 0.5).value, 0.0);
  EXPECT_EQ(feddes_stress(p, -20000.0, 0.5).value, 0.0);
  EXPECT_EQ(feddes_stress(p, -20000.0, 0.5).slope_per_cm, 0.0);
  EXPECT_EQ(feddes_stress(p, std::numeric_limits<double>::quiet_NaN(), 0.5).value, 0.0);
}

TEST(FeddesResponse, RisesLinearlyOnTheWetSide) {
  const auto p = hand_response();
  // From 0 at -10 cm to 1 at -30 cm: a quarter of the way at -15, three quarters at -25.
  EXPECT_DOUBLE_EQ(feddes_stress(p, -15.0, 0.5).value, 0.25);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -25.0, 0.5).value, 0.75);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -30.0, 0.5).value, 1.0);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -20.0, 0.5).slope_per_cm, -1.0 / 20.0);
}

TEST(FeddesResponse, OneBetweenTheOptimaAndFallingOnTheDrySide) {
  const auto p = hand_response();
  // High demand: dry optimum -300 cm, wilting -10300 cm, a 10000 cm line.
  EXPECT_EQ(feddes_stress(p, -100.0, 0.6).value, 1.0);
  EXPECT_EQ(feddes_stress(p, -300.0, 0.6).value, 1.0);
  EXPECT_EQ(feddes_stress(p, -100.0, 0.6).slope_per_cm, 0.0);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -2800.0, 0.6).value, 0.75);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -5300.0, 0.6).value, 0.5);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -5300.0, 0.6).slope_per_cm, 1.0 / 10000.0);
  // Low demand: the dry optimum moves to -700 cm, so -500 cm is unstressed.
  EXPECT_EQ(feddes_stress(p, -500.0, 0.05).value, 1.0);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -5500.0, 0.05).value, 0.5);  // (-5500 + 10300) / 9600
}

TEST(FeddesResponse, DryOptimumFollowsTheDemandLinearlyBetweenLowAndHigh) {
  const auto p = hand_response();
  EXPECT_DOUBLE_EQ(solver::dry_optimum_head_cm(p, 0.5), -300.0);
  EXPECT_DOUBLE_EQ(solver::dry_optimum_head_cm(p, 0.9), -300.0);  // held above the high demand
  EXPECT_DOUBLE_EQ(solver::dry_optimum_head_cm(p, 0.1), -700.0);
  EXPECT_DOUBLE_EQ(solver::dry_optimum_head_cm(p, 0.0), -700.0);  // held below the low demand
  EXPECT_DOUBLE_EQ(solver::dry_optimum_head_cm(p, 0.3), -500.0);  // half way
  EXPECT_DOUBLE_EQ(solver::dry_optimum_head_cm(p, 0.2), -600.0);
  // At Tp = 0.3 cm/d: optimum -500 cm, so -400 is unstressed and -5400 is half way to wilting.
  EXPECT_EQ(feddes_stress(p, -400.0, 0.3).value, 1.0);
  EXPECT_DOUBLE_EQ(feddes_stress(p, -5400.0, 0.3).value, 0.5);
}

TEST(FeddesResponse, SlopeMatchesACentralDifferenceInsideEachPiece) {
  const auto p = hand_response();
  for (double tp : {0.05, 0.3, 0.7}) {
    for (double h : {-12.0, -22.0, -29.0, -100.0, -900.0, -4000.0, -10000.0}) {
      const double step = 1e-3;
      const double numeric =
          (feddes_stress(p, h + step, tp).value - feddes_stress(p, h - step, tp).value) / (2 * step);
      EXPECT_NEAR(feddes_stress(p, h, tp).slope_per_cm, numeric, 1e-9) << "h " << h << " Tp " << tp;
    }
  }
}

TEST(FeddesResponse, CropParameterSetsAreOrderedAndRejectsDisorder) {
  for (const auto& crop : {solver::feddes_potatoes(), solver::feddes_sugar_beet(), solver::feddes_wheat(),
                           solver::feddes_grass(), solver::feddes_maize()})
    EXPECT_NO_THROW(solver::check_feddes_response(crop));
  auto bad = hand_response();
  bad.wet_optimum_head_cm = -1000.0;  // drier than the dry optimum
  EXPECT_THROW(solver::check_feddes_response(bad), std::invalid_argument);
  bad = hand_response();
  bad.low_demand_cm_per_d = 0.6;  // above the high demand
  EXPECT_THROW(solver::check_feddes_response(bad), std::invalid_argument);
}

}  // namespace
}  // namespace wetfront::surface_tests
