// Kelvin-equation dry limit: h = R T ln(RH) / (M g).
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <stdexcept>

#include "wetfront/forcing/dry_limit.hpp"

namespace wf = wetfront::forcing;

TEST(DryLimit, KelvinEquationAtTwentyDegrees) {
  // Hand arithmetic from the equation (Kelvin equation as in Hillel 1998, from memory):
  // R T / (M g) at 20 degC = 8.314462618 * 293.15 / (0.01801528 * 9.80665) = 13796.3 m;
  // times ln(0.5) = -0.693147 gives -9562.9 m = -956286 cm.
  EXPECT_NEAR(wf::dry_limit_head_from_humidity(0.5, 20.0), -956286.0, 5.0);
  // RH 0.99: ln(0.99) = -0.0100503 -> -138.65 m = -13865 cm, close to the -15000 cm
  // commonly used as a dry limit (common practice).
  EXPECT_NEAR(wf::dry_limit_head_from_humidity(0.99, 20.0), -13865.0, 2.0);
}

TEST(DryLimit, DrierAndWarmerAirGivesADrierLimit) {
  EXPECT_LT(wf::dry_limit_head_from_humidity(0.3, 20.0), wf::dry_limit_head_from_humidity(0.6, 20.0));
  EXPECT_LT(wf::dry_limit_head_from_humidity(0.5, 35.0), wf::dry_limit_head_from_humidity(0.5, 5.0));
}

TEST(DryLimit, RefusesImpossibleAir) {
  EXPECT_THROW(wf::dry_limit_head_from_humidity(0.0, 20.0), wetfront::base::InputError);
  EXPECT_THROW(wf::dry_limit_head_from_humidity(1.0, 20.0), wetfront::base::InputError);
  EXPECT_THROW(wf::dry_limit_head_from_humidity(45.0, 20.0), wetfront::base::InputError);  // percent given as a number
  EXPECT_THROW(wf::dry_limit_head_from_humidity(0.5, -300.0), wetfront::base::InputError);
}
