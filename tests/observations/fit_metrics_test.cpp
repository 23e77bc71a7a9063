// Fit metrics against hand-computed values.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <vector>

#include "wetfront/observations/fit_metrics.hpp"

namespace wetfront::observations {
namespace {

TEST(FitMetrics, HandWorkedFourPairs) {
  const std::vector<double> observed = {1, 2, 3, 4};
  const std::vector<double> simulated = {2, 2, 4, 5};
  const FitMetrics m = fit_metrics(simulated, observed);
  // errors s - o = 1, 0, 1, 1: bias = 3/4 = 0.75; RMSE = sqrt(3/4) = 0.8660254
  EXPECT_EQ(m.count, 4);
  EXPECT_DOUBLE_EQ(m.bias, 0.75);
  EXPECT_NEAR(m.root_mean_square_error, 0.8660254037844386, 1e-12);
  // Nash & Sutcliffe (1970): mean o = 2.5, sum (o - 2.5)^2 = 2.25 + 0.25 + 0.25 + 2.25 = 5;
  // NSE = 1 - 3/5 = 0.4
  EXPECT_NEAR(m.nash_sutcliffe, 0.4, 1e-12);
  // Gupta et al. (2009): mean s = 3.25; deviations of s: -1.25 -1.25 0.75 1.75 -> sum sq 6.75;
  // cross sum = (-1.25)(-1.5) + (-1.25)(-0.5) + (0.75)(0.5) + (1.75)(1.5) = 5.5
  // r = 5.5 / sqrt(6.75 * 5) = 0.9467293; alpha = sqrt(6.75 / 5) = 1.1618950; beta = 3.25/2.5 = 1.3
  // KGE = 1 - sqrt(0.0532707^2 + 0.1618950^2 + 0.3^2) = 1 - sqrt(0.1190478) = 0.6549670
  EXPECT_NEAR(m.correlation, 0.9467292624, 1e-9);
  EXPECT_NEAR(m.variability_ratio, 1.1618950039, 1e-9);
  EXPECT_DOUBLE_EQ(m.mean_ratio, 1.3);
  EXPECT_NEAR(m.kling_gupta, 0.6549670106, 1e-9);
}

TEST(FitMetrics, PerfectMatchScoresOne) {
  const std::vector<double> values = {-120, -95, -150, -60};
  const FitMetrics m = fit_metrics(values, values);
  EXPECT_DOUBLE_EQ(m.bias, 0.0);
  EXPECT_DOUBLE_EQ(m.root_mean_square_error, 0.0);
  EXPECT_DOUBLE_EQ(m.nash_sutcliffe, 1.0);
  EXPECT_NEAR(m.kling_gupta, 1.0, 1e-12);
}

TEST(FitMetrics, ObservedMeanAsSimulationScoresZeroNse) {
  // Predicting the observed mean everywhere gives NSE = 0 by construction (common practice);
  // the simulation has no spread, so r and KGE are undefined.
  const std::vector<double> observed = {0.20, 0.30, 0.25, 0.33};
  const std::vector<double> simulated(4, 0.27);
  const FitMetrics m = fit_metrics(simulated, observed);
  EXPECT_NEAR(m.nash_sutcliffe, 0.0, 1e-12);
  EXPECT_DOUBLE_EQ(m.variability_ratio, 0.0);
  EXPECT_TRUE(std::isnan(m.correlation));
  EXPECT_TRUE(std::isnan(m.kling_gupta));
}

TEST(FitMetrics, EmptyAndMismatchedInput) {
  const FitMetrics empty = fit_metrics({}, {});
  EXPECT_EQ(empty.count, 0);
  EXPECT_TRUE(std::isnan(empty.bias));
  EXPECT_TRUE(std::isnan(empty.nash_sutcliffe));
  const std::vector<double> two = {1, 2}, three = {1, 2, 3};
  EXPECT_THROW(fit_metrics(two, three), wetfront::base::InputError);
}

}  // namespace
}  // namespace wetfront::observations
