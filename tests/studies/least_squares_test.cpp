// Generic bounded Levenberg-Marquardt: straight-line fit against closed-form least squares,
// bounds, fixed parameters, stop reasons and input errors.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <vector>

#include "wetfront/studies/least_squares.hpp"

namespace ws = wetfront::studies;

namespace {
const std::vector<double> kX{0.0, 1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0};
const std::vector<double> kY{1.1, 2.9, 5.2, 6.8, 9.1, 11.2, 12.8, 15.1};

ws::LeastSquaresProblem line_problem() {
  ws::LeastSquaresProblem p;
  p.parameters = {{"intercept"}, {"slope"}};
  p.residual_count = static_cast<Eigen::Index>(kX.size());
  p.residuals = [](const Eigen::VectorXd& v, Eigen::VectorXd& r) {
    for (std::size_t i = 0; i < kX.size(); ++i) r[static_cast<Eigen::Index>(i)] = v[0] + v[1] * kX[i] - kY[i];
  };
  return p;
}
}  // namespace

// Closed-form ordinary least squares for a line (common practice): b = Sxy/Sxx, a = ybar - b xbar,
// se(b) = s / sqrt(Sxx), se(a) = s sqrt(1/N + xbar^2/Sxx), corr(a, b) = -xbar / sqrt(Sxx/N + xbar^2).
TEST(LeastSquares, StraightLineMatchesClosedForm) {
  const double n = static_cast<double>(kX.size());
  double xbar = 0, ybar = 0;
  for (std::size_t i = 0; i < kX.size(); ++i) {
    xbar += kX[i] / n;
    ybar += kY[i] / n;
  }
  double sxx = 0, sxy = 0;
  for (std::size_t i = 0; i < kX.size(); ++i) {
    sxx += (kX[i] - xbar) * (kX[i] - xbar);
    sxy += (kX[i] - xbar) * (kY[i] - ybar);
  }
  const double b = sxy / sxx, a = ybar - b * xbar;
  double sse = 0;
  for (std::size_t i = 0; i < kX.size(); ++i) sse += std::pow(a + b * kX[i] - kY[i], 2);
  const double s = std::sqrt(sse / (n - 2));

  const auto result = ws::solve_least_squares(line_problem(), Eigen::Vector2d(0.0, 0.0));
  EXPECT_TRUE(result.converged()) << ws::describe(result.stop_reason);
  EXPECT_NEAR(result.parameters[0], a, 1e-9);
  EXPECT_NEAR(result.parameters[1], b, 1e-9);
  EXPECT_NEAR(result.sum_of_squares, sse, 1e-12);
  EXPECT_EQ(result.degrees_of_freedom, 6);
  EXPECT_NEAR(result.standard_errors[1], s / std::sqrt(sxx), 1e-8);
  EXPECT_NEAR(result.standard_errors[0], s * std::sqrt(1.0 / n + xbar * xbar / sxx), 1e-8);
  EXPECT_NEAR(result.correlation(0, 1), -xbar / std::sqrt(sxx / n + xbar * xbar), 1e-8);
  EXPECT_TRUE(result.covariance_note.empty());
}

TEST(LeastSquares, BoundsAreRespectedAndActiveBoundIsApproached) {
  auto p = line_problem();
  p.parameters[1].upper = 1.5;  // the unconstrained slope is about 2
  p.parameters[1].lower = 0.0;
  const auto result = ws::solve_least_squares(p, Eigen::Vector2d(0.0, 1.0));
  EXPECT_LT(result.parameters[1], 1.5);
  EXPECT_GT(result.parameters[1], 1.49);
}

TEST(LeastSquares, FixedParameterKeepsItsValueAndHasZeroError) {
  auto p = line_problem();
  p.parameters[0].fixed = true;
  const auto result = ws::solve_least_squares(p, Eigen::Vector2d(1.0, 0.0));
  EXPECT_EQ(result.parameters[0], 1.0);
  EXPECT_EQ(result.standard_errors[0], 0.0);
  EXPECT_EQ(result.degrees_of_freedom, 7);
  // Slope with the intercept fixed at 1: b = sum x (y - 1) / sum x^2.
  double num = 0, den = 0;
  for (std::size_t i = 0; i < kX.size(); ++i) {
    num += kX[i] * (kY[i] - 1.0);
    den += kX[i] * kX[i];
  }
  EXPECT_NEAR(result.parameters[1], num / den, 1e-9);
}

