// Crop coefficient curve of the FAO-56 single-coefficient method: Allen et al. (1998), FAO
// Irrigation and Drainage Paper 56, Fig. 25 (shape) and eq. 66 (linear interpolation within
// the development and late-season stages). The crop below is invented.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include "wetfront/forcing/crop_coefficient.hpp"

namespace wf = wetfront::forcing;

namespace {
// Planted on day 10; stages 20, 30, 40, 20 days; harvest on day 120.
wf::CropCoefficientCurve invented_crop() { return {{10.0, {20.0, 30.0, 40.0, 20.0}}, 0.30, 1.15, 0.40, 0.10}; }
}  // namespace

TEST(CropCoefficient, StageBoundariesAndMidpoints) {
  const auto c = invented_crop();
  EXPECT_DOUBLE_EQ(wf::crop_coefficient_at(c, 5.0), 0.10);   // before planting: bare soil
  EXPECT_DOUBLE_EQ(wf::crop_coefficient_at(c, 10.0), 0.30);  // planting
  EXPECT_DOUBLE_EQ(wf::crop_coefficient_at(c, 20.0), 0.30);  // middle of the initial stage
  EXPECT_DOUBLE_EQ(wf::crop_coefficient_at(c, 30.0), 0.30);  // start of development
  // Eq. 66 at the middle of development: 0.30 + (15/30)(1.15 - 0.30) = 0.725
  EXPECT_NEAR(wf::crop_coefficient_at(c, 45.0), 0.725, 1e-12);
  EXPECT_NEAR(wf::crop_coefficient_at(c, 60.0), 1.15, 1e-12);  // start of mid-season
  EXPECT_DOUBLE_EQ(wf::crop_coefficient_at(c, 80.0), 1.15);
  EXPECT_DOUBLE_EQ(wf::crop_coefficient_at(c, 100.0), 1.15);  // start of late season
  // Eq. 66 at the middle of the late season: 1.15 + (10/20)(0.40 - 1.15) = 0.775
  EXPECT_NEAR(wf::crop_coefficient_at(c, 110.0), 0.775, 1e-12);
  EXPECT_NEAR(wf::crop_coefficient_at(c, 120.0 - 1e-9), 0.40, 1e-9);  // just before harvest
  EXPECT_DOUBLE_EQ(wf::crop_coefficient_at(c, 120.0), 0.10);          // harvest: bare soil again
}

TEST(CropCoefficient, CurveIsContinuousInsideTheSeason) {
  const auto c = invented_crop();
  for (double b : {30.0, 60.0, 100.0})
    EXPECT_NEAR(wf::crop_coefficient_at(c, b - 1e-9), wf::crop_coefficient_at(c, b + 1e-9), 1e-9) << b;
}

TEST(CropCoefficient, StagesAndChecks) {
  const auto c = invented_crop();
  EXPECT_EQ(wf::growth_stage_at(c.planting_day, c.stages, 9.9), wf::GrowthStage::before_planting);
  EXPECT_EQ(wf::growth_stage_at(c.planting_day, c.stages, 45.0), wf::GrowthStage::development);
  EXPECT_EQ(wf::growth_stage_at(c.planting_day, c.stages, 120.0), wf::GrowthStage::after_harvest);
  auto bad = c;
  bad.stages.mid_season_days = -1;
  EXPECT_THROW(wf::check_crop_curve(bad), wetfront::base::InputError);
  bad = c;
  bad.kc_mid = 3.0;
  EXPECT_THROW(wf::check_crop_curve(bad), wetfront::base::InputError);
  EXPECT_NO_THROW(wf::check_crop_curve(c));
}

TEST(PanToCropFactors, ConstantThroughEachStage) {
  const wf::PanToCropFactors f{{10.0, {20.0, 30.0, 40.0, 20.0}}, 0.35, 0.60, 0.85, 0.55, 0.20};
  EXPECT_DOUBLE_EQ(wf::pan_to_crop_factor_at(f, 0.0), 0.20);
  EXPECT_DOUBLE_EQ(wf::pan_to_crop_factor_at(f, 10.0), 0.35);
  EXPECT_DOUBLE_EQ(wf::pan_to_crop_factor_at(f, 45.0), 0.60);
  EXPECT_DOUBLE_EQ(wf::pan_to_crop_factor_at(f, 60.0), 0.85);
  EXPECT_DOUBLE_EQ(wf::pan_to_crop_factor_at(f, 119.0), 0.55);
  EXPECT_DOUBLE_EQ(wf::pan_to_crop_factor_at(f, 130.0), 0.20);
  auto bad = f;
  bad.mid_season = -0.1;
  EXPECT_THROW(wf::check_pan_to_crop_factors(bad), wetfront::base::InputError);
}
