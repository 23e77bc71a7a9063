// van Genuchten retention fitting: outside check against scipy, synthetic round trip, fixed
// parameters, and input errors.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <string>
#include <vector>

#include "wetfront/soils/lab_csv.hpp"
#include "wetfront/soils/retention_fit.hpp"

namespace ws = wetfront::soils;

namespace {
std::vector<ws::RetentionPoint> demo_points() {
  const auto series = ws::read_retention_csv(WETFRONT_SOURCE_DIR "/tests/soils/data/retention_loam_core.csv");
  return series.at(0).points;
}

std::string error_of(const std::vector<ws::RetentionPoint>& points, const ws::RetentionFitOptions& options = {}) {
  try {
    ws::fit_van_genuchten_retention(points, options);
  } catch (const wetfront::base::InputError& e) {
    return e.what();
  }
  ADD_FAILURE() << "no wetfront::base::InputError thrown";
  return {};
}

void expect_relative(double actual, double expected, double tolerance, const char* what) {
  EXPECT_NEAR(actual, expected, tolerance * std::abs(expected)) << what;
}
}  // namespace

// Check values: scipy.optimize.curve_fit (scipy 1.10.1, MINPACK Levenberg-Marquardt, analytic
// Jacobian, absolute_sigma=False), script tests/soils/scipy_retention_check.py, on the invented
// data set tests/soils/data/retention_loam_core.csv.
TEST(RetentionFit, AgreesWithScipyCurveFit) {
  const auto fit = ws::fit_van_genuchten_retention(demo_points());
  ASSERT_TRUE(fit.converged()) << wetfront::studies::describe(fit.stop_reason);
  constexpr double tol = 1e-4;
  expect_relative(fit.parameters.residual_water_content, 0.0609268709203, tol, "theta_r");
  expect_relative(fit.parameters.saturated_water_content, 0.440615347576, tol, "theta_s");
  expect_relative(fit.parameters.alpha_per_cm, 0.0249416381589, tol, "alpha");
  expect_relative(fit.parameters.n, 1.4517030822, tol, "n");
  expect_relative(fit.standard_errors.residual_water_content, 0.00870840944532, tol, "se theta_r");
  expect_relative(fit.standard_errors.saturated_water_content, 0.00414913996865, tol, "se theta_s");
  expect_relative(fit.standard_errors.alpha_per_cm, 0.0024232832918, tol, "se alpha");
  expect_relative(fit.standard_errors.n, 0.0372032452286, tol, "se n");
  expect_relative(fit.sum_of_squares, 0.000216424308775, tol, "SSE");
  // Correlations (same script).
  EXPECT_NEAR(fit.correlation(0, 1), -0.339395199, 1e-4);
  EXPECT_NEAR(fit.correlation(0, 2), -0.605118269, 1e-4);
  EXPECT_NEAR(fit.correlation(0, 3), +0.913909793, 1e-4);
  EXPECT_NEAR(fit.correlation(1, 2), +0.747507590, 1e-4);
  EXPECT_NEAR(fit.correlation(1, 3), -0.459430762, 1e-4);
  EXPECT_NEAR(fit.correlation(2, 3), -0.814886372, 1e-4);
  EXPECT_EQ(fit.correlation(3, 2), fit.correlation(2, 3));
  EXPECT_EQ(fit.point_count, 12);
  EXPECT_EQ(fit.free_parameter_count, 4);
  EXPECT_NEAR(fit.rmse, std::sqrt(0.000216424308775 / 12), 1e-6);
  EXPECT_GT(fit.r_squared, 0.99);
  EXPECT_LT(fit.r_squared, 1.0);
}

TEST(RetentionFit, SyntheticRoundTripRecoversParameters) {
  const ws::RetentionParameters truth{0.078, 0.43, 0.036, 1.56};  // Carsel & Parrish (1988) loam
  std::vector<ws::RetentionPoint> points;
  for (const double s : {0.0, 5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0, 1000.0, 3000.0, 15000.0})
    points.push_back({s, ws::van_genuchten_water_content(truth, s)});
  const auto fit = ws::fit_van_genuchten_retention(points);
  ASSERT_TRUE(fit.converged()) << wetfront::studies::describe(fit.stop_reason);
  EXPECT_NEAR(fit.parameters.residual_water_content, truth.residual_water_content, 1e-7);
  EXPECT_NEAR(fit.parameters.saturated_water_content, truth.saturated_water_content, 1e-7);
  EXPECT_NEAR(fit.parameters.alpha_per_cm, truth.alpha_per_cm, 1e-7);
  EXPECT_NEAR(fit.parameters.n, truth.n, 1e-7);
  EXPECT_LT(fit.rmse, 1e-9);
}

