// Probe readings to water content.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include "wetfront/observations/water_content.hpp"

namespace wetfront::observations {
namespace {

TEST(Topp, PolynomialAtChosenPermittivities) {
  // Topp, Davis & Annan (1980): theta = -5.3e-2 + 2.92e-2 Ka - 5.5e-4 Ka^2 + 4.3e-6 Ka^3
  // Ka = 10: -0.053 + 0.292 - 0.055 + 0.0043  = 0.1883
  // Ka = 20: -0.053 + 0.584 - 0.220 + 0.0344  = 0.3454
  // Ka = 40: -0.053 + 1.168 - 0.880 + 0.2752  = 0.5102
  EXPECT_NEAR(topp_water_content(10.0), 0.1883, 1e-12);
  EXPECT_NEAR(topp_water_content(20.0), 0.3454, 1e-12);
  EXPECT_NEAR(topp_water_content(40.0), 0.5102, 1e-12);
  EXPECT_THROW(topp_water_content(0.5), std::domain_error);
  EXPECT_THROW(topp_water_content(1.5), std::domain_error);    // Topp gives -0.012 (issue 12)
  EXPECT_THROW(topp_water_content(120.0), std::domain_error);  // Topp gives 2.96; above water (88)
  EXPECT_NO_THROW(topp_water_content(80.0));                   // water at 20 degC (common practice)
}

TEST(ProbeConversion, EachKindOfReading) {
  EXPECT_DOUBLE_EQ(water_content_from_probe(ReadsVolumeFraction{}, 0.27), 0.27);
  EXPECT_NEAR(water_content_from_probe(ToppPermittivity{}, 20.0), 0.3454, 1e-12);
  // theta = 0.05 + 0.002 x + 1e-5 x^2 at x = 100: 0.05 + 0.2 + 0.1 = 0.35
  const PolynomialCalibration calibration{{0.05, 0.002, 1e-5}};
  EXPECT_NEAR(water_content_from_probe(calibration, 100.0), 0.35, 1e-12);
  EXPECT_THROW(calibrated_water_content(PolynomialCalibration{}, 1.0), wetfront::base::InputError);
}

}  // namespace
}  // namespace wetfront::observations
