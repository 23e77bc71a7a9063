#include "wetfront/studies/parameter_calibration.hpp"

#include <cmath>
#include <limits>
#include <algorithm>
#include <deque>
#include <utility>
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/studies/least_squares.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {
namespace {

// The model seen by the least-squares solver: search-scale points in, cached runs out.
class CachedModel {
 public:
  CachedModel(std::span<const AdjustableParameter> parameters, const ModelBatch& model,
              const CalibrationOptions& options)
      : parameters_(parameters), model_(model), options_(options) {}

  ParameterSet natural(const Eigen::VectorXd& search) const {
    ParameterSet set;
    for (std::size_t k = 0; k < parameters_.size(); ++k)
      set.push_back(from_search_scale(parameters_[k], search[static_cast<Eigen::Index>(k)]));
    return set;
  }

  // Runs the points not yet cached, as one batch.
  void ensure(const std::vector<Eigen::VectorXd>& points) {
    std::vector<Eigen::VectorXd> missing;
    std::vector<ParameterSet> sets;
    for (const auto& p : points) {
      if (find(p) || std::any_of(missing.begin(), missing.end(), [&](const auto& m) { return same_point(m, p); }))
        continue;
      missing.push_back(p);
      sets.push_back(natural(p));
    }
    if (sets.empty()) return;
    std::vector<ModelRun> runs = model_(sets);
    if (runs.size() != sets.size()) throw std::logic_error("calibration: the model returned the wrong number of runs");
    for (std::size_t i = 0; i < runs.size(); ++i) cache_.push_back({missing[i], std::move(runs[i])});
    runs_made_ += static_cast<int>(sets.size());
  }

  const ModelRun& run(const Eigen::VectorXd& p) {
    ensure({p});
    return *find(p);
  }

  void residuals(const Eigen::VectorXd& p, Eigen::VectorXd& r) {
    const ModelRun& result = run(p);
    if (result.ok && result.residuals.size() == r.size()) {
      r = result.residuals;
    } else {
      r.setConstant(std::numeric_limits<double>::quiet_NaN());  // the solver rejects the step
    }
  }

  // Forward-difference columns of the residuals and the outputs at p.
  void differences(const Eigen::VectorXd& p, Eigen::MatrixXd* residual_jacobian, Eigen::MatrixXd* output_jacobian) {
    const auto count = static_cast<Eigen::Index>(parameters_.size());
    std::vector<Eigen::VectorXd> points{p};
    for (Eigen::Index k = 0; k < count; ++k) points.push_back(shifted(p, k, false));
    ensure(points);
    const ModelRun& base = run(p);
    if (!base.ok)
      throw std::runtime_error(fmt::format("the model failed at the point of a difference step: {}", base.failure));
    if (residual_jacobian) residual_jacobian->resize(base.residuals.size(), count);
    if (output_jacobian) output_jacobian->resize(base.outputs.size(), count);
    for (Eigen::Index k = 0; k < count; ++k) {
      Eigen::VectorXd q = shifted(p, k, false);
      const ModelRun* other = &run(q);
      if (!other->ok) {  // the other side, if the run beyond failed and that side lies in the range
        const auto& parameter = parameters_[static_cast<std::size_t>(k)];
        q = shifted(p, k, true);
        if (q[k] < to_search_scale(parameter, parameter.lower) || q[k] > to_search_scale(parameter, parameter.upper))
          throw std::runtime_error(
              fmt::format("the model failed at a difference step in '{}' ({}) and the other side lies "
                          "outside its range",
                          parameter.name, other->failure));
        other = &run(q);
        if (!other->ok)
          throw std::runtime_error(fmt::format("the model failed on both sides of a difference step in '{}': {}",
                                               parameters_[static_cast<std::size_t>(k)].name, other->failure));
      }
      const double h = q[k] - p[k];
      if (residual_jacobian) residual_jacobian->col(k) = (other->residuals - base.residuals) / h;
      if (output_jacobian) output_jacobian->col(k) = (other->outputs - base.outputs) / h;
    }
  }

  int runs_made() const { return runs_made_; }

 private:
  // The solver maps points through its bound transform and back, which can move the last
  // bits: points that close are the same run.
  static bool same_point(const Eigen::VectorXd& a, const Eigen::VectorXd& b) {
    return ((a - b).array().abs() <= 1e-12 * (1.0 + a.array().abs())).all();
  }
  const ModelRun* find(const Eigen::VectorXd& p) const {
    for (const auto& [point, run] : cache_)
      if (same_point(point, p)) return &run;
    return nullptr;
  }

  double step(Eigen::Index k) const {
    const auto& parameter = parameters_[static_cast<std::size_t>(k)];
    return options_.difference_step *
           (to_search_scale(parameter, parameter.upper) - to_search_scale(parameter, parameter.lower));
  }

  // p moved by one step in parameter k: forward, or backward when forward would leave the
  // range; `other_side` gives the opposite point (for a run that failed on the first side).
  Eigen::VectorXd shifted(const Eigen::VectorXd& p, Eigen::Index k, bool other_side) const {
    const auto& parameter = parameters_[static_cast<std::size_t>(k)];
    const bool forward_fits = p[k] + step(k) <= to_search_scale(parameter, parameter.upper);
    Eigen::VectorXd q = p;
    q[k] = forward_fits != other_side ? p[k] + step(k) : p[k] - step(k);
    return q;
  }

  std::span<const AdjustableParameter> parameters_;
  const ModelBatch& model_;
  const CalibrationOptions& options_;
  std::deque<std::pair<Eigen::VectorXd, ModelRun>> cache_;  // stable references; a few hundred runs at most
  int runs_made_ = 0;
};

void add_resolution_warnings(CalibrationResult& result, const Eigen::MatrixXd& jacobian,
                             const CalibrationOptions& options) {
  const auto& parameters = result.parameters;
  const auto count = static_cast<Eigen::Index>(parameters.size());
  const double largest = jacobian.colwise().norm().maxCoeff();
  for (Eigen::Index k = 0; k < count; ++k) {
    if (!(jacobian.col(k).norm() > 1e-9 * largest)) {
      result.warnings.push_back(
          fmt::format("'{}' does not change the simulated readings at all: these data cannot resolve it; "
                      "fix it at a measured value or add readings it affects",
                      parameters[static_cast<std::size_t>(k)].name));
    }
  }
  if (result.covariance.size() == 0) {
    // Which parameters lie in the directions the data do not see (small singular values).
    const Eigen::JacobiSVD<Eigen::MatrixXd> svd(jacobian, Eigen::ComputeThinV);
    const Eigen::VectorXd sigma = svd.singularValues();
    for (Eigen::Index s = 0; s < sigma.size(); ++s) {
      if (sigma[s] > 1e-6 * sigma[0]) continue;
      for (Eigen::Index k = 0; k < count; ++k) {
        if (std::abs(svd.matrixV()(k, s)) > 0.3 && jacobian.col(k).norm() > 1e-9 * largest)
          result.warnings.push_back(
              fmt::format("'{}' cannot be resolved: the data constrain it only in a fixed combination "
                          "with other parameters",
                          parameters[static_cast<std::size_t>(k)].name));
      }
    }
    return;
  }
  for (Eigen::Index k = 0; k < count; ++k) {
    const auto& p = parameters[static_cast<std::size_t>(k)];
    const double range = to_search_scale(p, p.upper) - to_search_scale(p, p.lower);
    const double se = result.standard_errors[k];
    if (se > options.poorly_resolved_fraction * range) {
      result.warnings.push_back(
          fmt::format("'{}' is poorly resolved: its standard error ({:.3g} on its {} scale) is {:.0f}% of its "
                      "search range",
                      p.name, se, p.scale == ParameterScale::log ? "log10" : "linear", 100 * se / range));
    }
    for (Eigen::Index j = k + 1; j < count; ++j) {
      const double r = result.correlation(k, j);
      if (std::abs(r) > options.correlation_limit) {
        result.warnings.push_back(
            fmt::format("'{}' and '{}' are strongly correlated (r = {:.3f}): the data constrain a "
                        "combination of them rather than each one",
                        p.name, parameters[static_cast<std::size_t>(j)].name, r));
      }
    }
  }
}

}  // namespace

CalibrationResult calibrate(std::span<const AdjustableParameter> parameters, const ModelBatch& model,
                            const CalibrationOptions& options) {
  if (parameters.empty()) throw base::InputError("calibration needs at least one adjustable parameter");
  for (const auto& p : parameters) check_parameter(p);
  const auto count = static_cast<Eigen::Index>(parameters.size());
  if (options.max_runs < 2 * (count + 1))
    throw base::InputError(
        fmt::format("a calibration of {} parameters needs a limit of at least {} model runs", count, 2 * (count + 1)));
  CachedModel cached(parameters, model, options);

  studies::LeastSquaresProblem problem;
  Eigen::VectorXd start(count);
  for (Eigen::Index k = 0; k < count; ++k) {
    const auto& p = parameters[static_cast<std::size_t>(k)];
    problem.parameters.push_back({p.name, to_search_scale(p, p.lower), to_search_scale(p, p.upper), false});
    start[k] = to_search_scale(p, p.start);
  }
  // The start just inside its range, as the solver will take it; its run sizes the residuals.
  for (Eigen::Index k = 0; k < count; ++k) {
    const double width =
        problem.parameters[static_cast<std::size_t>(k)].upper - problem.parameters[static_cast<std::size_t>(k)].lower;
    start[k] = std::clamp(start[k], problem.parameters[static_cast<std::size_t>(k)].lower + 1e-6 * width,
                          problem.parameters[static_cast<std::size_t>(k)].upper - 1e-6 * width);
  }
  const ModelRun first = cached.run(start);
  if (!first.ok) throw base::InputError(fmt::format("the model fails at the starting parameters: {}", first.failure));
  problem.residual_count = first.residuals.size();
  if (problem.residual_count < count)
    throw base::InputError(fmt::format("{} readings cannot determine {} parameters", problem.residual_count, count));
  problem.residuals = [&](const Eigen::VectorXd& p, Eigen::VectorXd& r) { cached.residuals(p, r); };
  problem.jacobian = [&](const Eigen::VectorXd& p, Eigen::MatrixXd& j) { cached.differences(p, &j, nullptr); };

  studies::LeastSquaresOptions lm;
  lm.max_iterations = options.max_iterations;
  lm.gradient_tolerance = 1e-8;
  lm.step_tolerance = 1e-6;
  lm.relative_decrease_tolerance = options.relative_decrease_tolerance;
  // A step costs one run, and one Jacobian (count runs) when accepted.
  lm.budget_spent = [&] { return cached.runs_made() + 1 + count > options.max_runs; };
  const studies::LeastSquaresResult fit = studies::solve_least_squares(problem, start, lm);

  CalibrationResult result;
  result.parameters.assign(parameters.begin(), parameters.end());
  result.start = cached.natural(start);
  result.best_search = fit.parameters;
  result.best = cached.natural(fit.parameters);
  result.standard_errors = fit.standard_errors;
  result.covariance = fit.covariance;
  result.correlation = fit.correlation;
  result.covariance_note = fit.covariance_note;
  result.stop_reason = std::string(studies::describe(fit.stop_reason));
  result.converged = fit.converged();
  result.iterations = fit.iterations;
  result.at_start = first;
  result.at_best = cached.run(fit.parameters);
  cached.differences(fit.parameters, nullptr, &result.output_sensitivity);  // cached: no new runs
  result.runs = cached.runs_made();
  add_resolution_warnings(result, fit.jacobian, options);
  for (const auto& name : fit.at_bound)
    result.warnings.push_back(
        fmt::format("'{}' ended at an end of its range: the best value may lie beyond it, and its standard "
                    "error describes the curvature there, not a confidence interval",
                    name));
  return result;
}

}  // namespace wetfront::studies
