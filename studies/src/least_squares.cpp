// Levenberg-Marquardt with bound transforms; see least_squares.hpp for the method and sources.
#include "wetfront/studies/least_squares.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {
namespace {

// Maps between one natural parameter p and its unconstrained variable u.
struct Transform {
  double lower, upper;
  bool has_lower() const { return std::isfinite(lower); }
  bool has_upper() const { return std::isfinite(upper); }

  double to_natural(double u) const {
    if (has_lower() && has_upper()) return lower + (upper - lower) / (1.0 + std::exp(-u));
    if (has_lower()) return lower + std::exp(u);
    if (has_upper()) return upper - std::exp(u);
    return u;
  }
  double slope(double u) const {  // dp/du
    if (has_lower() && has_upper()) {
      const double s = 1.0 / (1.0 + std::exp(-u));
      return (upper - lower) * s * (1.0 - s);
    }
    if (has_lower()) return std::exp(u);
    if (has_upper()) return -std::exp(u);
    return 1.0;
  }
  double to_unconstrained(double p) const {
    if (has_lower() && has_upper()) return std::log((p - lower) / (upper - p));
    if (has_lower()) return std::log(p - lower);
    if (has_upper()) return std::log(upper - p);
    return p;
  }
  // Moves a start value on or beyond a bound just inside it.
  double inside(double p) const {
    if (has_lower() && has_upper()) {
      const double width = upper - lower;
      return lower + width * std::clamp((p - lower) / width, 1e-6, 1.0 - 1e-6);
    }
    if (has_lower()) return std::max(p, lower + 1e-6 * std::max(1.0, std::abs(lower)));
    if (has_upper()) return std::min(p, upper - 1e-6 * std::max(1.0, std::abs(upper)));
    return p;
  }
};

class Solver {
 public:
  Solver(const LeastSquaresProblem& problem, const LeastSquaresOptions& options)
      : problem_(problem), options_(options) {
    const auto count = static_cast<Eigen::Index>(problem.parameters.size());
    if (count == 0) throw base::InputError("least squares: no parameters to fit");
    if (!problem.residuals) throw base::InputError("least squares: no residual function given");
    for (Eigen::Index i = 0; i < count; ++i) {
      const auto& p = problem.parameters[static_cast<std::size_t>(i)];
      if (!(p.lower < p.upper))
        throw base::InputError(fmt::format("least squares: parameter '{}' has lower bound {} not below upper bound {}",
                                           p.name, p.lower, p.upper));
      transforms_.push_back({p.lower, p.upper});
      if (!p.fixed) free_.push_back(i);
    }
    if (free_.empty()) throw base::InputError("least squares: every parameter is fixed, nothing to fit");
    if (problem.residual_count < static_cast<Eigen::Index>(free_.size()))
      throw base::InputError(fmt::format("least squares: {} residuals cannot determine {} free parameters",
                                         problem.residual_count, free_.size()));
  }

