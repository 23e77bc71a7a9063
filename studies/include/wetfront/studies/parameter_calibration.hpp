// Calibration of adjustable parameters against field readings by Levenberg-Marquardt (the
// bounded solver of soils/least_squares.hpp) on each parameter's search scale (linear or
// log10, parameter_space.hpp). The model is a black box that maps a parameter set to weighted
// residuals r_i = (simulated_i - observed_i) / sigma_i and to outputs of interest (recharge).
//
// Jacobian: forward differences on the search scale, step = difference_step x the search
// range (backward at the upper end), all columns of one Jacobian run together as a batch so
// the caller can run them in parallel. Runs are cached, so the outputs' sensitivities at the
// optimum come from the Jacobian's own runs.
//
// Covariance on the search scale: s^2 (J^T J)^-1 with s^2 = S / (N - p) (the residual variance;
// e.g. Bard 1974, Nonlinear Parameter Estimation, ch. 7; common practice), standard errors its
// diagonal's square roots and the correlation matrix from it.
#pragma once

#include <functional>
#include <span>
#include <string>
#include <vector>

#include <Eigen/Dense>

#include "wetfront/studies/parameter_space.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {

// One model run of one parameter set.
struct ModelRun {
  bool ok = false;
  std::string failure;        // why the run did not give residuals, when !ok
  Eigen::VectorXd residuals;  // weighted; the same length for every run of a problem
  Eigen::VectorXd outputs;    // quantities of interest, e.g. season and per-visit recharge
};

// Runs every set (natural units) and returns one ModelRun per set, in order. May run them in
// parallel; must not throw for a failed run (ok = false instead).
using ModelBatch = std::function<std::vector<ModelRun>(const std::vector<ParameterSet>& sets)>;

struct CalibrationOptions {
  // Model runs in all: a step is not started when it could exceed the limit (a retried
  // difference step after a failed run may still add one run per parameter).
  int max_runs = 200;
  int max_iterations = 50;
  double difference_step = 0.01;              // fraction of each search range
  double relative_decrease_tolerance = 1e-3;  // converged when a step gains less than this fraction
  // Warnings: a standard error above this fraction of the search range, or a correlation
  // beyond this magnitude, marks a parameter as poorly resolved by the data.
  double poorly_resolved_fraction = 0.25;
  double correlation_limit = 0.95;
};

struct CalibrationResult {
  std::vector<AdjustableParameter> parameters;
  ParameterSet start;  // natural units (moved just inside the range if on an end)
  ParameterSet best;
  Eigen::VectorXd best_search;      // search scale
  Eigen::VectorXd standard_errors;  // search scale; NaN when the covariance is unavailable
  Eigen::MatrixXd covariance;       // search scale; empty when unavailable
  Eigen::MatrixXd correlation;      // empty when unavailable
  std::string covariance_note;      // why it is unavailable
  std::string stop_reason;
  bool converged = false;
  int runs = 0;  // model runs made
  int iterations = 0;
  ModelRun at_start;
  ModelRun at_best;
  Eigen::MatrixXd output_sensitivity;  // outputs x parameters: d output / d search value at best
  std::vector<std::string> warnings;   // parameters the data do not resolve, ends of ranges
  int residual_count() const { return static_cast<int>(at_best.residuals.size()); }
};

// Throws base::InputError for bad parameters, fewer residuals than parameters, or a
// model that fails at the start (with its reason); std::runtime_error when the model fails on
// both sides of a difference step.
CalibrationResult calibrate(std::span<const AdjustableParameter> parameters, const ModelBatch& model,
                            const CalibrationOptions& options = {});

}  // namespace wetfront::studies
