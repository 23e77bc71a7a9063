// Bounded nonlinear least squares by Levenberg-Marquardt: minimise S(p) = sum r_i(p)^2 over
// parameters p with simple bounds, for retention fitting now and column-model calibration later.
//
// Bounds are kept by a change of variables p = T(u) with u unconstrained (Press et al.,
// Numerical Recipes, 3rd ed., sec. 15.5 style transforms; common practice):
//   both bounds:   p = lo + (hi - lo) / (1 + exp(-u))     (logistic)
//   lower only:    p = lo + exp(u)                         (e.g. alpha > 0, n - 1 > 0)
//   upper only:    p = hi - exp(u)
//   none:          p = u
// The iteration runs in u; the damping update follows Madsen, Nielsen & Tingleff (2004,
// "Methods for non-linear least squares problems", IMM DTU, sec. 3.2, eq. 3.16 and the gain
// ratio of eq. 2.18). The covariance is computed at the optimum in the natural parameters p:
//   cov = s^2 (J^T J)^-1,  s^2 = S / (N - p_free),  J = dr/dp (free parameters only).
#pragma once

#include <functional>
#include <limits>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include <Eigen/Dense>
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {

struct BoundedParameter {
  std::string name;                                         // for messages and reports
  double lower = -std::numeric_limits<double>::infinity();  // natural units of the parameter
  double upper = std::numeric_limits<double>::infinity();
  bool fixed = false;  // held at its starting value
};

// Residuals r(p), length residual_count, evaluated at natural parameters p.
using ResidualFunction = std::function<void(const Eigen::VectorXd& parameters, Eigen::VectorXd& residuals)>;
// Optional analytic Jacobian dr/dp (residual_count x parameter count) at natural parameters.
using JacobianFunction = std::function<void(const Eigen::VectorXd& parameters, Eigen::MatrixXd& jacobian)>;

struct LeastSquaresProblem {
  std::vector<BoundedParameter> parameters;
  Eigen::Index residual_count = 0;
  ResidualFunction residuals;
  JacobianFunction jacobian;  // empty: central differences in the natural parameters
};

struct LeastSquaresOptions {
  int max_iterations = 500;
  double gradient_tolerance = 1e-12;    // stop when max |J_u^T r| <= this * (1 + S)
  double step_tolerance = 1e-12;        // stop when |du| <= this * (|u| + this)
  double initial_damping_scale = 1e-3;  // mu0 = this * max diag(J_u^T J_u) (Madsen et al. eq. 3.14)
  // Central-difference step for numerical Jacobians, relative to max(|p|, 1e-3): about the cube
  // root of machine epsilon balances truncation against rounding (common practice).
  double relative_difference_step = 1e-5;
  // Stop after an accepted step that lowers S by less than this fraction of S, or before a step
  // when the Gauss-Newton step's predicted decrease is below it (0: never). For residuals from
  // a numerical model, whose S is only as smooth as the model's tolerances.
  double relative_decrease_tolerance = 0.0;
  // Asked before every step; true stops the run (StopReason::budget_spent), for a caller that
  // limits how many expensive residual evaluations a fit may take.
  std::function<bool()> budget_spent;
};

enum class StopReason {
  small_gradient,       // first-order optimality reached
  small_step,           // parameters stopped moving
  iteration_limit,      // max_iterations reached without meeting a tolerance
  no_further_progress,  // damping grew without finding a decrease (flat or noisy objective)
  small_decrease,       // an accepted step lowered S by less than relative_decrease_tolerance
  small_predicted_decrease,  // the Gauss-Newton step would lower S by less than that tolerance
  budget_spent          // options.budget_spent said stop
};
std::string_view describe(StopReason reason);

struct LeastSquaresResult {
  Eigen::VectorXd parameters;   // natural units, all parameters (fixed ones unchanged)
  Eigen::VectorXd residuals;    // at the optimum
  double sum_of_squares = 0.0;  // S = r^T r
  int degrees_of_freedom = 0;   // N - number of free parameters
  // Covariance and correlation of all parameters; rows and columns of fixed parameters are
  // zero (correlation: 1 on the diagonal). Empty when not available (see covariance_note).
  Eigen::MatrixXd covariance;
  Eigen::MatrixXd correlation;
  Eigen::VectorXd standard_errors;  // sqrt(diag(covariance)); NaN when unavailable
  std::string covariance_note;      // why the covariance is unavailable, else empty
  // Names of free parameters that ended within 1e-6 (relative to the bound width, or to
  // max(1, |bound|) for a one-sided bound) of a bound: the fit pressed against the bound, and
  // their standard errors describe the curvature there, not a confidence interval.
  std::vector<std::string> at_bound;
  StopReason stop_reason = StopReason::iteration_limit;
  int iterations = 0;
  int residual_evaluations = 0;
  // dr/dp of the free parameters at the optimum (columns in parameter order, fixed ones left
  // out), from which the covariance is computed.
  Eigen::MatrixXd jacobian;
  bool converged() const {
    return stop_reason == StopReason::small_gradient || stop_reason == StopReason::small_step ||
           stop_reason == StopReason::small_decrease || stop_reason == StopReason::small_predicted_decrease;
  }
};

// One Levenberg-Marquardt run from `start` (natural parameters; values on or outside a bound
// are moved just inside it). Throws base::InputError for inconsistent problems
// (bounds with lower >= upper, sizes that do not match, fewer residuals than free parameters).
LeastSquaresResult solve_least_squares(const LeastSquaresProblem& problem, const Eigen::VectorXd& start,
                                       const LeastSquaresOptions& options = {});

// Runs from each start and keeps the result with the smallest sum of squares.
LeastSquaresResult solve_least_squares_multistart(const LeastSquaresProblem& problem,
                                                  std::span<const Eigen::VectorXd> starts,
                                                  const LeastSquaresOptions& options = {});

}  // namespace wetfront::studies
