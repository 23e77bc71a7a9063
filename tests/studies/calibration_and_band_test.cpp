// Calibration and the output band on models whose answers are known in closed form (derived in
// the comments beside each check; recovery within two standard errors is common practice).
#include <gtest/gtest.h>

#include <cmath>
#include <random>
#include <vector>

#include "wetfront/studies/parameter_calibration.hpp"
#include "wetfront/studies/parameter_uncertainty.hpp"

namespace wetfront::studies {
namespace {

// y(t) = a exp(-b t) at 30 times, with Gaussian noise of sd 0.02 (seeded). Outputs: the
// integral of y over [0, 10], a / b (1 - exp(-10 b)), and the value at t = 5.
struct DecayModel {
  std::vector<double> times, observed;
  double sigma = 0.02;
  int runs = 0;
  DecayModel(double a, double b) {
    std::mt19937_64 generator(42);
    std::normal_distribution<double> noise(0.0, sigma);
    for (int i = 0; i < 30; ++i) {
      times.push_back(0.3 * i);
      observed.push_back(a * std::exp(-b * times.back()) + noise(generator));
    }
  }
  ModelBatch batch() {
    return [this](const std::vector<ParameterSet>& sets) {
      std::vector<ModelRun> out;
      for (const auto& p : sets) {
        ++runs;
        ModelRun run;
        run.ok = true;
        run.residuals.resize(static_cast<Eigen::Index>(times.size()));
        for (std::size_t i = 0; i < times.size(); ++i)
          run.residuals[static_cast<Eigen::Index>(i)] = (p[0] * std::exp(-p[1] * times[i]) - observed[i]) / sigma;
        run.outputs.resize(2);
        run.outputs << p[0] / p[1] * (1 - std::exp(-10 * p[1])), p[0] * std::exp(-5 * p[1]);
        out.push_back(run);
      }
      return out;
    };
  }
};

std::vector<AdjustableParameter> decay_parameters() {
  return {{.name = "a", .unit = "", .lower = 0.1, .upper = 10, .scale = ParameterScale::log, .start = 0.5},
          {.name = "b", .unit = "1/d", .lower = 0.01, .upper = 2, .scale = ParameterScale::linear, .start = 0.8}};
}

TEST(Calibration, RecoversKnownParametersWithinTwoStandardErrors) {
  DecayModel model(2.0, 0.3);
  const auto parameters = decay_parameters();
  const CalibrationResult result = calibrate(parameters, model.batch());
  ASSERT_TRUE(result.converged) << result.stop_reason;
  ASSERT_EQ(result.covariance.rows(), 2);
  EXPECT_LT(std::abs(result.best_search[0] - std::log10(2.0)), 2 * result.standard_errors[0]);
  EXPECT_LT(std::abs(result.best_search[1] - 0.3), 2 * result.standard_errors[1]);
  // The stated noise is the true noise: the residual variance per reading is near 1.
  const double s2 = result.at_best.residuals.squaredNorm() / (30 - 2);
  EXPECT_GT(s2, 0.5);
  EXPECT_LT(s2, 1.8);
  EXPECT_LE(result.runs, 200);
  EXPECT_EQ(result.runs, model.runs);  // every run counted, none repeated
  EXPECT_TRUE(result.warnings.empty()) << result.warnings.front();
}

TEST(Calibration, StopsAtTheRunLimitAndSaysSo) {
  DecayModel model(2.0, 0.3);
  CalibrationOptions options;
  options.max_runs = 7;
  const CalibrationResult result = calibrate(decay_parameters(), model.batch(), options);
  EXPECT_LE(model.runs, 7);
  EXPECT_FALSE(result.converged);
  EXPECT_NE(result.stop_reason.find("limit on model runs"), std::string::npos) << result.stop_reason;
}

TEST(Calibration, AParameterTheDataDoNotSeeIsReportedUnresolved) {
  DecayModel model(2.0, 0.3);
  auto parameters = decay_parameters();
  parameters.push_back(
      {.name = "unused", .unit = "", .lower = 0, .upper = 1, .scale = ParameterScale::linear, .start = 0.5});
  const ModelBatch inner = model.batch();
  const ModelBatch batch = [&](const std::vector<ParameterSet>& sets) {
    std::vector<ParameterSet> first_two;
    for (const auto& s : sets) first_two.push_back({s[0], s[1]});
    return inner(first_two);
  };
  const CalibrationResult result = calibrate(parameters, batch);
  EXPECT_EQ(result.covariance.size(), 0);  // rank deficient: no covariance
  bool named = false;
  for (const auto& w : result.warnings)
    named = named || (w.find("'unused'") != std::string::npos && w.find("cannot resolve") != std::string::npos);
  EXPECT_TRUE(named);
}

TEST(Calibration, TwoParametersThatOnlyActTogetherAreReportedCorrelated) {
  // y = (a * c) exp(-b t): a and c enter only as a product, except for a faint term in c that
  // keeps the problem solvable. Their correlation must come out near -1.
  DecayModel model(2.0, 0.3);
  auto parameters = decay_parameters();
  parameters.push_back({.name = "c", .unit = "", .lower = 0.5, .upper = 2, .scale = ParameterScale::log, .start = 1.0});
  const ModelBatch batch = [&](const std::vector<ParameterSet>& sets) {
    std::vector<ModelRun> out;
    for (const auto& p : sets) {
      ModelRun run;
      run.ok = true;
      run.residuals.resize(30);
      for (int i = 0; i < 30; ++i)
        run.residuals[i] = (p[0] * p[2] * std::exp(-p[1] * model.times[static_cast<std::size_t>(i)]) + 1e-4 * p[2] -
                            model.observed[static_cast<std::size_t>(i)]) /
                           model.sigma;
      run.outputs = Eigen::VectorXd::Zero(1);
      out.push_back(run);
    }
    return out;
  };
  const CalibrationResult result = calibrate(parameters, batch);
  bool correlated = false;
  for (const auto& w : result.warnings) correlated = correlated || w.find("strongly correlated") != std::string::npos;
  ASSERT_EQ(result.covariance.rows(), 3);
  EXPECT_LT(result.correlation(0, 2), -0.95);
  EXPECT_TRUE(correlated);
}

TEST(FirstOrder, LinearOutputsGiveTheExactVarianceAndShares) {
  // g = 2 p1 + 3 p2 with var(p1) = 0.04, var(p2) = 0.01, cov = 0.01:
  // var g = 4 * 0.04 + 9 * 0.01 + 2 * 6 * 0.01 = 0.37 (hand-computed).
  Eigen::MatrixXd covariance(2, 2);
  covariance << 0.04, 0.01, 0.01, 0.01;
  Eigen::MatrixXd sensitivity(1, 2);
  sensitivity << 2, 3;
  const auto intervals = first_order_intervals(Eigen::VectorXd::Constant(1, 5.0), sensitivity, covariance);
  ASSERT_EQ(intervals.size(), 1u);
  EXPECT_NEAR(intervals[0].standard_deviation, std::sqrt(0.37), 1e-12);
  EXPECT_NEAR(intervals[0].upper - 5.0, 1.959964 * std::sqrt(0.37), 1e-9);
  // Shares: s1 (C s)_1 / var = 2 * 0.11 / 0.37, s2 (C s)_2 / var = 3 * 0.05 / 0.37.
  EXPECT_NEAR(intervals[0].variance_share[0], 0.22 / 0.37, 1e-12);
  EXPECT_NEAR(intervals[0].variance_share[1], 0.15 / 0.37, 1e-12);
}

TEST(Draws, SampleMeanAndCovarianceMatchTheTargetAndStayInsideTheRanges) {
  const std::vector<AdjustableParameter> parameters{
      {.name = "x", .unit = "", .lower = -10, .upper = 10, .scale = ParameterScale::linear, .start = 0},
      {.name = "y", .unit = "", .lower = 0.001, .upper = 1000, .scale = ParameterScale::log, .start = 1}};
  Eigen::VectorXd mean(2);
  mean << 1.0, 0.5;  // y on its log10 scale
  Eigen::MatrixXd covariance(2, 2);
  covariance << 0.25, 0.06, 0.06, 0.04;
  const auto sets = draw_parameter_sets(parameters, mean, covariance, 20000, 3);
  Eigen::MatrixXd x(20000, 2);
  for (std::size_t i = 0; i < sets.size(); ++i)
    x.row(static_cast<Eigen::Index>(i)) << sets[i][0], std::log10(sets[i][1]);
  const Eigen::RowVectorXd m = x.colwise().mean();
  const Eigen::MatrixXd centred = x.rowwise() - m;
  const Eigen::MatrixXd c = centred.transpose() * centred / 19999.0;
  // Standard errors of these estimates at n = 20000 are about 0.004 or less.
  EXPECT_NEAR(m[0], 1.0, 0.02);
  EXPECT_NEAR(m[1], 0.5, 0.01);
  EXPECT_NEAR(c(0, 0), 0.25, 0.01);
  EXPECT_NEAR(c(0, 1), 0.06, 0.005);
  EXPECT_NEAR(c(1, 1), 0.04, 0.002);
  // Truncation: a narrow range keeps every draw inside.
  auto narrow = parameters;
  narrow[0].lower = 0.9;
  narrow[0].upper = 1.5;
  for (const auto& set : draw_parameter_sets(narrow, mean, covariance, 200, 4)) {
    EXPECT_GE(set[0], 0.9);
    EXPECT_LE(set[0], 1.5);
  }
}

TEST(Percentile, LinearBetweenOrderStatistics) {
  // Hyndman & Fan (1996) definition 7: for 1, 2, 3, 4 the 10 % point is 1 + 0.3 = 1.3 and the
  // median 2.5.
  EXPECT_DOUBLE_EQ(percentile({4, 1, 3, 2}, 0.1), 1.3);
  EXPECT_DOUBLE_EQ(percentile({4, 1, 3, 2}, 0.5), 2.5);
  EXPECT_DOUBLE_EQ(percentile({4, 1, 3, 2}, 1.0), 4.0);
  EXPECT_TRUE(std::isnan(percentile({}, 0.5)));
}

}  // namespace
}  // namespace wetfront::studies
