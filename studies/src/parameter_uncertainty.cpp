#include "wetfront/studies/parameter_uncertainty.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <random>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"
#include "random_draws.hpp"

namespace wetfront::studies {
namespace {

constexpr double kNormal95 = 1.959964;  // two-sided 95 % point of the standard normal (common practice)

}  // namespace

std::vector<FirstOrderInterval> first_order_intervals(const Eigen::VectorXd& estimates,
                                                      const Eigen::MatrixXd& sensitivity,
                                                      const Eigen::MatrixXd& covariance) {
  if (sensitivity.rows() != estimates.size() || sensitivity.cols() != covariance.rows() ||
      covariance.rows() != covariance.cols())
    throw base::InputError("first-order intervals: the sensitivities, estimates and covariance do not fit together");
  std::vector<FirstOrderInterval> intervals;
  for (Eigen::Index i = 0; i < estimates.size(); ++i) {
    const Eigen::VectorXd s = sensitivity.row(i).transpose();
    const Eigen::VectorXd cs = covariance * s;
    const double variance = std::max(0.0, s.dot(cs));
    FirstOrderInterval interval;
    interval.estimate = estimates[i];
    interval.standard_deviation = std::sqrt(variance);
    interval.lower = estimates[i] - kNormal95 * interval.standard_deviation;
    interval.upper = estimates[i] + kNormal95 * interval.standard_deviation;
    for (Eigen::Index k = 0; k < s.size(); ++k)
      interval.variance_share.push_back(variance > 0 ? s[k] * cs[k] / variance : 0.0);
    intervals.push_back(std::move(interval));
  }
  return intervals;
}

std::vector<ParameterSet> draw_parameter_sets(std::span<const AdjustableParameter> parameters,
                                              const Eigen::VectorXd& mean, const Eigen::MatrixXd& covariance,
                                              std::size_t count, std::uint64_t seed) {
  const auto n = static_cast<Eigen::Index>(parameters.size());
  if (mean.size() != n || covariance.rows() != n || covariance.cols() != n)
    throw base::InputError("parameter draws: the mean, covariance and parameters do not fit together");
  if (!covariance.isApprox(covariance.transpose(), 1e-10))
    throw base::InputError("parameter draws: the covariance is not symmetric");
  // C = V diag(lambda) V^T; a draw is mean + V diag(sqrt(lambda)) z. Handles a singular C.
  const Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eigen(covariance);
  const Eigen::VectorXd lambda = eigen.eigenvalues();
  if (lambda.minCoeff() < -1e-10 * std::max(1.0, lambda.cwiseAbs().maxCoeff()))
    throw base::InputError("parameter draws: the covariance is not positive semi-definite");
  const Eigen::MatrixXd root = eigen.eigenvectors() * lambda.cwiseMax(0.0).cwiseSqrt().asDiagonal();
  Eigen::VectorXd lower(n), upper(n);
  for (Eigen::Index k = 0; k < n; ++k) {
    const auto& p = parameters[static_cast<std::size_t>(k)];
    lower[k] = to_search_scale(p, p.lower);
    upper[k] = to_search_scale(p, p.upper);
  }
  std::mt19937_64 generator(seed);
  std::vector<ParameterSet> sets;
  const std::size_t max_attempts = 1000 * count + 1000;
  std::size_t attempts = 0;
  Eigen::VectorXd z(n);
  while (sets.size() < count) {
    if (++attempts > max_attempts)
      throw base::InputError("parameter draws: almost every draw falls outside the parameter ranges");
    for (Eigen::Index k = 0; k < n; ++k) z[k] = detail::standard_normal(generator);
    const Eigen::VectorXd x = mean + root * z;
    if ((x.array() < lower.array()).any() || (x.array() > upper.array()).any()) continue;
    ParameterSet set;
    for (Eigen::Index k = 0; k < n; ++k)
      set.push_back(from_search_scale(parameters[static_cast<std::size_t>(k)], x[k]));
    sets.push_back(std::move(set));
  }
  return sets;
}

double percentile(std::vector<double> values, double q) {
  if (values.empty()) return std::numeric_limits<double>::quiet_NaN();
  std::sort(values.begin(), values.end());
  const double position = std::clamp(q, 0.0, 1.0) * static_cast<double>(values.size() - 1);
  const auto below = static_cast<std::size_t>(std::floor(position));
  const std::size_t above = std::min(below + 1, values.size() - 1);
  return values[below] + (position - static_cast<double>(below)) * (values[above] - values[below]);
}

}  // namespace wetfront::studies
