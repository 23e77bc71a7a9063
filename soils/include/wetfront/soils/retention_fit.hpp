// Fitting the van Genuchten (1980) retention curve, m = 1 - 1/n,
//   theta(s) = theta_r + (theta_s - theta_r) [1 + (alpha s)^n]^(-m),   s = suction (cm) >= 0,
// to measured (suction, water content) points by bounded least squares (least_squares.hpp).
// Parameters are bounded through transforms: theta_r and theta_s logistic between their
// bounds, alpha = exp(u) (> 0), n = 1 + exp(u) (> 1).
#pragma once

#include <Eigen/Dense>
#include <cmath>
#include <optional>
#include <span>
#include <string>
#include <vector>

#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/studies/least_squares.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

struct RetentionPoint {
  double suction_cm = 0.0;     // matric suction, cm of water (>= 0; pressure head = -suction)
  double water_content = 0.0;  // volumetric, cm3/cm3, in (0, 1)
};

// The four retention parameters (no conductivity: retention data say nothing about Ks).
struct RetentionParameters {
  double residual_water_content = 0.0;   // theta_r, cm3/cm3
  double saturated_water_content = 0.0;  // theta_s, cm3/cm3
  double alpha_per_cm = 0.0;             // alpha, 1/cm
  double n = 0.0;                        // n > 1
};

// van Genuchten water content at a suction (cm), the fitted model.
double van_genuchten_water_content(const RetentionParameters& p, double suction_cm);

// A point may hold up to this much more water than a point at lower suction of the same
// sample and still be fitted (with a note): ordinary lab noise of weighed cores is about
// 0.01 cm3/cm3 (common practice). A larger rise is an error.
inline constexpr double kRetentionNoiseTolerance = 0.01;

struct RetentionFitOptions {
  std::optional<double> fixed_residual_water_content;    // hold theta_r at this value
  std::optional<double> fixed_saturated_water_content;   // hold theta_s at this value
  double residual_lower = 0.0, residual_upper = 0.5;     // bounds on theta_r, cm3/cm3
  double saturated_lower = 0.05, saturated_upper = 1.0;  // bounds on theta_s, cm3/cm3
  studies::LeastSquaresOptions solver;
  // Water content must not rise with suction within one sample; points pooled from several
  // samples (replicate cores with different theta_s) are not held to it.
  bool one_sample = true;
};

struct RetentionFit {
  RetentionParameters parameters;
  RetentionParameters standard_errors;  // NaN when unavailable; 0 for a fixed parameter
  // Correlation of (theta_r, theta_s, alpha, n) in that order, natural parameters; empty when
  // unavailable (see covariance_note).
  Eigen::Matrix4d correlation = Eigen::Matrix4d::Constant(std::nan(""));
  std::string covariance_note;
  std::vector<std::string> at_bound;  // parameters pressed against a bound (see least_squares.hpp)
  std::vector<std::string> notes;     // points fitted although they rise within the noise tolerance
  double sum_of_squares = 0.0;        // (cm3/cm3)^2
  double rmse = 0.0;                  // sqrt(SSE / N), cm3/cm3
  double r_squared = 0.0;             // 1 - SSE / sum (theta_i - mean)^2
  int point_count = 0;
  int free_parameter_count = 0;
  studies::StopReason stop_reason = studies::StopReason::iteration_limit;
  int iterations = 0;  // of the best start
  int starts_tried = 0;
  bool converged() const {
    return stop_reason == studies::StopReason::small_gradient || stop_reason == studies::StopReason::small_step;
  }
};

// Checks the points (throws base::InputError naming the offending points: water contents
// outside (0, 1), negative or non-finite suctions, a water content that rises although the
// suction rises, fewer points than free parameters) and fits from several starting points,
// keeping the best. Points may come in any order.
RetentionFit fit_van_genuchten_retention(std::span<const RetentionPoint> points,
                                         const RetentionFitOptions& options = {});

// The fitted curve with a conductivity added, ready for the column model.
VanGenuchtenMualem with_conductivity(const RetentionParameters& p, double saturated_conductivity_cm_per_d,
                                     double pore_connectivity = 0.5);

}  // namespace wetfront::soils
