#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <algorithm>
#include <cmath>

#include "wetfront/forcing/surface_demand.hpp"

namespace wf = wetfront::forcing;

namespace {

// Invented ten-day case. Crop planted on day 2 with stages of 2 days each (harvest day 10):
// Kc 0.2 (bare) on [0,2), 0.4 on [2,4), 0.4 -> 1.2 on [4,6), 1.2 on [6,8), 1.2 -> 0.5 on
// [8,10). Integral of Kc over the run = 0.4 + 0.8 + 1.6 + 2.4 + 1.7 = 6.9 d.
wf::SurfaceDemandInputs invented_inputs() {
  wf::SurfaceDemandInputs in;
  in.run_length_days = 10.0;
  wetfront::base::StepSeries rain{{0, 1, 2, 3, 4, 5, 6, 7, 8, 9}, {0, 0.5, 0, 0, 1.0, 0, 0, 0, 0.2, 0}};
  in.water_inputs.push_back({rain, 10.0});
  wetfront::base::StepSeries irrigation{{0, 3.0, 3.25}, {0, 8.0, 0}};  // 2 cm in 6 hours
  in.water_inputs.push_back({irrigation, 10.0});
  in.pan_evaporation = {wetfront::base::StepSeries::constant(0.5), 10.0};
  in.crop = wf::CropFromReference{0.8, {{2.0, {2.0, 2.0, 2.0, 2.0}}, 0.4, 1.2, 0.5, 0.2}};
  in.split.leaf_area_index = {"leaf area index", {2.0, 6.0, 10.0}, {0.0, 3.0, 1.0}};
  in.root_depth_cm = {"root depth", {2.0, 6.0}, {5.0, 40.0}};
  return in;
}

}  // namespace

TEST(SurfaceDemand, CommonBreakpointsAndConservedTotals) {
  const auto in = invented_inputs();
  const auto d = wf::surface_demand(in);
  EXPECT_DOUBLE_EQ(d.end_day, 10.0);
  const auto& t = d.water_input_cm_per_day.start_days;
  for (const auto* s : {&d.potential_evaporation_cm_per_day, &d.potential_transpiration_cm_per_day, &d.root_depth_cm,
                        &d.leaf_area_index})
    EXPECT_EQ(s->start_days, t);
  EXPECT_TRUE(std::find(t.begin(), t.end(), 3.25) != t.end()) << "irrigation end must be a breakpoint";
  for (std::size_t i = 0; i + 1 < t.size(); ++i) EXPECT_LE(t[i + 1] - t[i], 1.0 + 1e-12);

  // Rain 1.7 cm plus irrigation 2.0 cm.
  EXPECT_NEAR(d.water_input_cm_per_day.integral(0, 10), 3.7, 1e-12);
  EXPECT_NEAR(d.water_input_cm_per_day.at(3.1), 8.0, 1e-12);
  // ETc = Kp Epan Kc: 0.8 * 0.5 * 6.9 = 2.76 cm, whatever the split.
  const double et =
      d.potential_evaporation_cm_per_day.integral(0, 10) + d.potential_transpiration_cm_per_day.integral(0, 10);
  EXPECT_NEAR(et, 2.76, 1e-12);
}

TEST(SurfaceDemand, StepValuesFollowTheCurvesAtStepMiddles) {
  const auto d = wf::surface_demand(invented_inputs());
  // Before planting: LAI 0, everything is soil evaporation, ETc = 0.2 * 0.8 * 0.5 = 0.08 cm/d.
  EXPECT_NEAR(d.potential_evaporation_cm_per_day.at(0.5), 0.08, 1e-12);
  EXPECT_DOUBLE_EQ(d.potential_transpiration_cm_per_day.at(0.5), 0.0);
  // Step [4,5): Kc(4.5) = 0.4 + 0.25*0.8 = 0.6, ETc = 0.24 cm/d; LAI(4.5) = 2.5/4 * 3 = 1.875.
  const double lai = 1.875;
  EXPECT_NEAR(d.leaf_area_index.at(4.5), lai, 1e-12);
  EXPECT_NEAR(d.potential_evaporation_cm_per_day.at(4.5), 0.24 * std::exp(-wf::default_extinction_coefficient * lai),
              1e-12);
  EXPECT_NEAR(d.potential_transpiration_cm_per_day.at(4.5),
              0.24 * (1 - std::exp(-wf::default_extinction_coefficient * lai)), 1e-12);
  // Root depth, step [2,3) with middle 2.5: 5 + 0.5/4 * 35 = 9.375 cm; step [3.25,4) (after the
  // irrigation breakpoint) with middle 3.625: 5 + 1.625/4 * 35 = 19.21875 cm.
  EXPECT_NEAR(d.root_depth_cm.at(2.5), 9.375, 1e-12);
  EXPECT_NEAR(d.root_depth_cm.at(3.5), 19.21875, 1e-12);
}

TEST(SurfaceDemand, PanToCropFactorsAndSoilCover) {
  auto in = invented_inputs();
  in.crop = wf::PanToCropFactors{{2.0, {2.0, 2.0, 2.0, 2.0}}, 0.3, 0.6, 0.9, 0.6, 0.25};
  in.split.method = wf::CanopySplit::Method::soil_cover;
  in.split.soil_cover = {"soil cover fraction", {2.0, 6.0}, {0.0, 0.8}};
  const auto d = wf::surface_demand(in);
  // ETc = f Epan: 0.5 * (2*0.25 + 2*0.3 + 2*0.6 + 2*0.9 + 2*0.6) = 2.65 cm.
  const double et =
      d.potential_evaporation_cm_per_day.integral(0, 10) + d.potential_transpiration_cm_per_day.integral(0, 10);
  EXPECT_NEAR(et, 2.65, 1e-12);
  // Mid-season, cover 0.8: Ep = 0.45 * 0.2 = 0.09 cm/d, Tp = 0.36 cm/d.
  EXPECT_NEAR(d.potential_evaporation_cm_per_day.at(7.5), 0.09, 1e-12);
  EXPECT_NEAR(d.potential_transpiration_cm_per_day.at(7.5), 0.36, 1e-12);
}

TEST(SurfaceDemand, EndsWhereAnInputStops) {
  auto in = invented_inputs();
  in.water_inputs[0].end_day = 5.0;  // rain record stopped at a gap on day 5
  const auto d = wf::surface_demand(in);
  EXPECT_DOUBLE_EQ(d.end_day, 5.0);
  EXPECT_LT(d.water_input_cm_per_day.start_days.back(), 5.0);
}

TEST(SurfaceDemand, RejectsMalformedInputs) {
  auto in = invented_inputs();
  in.pan_evaporation.series.start_days = {1.0};
  EXPECT_THROW(wf::surface_demand(in), wetfront::base::InputError);
  in = invented_inputs();
  in.water_inputs[0].series.values[3] = -1.0;
  EXPECT_THROW(wf::surface_demand(in), wetfront::base::InputError);
  in = invented_inputs();
  in.max_step_days = 0;
  EXPECT_THROW(wf::surface_demand(in), wetfront::base::InputError);
  in = invented_inputs();
  in.split.leaf_area_index.values[1] = -2;
  EXPECT_THROW(wf::surface_demand(in), wetfront::base::InputError);
}