TEST(LeastSquares, ExponentialDecayWithNumericalJacobian) {
  // y = 5 exp(-0.3 t) exactly: the fit recovers the parameters, S -> 0.
  ws::LeastSquaresProblem p;
  p.parameters = {{"amplitude", 0.0}, {"rate", 0.0}};
  p.residual_count = 10;
  p.residuals = [](const Eigen::VectorXd& v, Eigen::VectorXd& r) {
    for (int i = 0; i < 10; ++i) r[i] = v[0] * std::exp(-v[1] * i) - 5.0 * std::exp(-0.3 * i);
  };
  const auto result = ws::solve_least_squares(p, Eigen::Vector2d(1.0, 1.0));
  EXPECT_TRUE(result.converged()) << ws::describe(result.stop_reason);
  EXPECT_NEAR(result.parameters[0], 5.0, 1e-8);
  EXPECT_NEAR(result.parameters[1], 0.3, 1e-9);
}

TEST(LeastSquares, IterationLimitIsReported) {
  ws::LeastSquaresOptions options;
  options.max_iterations = 1;
  ws::LeastSquaresProblem p;
  p.parameters = {{"amplitude", 0.0}, {"rate", 0.0}};
  p.residual_count = 10;
  p.residuals = [](const Eigen::VectorXd& v, Eigen::VectorXd& r) {
    for (int i = 0; i < 10; ++i) r[i] = v[0] * std::exp(-v[1] * i) - 5.0 * std::exp(-0.3 * i);
  };
  const auto result = ws::solve_least_squares(p, Eigen::Vector2d(1.0, 1.0), options);
  EXPECT_EQ(result.stop_reason, ws::StopReason::iteration_limit);
  EXPECT_FALSE(result.converged());
  EXPECT_EQ(result.iterations, 1);
}

TEST(LeastSquares, RankDeficientProblemHasNoCovariance) {
  // Only the sum a + b is determined.
  ws::LeastSquaresProblem p;
  p.parameters = {{"a"}, {"b"}};
  p.residual_count = 3;
  p.residuals = [](const Eigen::VectorXd& v, Eigen::VectorXd& r) {
    r << v[0] + v[1] - 1.0, v[0] + v[1] - 1.2, v[0] + v[1] - 0.9;
  };
  const auto result = ws::solve_least_squares(p, Eigen::Vector2d(0.0, 0.0));
  EXPECT_NEAR(result.parameters[0] + result.parameters[1], 31.0 / 30.0, 1e-8);
  EXPECT_EQ(result.covariance.size(), 0);
  EXPECT_NE(result.covariance_note.find("rank deficient"), std::string::npos);
  EXPECT_TRUE(std::isnan(result.standard_errors[0]));
}

TEST(LeastSquares, MultistartKeepsTheBest) {
  // r = (p^2 - 4) has minima at p = +2 and p = -2, plus a residual that prefers -2.
  ws::LeastSquaresProblem p;
  p.parameters = {{"p"}};
  p.residual_count = 2;
  p.residuals = [](const Eigen::VectorXd& v, Eigen::VectorXd& r) { r << v[0] * v[0] - 4.0, 0.1 * (v[0] + 2.0); };
  const std::vector<Eigen::VectorXd> starts{Eigen::VectorXd::Constant(1, 3.0), Eigen::VectorXd::Constant(1, -3.0)};
  const auto best = ws::solve_least_squares_multistart(p, starts);
  EXPECT_LT(best.parameters[0], -1.9);
  const auto single = ws::solve_least_squares(p, starts[0]);
  EXPECT_GT(single.parameters[0], 1.9);  // the local minimum the first start alone finds
}

TEST(LeastSquares, InconsistentProblemsAreRejected) {
  auto p = line_problem();
  p.parameters[0].lower = 2.0;
  p.parameters[0].upper = 1.0;
  EXPECT_THROW(ws::solve_least_squares(p, Eigen::Vector2d(0.0, 0.0)), wetfront::base::InputError);
  p = line_problem();
  p.residual_count = 1;
  EXPECT_THROW(ws::solve_least_squares(p, Eigen::Vector2d(0.0, 0.0)), wetfront::base::InputError);
  p = line_problem();
  EXPECT_THROW(ws::solve_least_squares(p, Eigen::Vector3d(0.0, 0.0, 0.0)), wetfront::base::InputError);
  p.parameters[0].fixed = p.parameters[1].fixed = true;
  EXPECT_THROW(ws::solve_least_squares(p, Eigen::Vector2d(0.0, 0.0)), wetfront::base::InputError);
}