  LeastSquaresResult run(const Eigen::VectorXd& start) {
    const auto count = static_cast<Eigen::Index>(problem_.parameters.size());
    if (start.size() != count)
      throw base::InputError(fmt::format("least squares: start has {} values for {} parameters", start.size(), count));
    natural_ = start;
    for (Eigen::Index j : free_) natural_[j] = transforms_[static_cast<std::size_t>(j)].inside(start[j]);
    Eigen::VectorXd u(static_cast<Eigen::Index>(free_.size()));
    for (std::size_t k = 0; k < free_.size(); ++k)
      u[static_cast<Eigen::Index>(k)] =
          transforms_[static_cast<std::size_t>(free_[k])].to_unconstrained(natural_[free_[k]]);

    LeastSquaresResult result;
    Eigen::VectorXd r = residuals_at(u);
    double cost = r.squaredNorm();
    if (!std::isfinite(cost))
      throw base::InputError("least squares: residuals are not finite at the starting parameters");
    Eigen::MatrixXd ju = jacobian_u(u);
    Eigen::MatrixXd a = ju.transpose() * ju;
    Eigen::VectorXd g = ju.transpose() * r;
    double mu = options_.initial_damping_scale * std::max(a.diagonal().maxCoeff(), 1e-300);
    double nu = 2.0;
    const auto gradient_small = [&] {
      return g.lpNorm<Eigen::Infinity>() <= options_.gradient_tolerance * (1.0 + cost);
    };
    bool stop = gradient_small();
    result.stop_reason = stop ? StopReason::small_gradient : StopReason::iteration_limit;
    int iteration = 0;
    while (!stop && iteration < options_.max_iterations) {
      if (options_.budget_spent && options_.budget_spent()) {
        result.stop_reason = StopReason::budget_spent;
        break;
      }
      // The undamped (Gauss-Newton) step's predicted decrease, g^T A^-1 g: when even it is below
      // the relative tolerance no step can gain enough, and on a noisy S (a numerical model's)
      // trying would only spend evaluations on steps that noise accepts or rejects.
      if (options_.relative_decrease_tolerance > 0.0) {
        const double best_predicted = g.dot(a.ldlt().solve(g));
        if (std::isfinite(best_predicted) && best_predicted >= 0.0 &&
            best_predicted < options_.relative_decrease_tolerance * cost) {
          result.stop_reason = StopReason::small_predicted_decrease;
          break;
        }
      }
      ++iteration;
      const Eigen::MatrixXd damped = a + mu * Eigen::MatrixXd::Identity(a.rows(), a.cols());
      const Eigen::VectorXd h = damped.ldlt().solve(-g);
      if (h.norm() <= options_.step_tolerance * (u.norm() + options_.step_tolerance)) {
        result.stop_reason = StopReason::small_step;
        break;
      }
      const Eigen::VectorXd u_new = u + h;
      const Eigen::VectorXd r_new = residuals_at(u_new);
      const double cost_new = r_new.squaredNorm();
      // Gain ratio: actual over predicted decrease of S, predicted = h^T (mu h - g) (eq. 2.18
      // of Madsen et al. written for S = 2F).
      const double predicted = h.dot(mu * h - g);
      const double rho = std::isfinite(cost_new) && predicted > 0.0 ? (cost - cost_new) / predicted : -1.0;
      if (rho > 0.0) {
        const bool small_decrease = cost - cost_new < options_.relative_decrease_tolerance * cost;
        u = u_new;
        r = r_new;
        cost = cost_new;
        ju = jacobian_u(u);
        a = ju.transpose() * ju;
        g = ju.transpose() * r;
        mu *= std::max(1.0 / 3.0, 1.0 - std::pow(2.0 * rho - 1.0, 3));
        nu = 2.0;
        if (gradient_small()) {
          result.stop_reason = StopReason::small_gradient;
          stop = true;
        } else if (small_decrease) {
          result.stop_reason = StopReason::small_decrease;
          stop = true;
        }
      } else {
        mu *= nu;
        nu *= 2.0;
        if (!std::isfinite(mu) || nu > 1e30) {
          result.stop_reason = StopReason::no_further_progress;
          stop = true;
        }
      }
    }
    to_natural(u);
    result.parameters = natural_;
    result.jacobian = jacobian_natural_;
    result.residuals = r;
    result.sum_of_squares = cost;
    result.iterations = iteration;
    result.residual_evaluations = evaluations_;
    for (Eigen::Index j : free_) {
      const auto& t = transforms_[static_cast<std::size_t>(j)];
      const double width = t.has_lower() && t.has_upper() ? t.upper - t.lower : 0.0;
      const auto near = [&](double bound) {
        const double scale = width > 0.0 ? width : std::max(1.0, std::abs(bound));
        return std::isfinite(bound) && std::abs(natural_[j] - bound) <= 1e-6 * scale;
      };
      if (near(t.lower) || near(t.upper))
        result.at_bound.push_back(problem_.parameters[static_cast<std::size_t>(j)].name);
    }
    covariance(result);
    return result;
  }

 private:
  void to_natural(const Eigen::VectorXd& u) {
    for (std::size_t k = 0; k < free_.size(); ++k)
      natural_[free_[k]] = transforms_[static_cast<std::size_t>(free_[k])].to_natural(u[static_cast<Eigen::Index>(k)]);
  }

  Eigen::VectorXd residuals_of(const Eigen::VectorXd& natural) {
    Eigen::VectorXd r(problem_.residual_count);
    problem_.residuals(natural, r);
    ++evaluations_;
    return r;
  }

  Eigen::VectorXd residuals_at(const Eigen::VectorXd& u) {
    to_natural(u);
    return residuals_of(natural_);
  }

  // dr/dp for the free parameters at natural_, analytic or by central differences (one-sided
  // next to a bound, so that the residual is never evaluated outside the bounds).
  Eigen::MatrixXd jacobian_natural() {
    const Eigen::Index n_free = static_cast<Eigen::Index>(free_.size());
    Eigen::MatrixXd j(problem_.residual_count, n_free);
    if (problem_.jacobian) {
      Eigen::MatrixXd full(problem_.residual_count, natural_.size());
      problem_.jacobian(natural_, full);
      for (Eigen::Index k = 0; k < n_free; ++k) j.col(k) = full.col(free_[static_cast<std::size_t>(k)]);
      return j;
    }
    for (Eigen::Index k = 0; k < n_free; ++k) {
      const Eigen::Index i = free_[static_cast<std::size_t>(k)];
      const auto& t = transforms_[static_cast<std::size_t>(i)];
      const double p = natural_[i];
      const double step = options_.relative_difference_step * std::max(std::abs(p), 1e-3);
      const double up = std::min(p + step, t.has_upper() ? t.upper : p + step);
      const double down = std::max(p - step, t.has_lower() ? t.lower : p - step);
      Eigen::VectorXd shifted = natural_;
      shifted[i] = up;
      const Eigen::VectorXd r_up = residuals_of(shifted);
      shifted[i] = down;
      const Eigen::VectorXd r_down = residuals_of(shifted);
      j.col(k) = (r_up - r_down) / (up - down);
    }
    return j;
  }

