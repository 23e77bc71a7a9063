// How parameter uncertainty carries into model outputs (recharge), two ways:
//
// First order (linearised; e.g. Bard 1974 ch. 7; common practice): with sensitivities
// s = d output / d parameter (search scale) and parameter covariance C,
//   var(output) = s^T C s,  interval = estimate +- 1.96 sd (95 % if the output is normal).
// The share of parameter k in that variance is s_k (C s)_k / var: the shares sum to one; a
// negative share means the parameter's correlation with others narrows the band.
//
// Sampled: parameter sets drawn from the normal distribution N(best, C) on the search scale,
// each run through the model, and percentiles of the outputs taken over the runs. Draws outside
// a parameter's range are drawn again (a truncated normal), so every set is one the model
// accepts. Percentiles interpolate linearly between order statistics (Hyndman & Fan 1996,
// definition 7).
#pragma once

#include <cstdint>
#include <span>
#include <vector>

#include <Eigen/Dense>

#include "wetfront/studies/parameter_space.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {

struct FirstOrderInterval {
  double estimate = 0;
  double standard_deviation = 0;
  double lower = 0;                    // estimate - 1.96 sd
  double upper = 0;                    // estimate + 1.96 sd
  std::vector<double> variance_share;  // per parameter; all zero when the variance is zero
};

// One interval per output. Throws base::InputError when the shapes disagree.
std::vector<FirstOrderInterval> first_order_intervals(const Eigen::VectorXd& estimates,
                                                      const Eigen::MatrixXd& sensitivity,
                                                      const Eigen::MatrixXd& covariance);

// `count` sets (natural units) from N(mean, covariance) on the search scale, truncated to the
// parameters' ranges. Throws base::InputError for shapes that disagree, a covariance that
// is not symmetric positive semi-definite, or a range the distribution almost never reaches.
std::vector<ParameterSet> draw_parameter_sets(std::span<const AdjustableParameter> parameters,
                                              const Eigen::VectorXd& mean, const Eigen::MatrixXd& covariance,
                                              std::size_t count, std::uint64_t seed);

// The q-th quantile (0 <= q <= 1) of the values; NaN for no values.
double percentile(std::vector<double> values, double q);

}  // namespace wetfront::studies