// The budget is asked before every step: a budget spent from the start stops before any step,
// with the starting point and its residuals as the result.
TEST(LeastSquares, SpentBudgetStopsBeforeTheNextStep) {
  int asked = 0;
  ws::LeastSquaresOptions options;
  options.budget_spent = [&asked] { return ++asked >= 3; };  // allows two steps
  const auto result = ws::solve_least_squares(line_problem(), Eigen::Vector2d(0.0, 0.0), options);
  EXPECT_EQ(result.stop_reason, ws::StopReason::budget_spent);
  EXPECT_FALSE(result.converged());
  EXPECT_EQ(result.iterations, 2);
  EXPECT_EQ(asked, 3);
}

// A relative-decrease tolerance ends the run once a step gains, or the Gauss-Newton step would
// gain, less than that fraction of S; the fit is then no better than a full run's and no worse
// than the start.
TEST(LeastSquares, RelativeDecreaseToleranceStopsOnceStepsGainLittle) {
  ws::LeastSquaresOptions loose;
  loose.relative_decrease_tolerance = 0.5;
  const auto stopped = ws::solve_least_squares(line_problem(), Eigen::Vector2d(0.0, 0.0), loose);
  const auto full = ws::solve_least_squares(line_problem(), Eigen::Vector2d(0.0, 0.0));
  EXPECT_TRUE(stopped.stop_reason == ws::StopReason::small_decrease ||
              stopped.stop_reason == ws::StopReason::small_predicted_decrease)
      << ws::describe(stopped.stop_reason);
  EXPECT_TRUE(stopped.converged());
  EXPECT_LT(stopped.iterations, full.iterations);
  EXPECT_GE(stopped.sum_of_squares, full.sum_of_squares - 1e-12);
  // The default (0) never stops this way.
  EXPECT_NE(full.stop_reason, ws::StopReason::small_decrease);
}

// Residuals with a small rough part, as a numerical model's are (its time steps change with the
// parameters): once the Gauss-Newton step predicts less than the relative tolerance of S, the
// fit stops there instead of trying steps that the roughness accepts or rejects at random.
TEST(LeastSquares, PredictedDecreaseBelowToleranceStopsANoisyFit) {
  auto noisy = line_problem();
  noisy.residuals = [](const Eigen::VectorXd& v, Eigen::VectorXd& r) {
    for (std::size_t i = 0; i < kX.size(); ++i)
      r[static_cast<Eigen::Index>(i)] =
          v[0] + v[1] * kX[i] - kY[i] + 0.003 * std::sin(1e5 * (v[0] + 3.0 * v[1] + static_cast<double>(i)));
  };
  noisy.jacobian = [](const Eigen::VectorXd&, Eigen::MatrixXd& j) {  // the smooth part's, as differences
    for (std::size_t i = 0; i < kX.size(); ++i) {  // over a wide step would give
      j(static_cast<Eigen::Index>(i), 0) = 1.0;
      j(static_cast<Eigen::Index>(i), 1) = kX[i];
    }
  };
  const auto clean = ws::solve_least_squares(line_problem(), Eigen::Vector2d(0.0, 0.0));
  ws::LeastSquaresOptions options;
  options.relative_decrease_tolerance = 1e-3;
  const auto fit = ws::solve_least_squares(noisy, Eigen::Vector2d(0.0, 0.0), options);
  EXPECT_EQ(fit.stop_reason, ws::StopReason::small_predicted_decrease) << ws::describe(fit.stop_reason);
  EXPECT_TRUE(fit.converged());
  EXPECT_NEAR(fit.parameters[1], clean.parameters[1], 0.02);
  EXPECT_NEAR(fit.parameters[0], clean.parameters[0], 0.1);
  EXPECT_LE(fit.residual_evaluations, 4) << fit.iterations << " iterations";  // 6 without the test
}