TEST(RetentionFit, RoundTripFromPoorStartingGuessesForCoarseAndFineSoils) {
  // Sand and clay (Carsel & Parrish 1988) lie far from the central starting points.
  for (const ws::RetentionParameters truth :
       {ws::RetentionParameters{0.045, 0.43, 0.145, 2.68}, ws::RetentionParameters{0.068, 0.38, 0.008, 1.09}}) {
    std::vector<ws::RetentionPoint> points;
    for (const double s : {1.0, 3.0, 10.0, 30.0, 100.0, 300.0, 1000.0, 3000.0, 15000.0})
      points.push_back({s, ws::van_genuchten_water_content(truth, s)});
    const auto fit = ws::fit_van_genuchten_retention(points);
    EXPECT_NEAR(fit.parameters.alpha_per_cm, truth.alpha_per_cm, 1e-5 * truth.alpha_per_cm);
    EXPECT_NEAR(fit.parameters.n, truth.n, 1e-5 * truth.n);
  }
}

TEST(RetentionFit, ResidualWaterContentStaysWithinItsBound) {
  // Points from a curve whose theta_r would be negative: the fit stops at the bound theta_r = 0
  // and says so.
  const ws::RetentionParameters outside{-0.02, 0.40, 0.02, 1.5};
  std::vector<ws::RetentionPoint> points;
  for (const double s : {0.0, 10.0, 30.0, 100.0, 300.0, 1000.0, 3000.0})
    points.push_back({s, ws::van_genuchten_water_content(outside, s)});
  ASSERT_GT(points.back().water_content, 0.0);
  const auto fit = ws::fit_van_genuchten_retention(points);
  EXPECT_GE(fit.parameters.residual_water_content, 0.0);
  EXPECT_LT(fit.parameters.residual_water_content, 1e-6);
  ASSERT_EQ(fit.at_bound.size(), 1u);
  EXPECT_EQ(fit.at_bound[0], "residual water content");
  EXPECT_TRUE(ws::fit_van_genuchten_retention(demo_points()).at_bound.empty());
}

TEST(RetentionFit, FixedResidualWaterContent) {
  ws::RetentionFitOptions options;
  options.fixed_residual_water_content = 0.0;
  const auto fit = ws::fit_van_genuchten_retention(demo_points(), options);
  EXPECT_EQ(fit.parameters.residual_water_content, 0.0);
  EXPECT_EQ(fit.standard_errors.residual_water_content, 0.0);
  EXPECT_EQ(fit.free_parameter_count, 3);
  EXPECT_GT(fit.sum_of_squares, 0.000216424308775);  // fewer free parameters fit worse
  EXPECT_GT(fit.standard_errors.n, 0.0);
}

TEST(RetentionFit, FixedSaturatedWaterContent) {
  ws::RetentionFitOptions options;
  options.fixed_saturated_water_content = 0.45;
  const auto fit = ws::fit_van_genuchten_retention(demo_points(), options);
  EXPECT_EQ(fit.parameters.saturated_water_content, 0.45);
  EXPECT_EQ(fit.free_parameter_count, 3);
  EXPECT_TRUE(fit.converged());
}

TEST(RetentionFit, PointsInAnyOrderGiveTheSameFit) {
  auto points = demo_points();
  std::reverse(points.begin(), points.end());
  const auto fit = ws::fit_van_genuchten_retention(points);
  EXPECT_NEAR(fit.parameters.n, 1.4517030822, 1e-4 * 1.4517030822);
}