  // Also keeps dr/dp at u for the covariance: the last Jacobian taken is always at the
  // current point, because it is retaken after every accepted step.
  Eigen::MatrixXd jacobian_u(const Eigen::VectorXd& u) {
    to_natural(u);
    jacobian_natural_ = jacobian_natural();
    Eigen::MatrixXd j = jacobian_natural_;
    for (Eigen::Index k = 0; k < j.cols(); ++k)
      j.col(k) *= transforms_[static_cast<std::size_t>(free_[static_cast<std::size_t>(k)])].slope(u[k]);
    return j;
  }

  void covariance(LeastSquaresResult& result) {
    const Eigen::Index count = natural_.size();
    const Eigen::Index n_free = static_cast<Eigen::Index>(free_.size());
    result.degrees_of_freedom = static_cast<int>(problem_.residual_count - n_free);
    result.standard_errors = Eigen::VectorXd::Constant(count, std::nan(""));
    if (result.degrees_of_freedom <= 0) {
      result.covariance_note =
          "as many data as free parameters: no degrees of freedom left to estimate the error variance";
      return;
    }
    const Eigen::MatrixXd& j = jacobian_natural_;
    const Eigen::JacobiSVD<Eigen::MatrixXd> svd(j, Eigen::ComputeThinV);
    const Eigen::VectorXd sigma = svd.singularValues();
    if (!(sigma.minCoeff() > 1e-12 * sigma.maxCoeff())) {
      result.covariance_note =
          "the Jacobian is rank deficient at the optimum: some parameters cannot be told apart by these data";
      return;
    }
    const double s2 = result.sum_of_squares / result.degrees_of_freedom;
    const Eigen::MatrixXd v = svd.matrixV();
    Eigen::MatrixXd free_cov = s2 * v * sigma.cwiseInverse().cwiseAbs2().asDiagonal() * v.transpose();
    free_cov = 0.5 * (free_cov + free_cov.transpose()).eval();  // exactly symmetric
    result.covariance = Eigen::MatrixXd::Zero(count, count);
    result.correlation = Eigen::MatrixXd::Identity(count, count);
    for (Eigen::Index a = 0; a < n_free; ++a)
      for (Eigen::Index b = 0; b < n_free; ++b)
        result.covariance(free_[static_cast<std::size_t>(a)], free_[static_cast<std::size_t>(b)]) = free_cov(a, b);
    for (Eigen::Index i = 0; i < count; ++i) result.standard_errors[i] = std::sqrt(result.covariance(i, i));
    for (Eigen::Index a : free_)
      for (Eigen::Index b : free_)
        result.correlation(a, b) = result.covariance(a, b) / (result.standard_errors[a] * result.standard_errors[b]);
  }

  const LeastSquaresProblem& problem_;
  const LeastSquaresOptions& options_;
  std::vector<Transform> transforms_;
  std::vector<Eigen::Index> free_;
  Eigen::VectorXd natural_;
  Eigen::MatrixXd jacobian_natural_;
  int evaluations_ = 0;
};

}  // namespace

std::string_view describe(StopReason reason) {
  switch (reason) {
    case StopReason::small_gradient: return "converged: gradient below tolerance";
    case StopReason::small_step: return "converged: parameter step below tolerance";
    case StopReason::iteration_limit: return "stopped at the iteration limit before converging";
    case StopReason::no_further_progress: return "stopped: no step reduces the sum of squares any further";
    case StopReason::small_decrease:
      return "converged: the last step lowered the sum of squares by less than the tolerance";
    case StopReason::small_predicted_decrease:
      return "converged: the linearised model predicts no step can lower the sum of squares by the tolerance";
    case StopReason::budget_spent: return "stopped: the limit on model runs was reached";
  }
  return "unknown stop reason";
}

LeastSquaresResult solve_least_squares(const LeastSquaresProblem& problem, const Eigen::VectorXd& start,
                                       const LeastSquaresOptions& options) {
  return Solver(problem, options).run(start);
}

LeastSquaresResult solve_least_squares_multistart(const LeastSquaresProblem& problem,
                                                  std::span<const Eigen::VectorXd> starts,
                                                  const LeastSquaresOptions& options) {
  if (starts.empty()) throw base::InputError("least squares: no starting points given");
  std::optional<LeastSquaresResult> best;
  for (const auto& start : starts) {
    auto result = solve_least_squares(problem, start, options);
    if (!best || result.sum_of_squares < best->sum_of_squares) best = std::move(result);
  }
  return *best;
}

}  // namespace wetfront::studies