TEST(RetentionFit, TooFewPointsForTheFreeParameters) {
  const std::vector<ws::RetentionPoint> three{{0, 0.4}, {100, 0.3}, {1000, 0.2}};
  const auto msg = error_of(three);
  EXPECT_NE(msg.find("3 points cannot determine 4 free parameters"), std::string::npos) << msg;
  ws::RetentionFitOptions options;
  options.fixed_residual_water_content = 0.05;
  const auto fit = ws::fit_van_genuchten_retention(three, options);  // 3 free: allowed
  EXPECT_NE(fit.covariance_note.find("degrees of freedom"), std::string::npos);
  EXPECT_TRUE(std::isnan(fit.standard_errors.n));
}

TEST(RetentionFit, WaterContentRisingWithSuctionNamesBothPoints) {
  const std::vector<ws::RetentionPoint> points{{0, 0.40}, {100, 0.30}, {330, 0.33}, {1000, 0.2}, {15000, 0.1}};
  const auto msg = error_of(points);
  EXPECT_NE(msg.find("point 3 (suction 330 cm, water content 0.33)"), std::string::npos) << msg;
  EXPECT_NE(msg.find("point 2 (suction 100 cm, water content 0.3)"), std::string::npos) << msg;
}

// Lab noise (issue 12): the 10 cm point 0.001 wetter than the 0 cm point is fitted, with a note
// naming both points; a rise beyond kRetentionNoiseTolerance (0.01, common practice) is an error.
TEST(RetentionFit, RiseWithinLabNoiseIsFittedWithANote) {
  const std::vector<ws::RetentionPoint> points{{0, 0.415},  {10, 0.416},  {50, 0.39},  {100, 0.35},
                                               {330, 0.27}, {1000, 0.19}, {15000, 0.1}};
  const ws::RetentionFit fit = ws::fit_van_genuchten_retention(points, {});
  ASSERT_EQ(fit.notes.size(), 1u);
  EXPECT_NE(fit.notes[0].find("point 2 (suction 10 cm"), std::string::npos) << fit.notes[0];
  EXPECT_NE(fit.notes[0].find("lab noise"), std::string::npos) << fit.notes[0];
  EXPECT_NEAR(fit.parameters.saturated_water_content, 0.415, 0.01);
}

TEST(RetentionFit, PooledSamplesAreNotHeldToOneOrder) {
  // Two replicate cores, each monotone, theta_s 0.43 and 0.40: pooled, the second core's wet
  // points lie below the first core's drier ones.
  const std::vector<ws::RetentionPoint> points{{0, 0.43}, {10, 0.425}, {100, 0.33}, {1000, 0.2},  {15000, 0.1},
                                               {0, 0.40}, {10, 0.395}, {100, 0.31}, {1000, 0.19}, {15000, 0.09}};
  EXPECT_THROW(ws::fit_van_genuchten_retention(points, {}), wetfront::base::InputError);
  ws::RetentionFitOptions pooled;
  pooled.one_sample = false;
  const ws::RetentionFit fit = ws::fit_van_genuchten_retention(points, pooled);
  EXPECT_TRUE(fit.notes.empty());
  EXPECT_GT(fit.parameters.saturated_water_content, 0.39);
}

TEST(RetentionFit, WaterContentOutsideUnitIntervalOrBadSuction) {
  auto msg = error_of({{0, 40.0}, {100, 30.0}, {330, 25.0}, {1000, 20.0}});
  EXPECT_NE(msg.find("point 1"), std::string::npos) << msg;
  EXPECT_NE(msg.find("not percent"), std::string::npos) << msg;
  msg = error_of({{0, 0.4}, {100, 0.3}, {330, 0.0}, {1000, 0.2}});
  EXPECT_NE(msg.find("point 3"), std::string::npos) << msg;
  msg = error_of({{0, 0.4}, {-100, 0.3}, {330, 0.25}, {1000, 0.2}});
  EXPECT_NE(msg.find("point 2"), std::string::npos) << msg;
  EXPECT_NE(msg.find(">= 0"), std::string::npos) << msg;
}

TEST(RetentionFit, FittedCurveFeedsTheHydraulicModel) {
  const auto fit = ws::fit_van_genuchten_retention(demo_points());
  const ws::HydraulicModel model = ws::with_conductivity(fit.parameters, 20.0);
  EXPECT_NEAR(ws::water_content(model, -330.0), ws::van_genuchten_water_content(fit.parameters, 330.0), 1e-15);
  EXPECT_EQ(ws::saturated_conductivity(model), 20.0);
}
