// van Genuchten retention fit; see retention_fit.hpp. Residuals r_i = theta(s_i) - theta_i with
// the analytic Jacobian of van Genuchten (1980) eq. 3 in the natural parameters:
//   d theta / d theta_r = 1 - Se,   d theta / d theta_s = Se,
//   d ln Se / d alpha = -m n x^n / (alpha (1 + x^n)),                       x = alpha s,
//   d ln Se / d n     = -ln(1 + x^n) / n^2 - m x^n ln(x) / (1 + x^n),       m = 1 - 1/n.
#include "wetfront/soils/retention_fit.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {
namespace {

enum Index : Eigen::Index { kResidual = 0, kSaturated = 1, kAlpha = 2, kN = 3 };

RetentionParameters from_vector(const Eigen::VectorXd& v) { return {v[kResidual], v[kSaturated], v[kAlpha], v[kN]}; }

std::string describe_point(std::size_t index, const RetentionPoint& p) {
  return fmt::format("point {} (suction {} cm, water content {})", index + 1, p.suction_cm, p.water_content);
}

// Returns a note per rise within kRetentionNoiseTolerance; throws for a larger one.
std::vector<std::string> check_points(std::span<const RetentionPoint> points, bool one_sample) {
  std::vector<std::string> notes;
  for (std::size_t i = 0; i < points.size(); ++i) {
    const auto& p = points[i];
    if (!std::isfinite(p.suction_cm) || p.suction_cm < 0.0)
      throw base::InputError(
          fmt::format("retention data, {}: suction must be a finite number >= 0 cm", describe_point(i, p)));
    if (!(p.water_content > 0.0 && p.water_content < 1.0))
      throw base::InputError(fmt::format(
          "retention data, {}: water content must lie strictly between 0 and 1 (a volume fraction, cm3/cm3, "
          "not percent)",
          describe_point(i, p)));
  }
  if (!one_sample) return notes;
  // Ordered by suction, water content must not rise as suction rises (beyond lab noise).
  std::vector<std::size_t> order(points.size());
  std::iota(order.begin(), order.end(), 0);
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return points[a].suction_cm < points[b].suction_cm; });
  for (std::size_t k = 1; k < order.size(); ++k) {
    const auto& wetter = points[order[k - 1]];
    const auto& drier = points[order[k]];
    if (!(drier.suction_cm > wetter.suction_cm && drier.water_content > wetter.water_content)) continue;
    const double rise = drier.water_content - wetter.water_content;
    if (rise > kRetentionNoiseTolerance)
      throw base::InputError(fmt::format(
          "retention data: {} holds {:.4f} more water than {} although its suction is higher; water "
          "content must decrease as suction increases (rises up to {} are fitted as lab noise)",
          describe_point(order[k], drier), rise, describe_point(order[k - 1], wetter), kRetentionNoiseTolerance));
    notes.push_back(fmt::format(
        "{} holds {:.4f} more water than {} although its suction is higher; fitted as lab "
        "noise (within {})",
        describe_point(order[k], drier), rise, describe_point(order[k - 1], wetter), kRetentionNoiseTolerance));
  }
  return notes;
}

void check_fixed(const char* what, const std::optional<double>& value) {
  if (value && !(*value >= 0.0 && *value < 1.0))
    throw base::InputError(fmt::format("retention fit: fixed {} {} must lie in [0, 1)", what, *value));
}

}  // namespace

double van_genuchten_water_content(const RetentionParameters& p, double suction_cm) {
  if (suction_cm <= 0.0) return p.saturated_water_content;
  const double m = 1.0 - 1.0 / p.n;
  const double se = std::pow(1.0 + std::pow(p.alpha_per_cm * suction_cm, p.n), -m);
  return p.residual_water_content + (p.saturated_water_content - p.residual_water_content) * se;
}

VanGenuchtenMualem with_conductivity(const RetentionParameters& p, double saturated_conductivity_cm_per_d,
                                     double pore_connectivity) {
  return {p.residual_water_content,        p.saturated_water_content, p.alpha_per_cm, p.n,
          saturated_conductivity_cm_per_d, pore_connectivity};
}

RetentionFit fit_van_genuchten_retention(std::span<const RetentionPoint> points, const RetentionFitOptions& options) {
  std::vector<std::string> notes = check_points(points, options.one_sample);
  check_fixed("residual water content", options.fixed_residual_water_content);
  check_fixed("saturated water content", options.fixed_saturated_water_content);
  if (options.fixed_residual_water_content && options.fixed_saturated_water_content &&
      !(*options.fixed_residual_water_content < *options.fixed_saturated_water_content))
    throw base::InputError("retention fit: fixed residual water content must be below the fixed saturated one");
  const int free_count =
      4 - (options.fixed_residual_water_content ? 1 : 0) - (options.fixed_saturated_water_content ? 1 : 0);
  if (static_cast<int>(points.size()) < free_count)
    throw base::InputError(
        fmt::format("retention fit: {} points cannot determine {} free parameters; give at least {} points",
                    points.size(), free_count, free_count));

  const std::vector<RetentionPoint> data(points.begin(), points.end());
  studies::LeastSquaresProblem problem;
  problem.parameters = {{"residual water content", options.residual_lower, options.residual_upper,
                         options.fixed_residual_water_content.has_value()},
                        {"saturated water content", options.saturated_lower, options.saturated_upper,
                         options.fixed_saturated_water_content.has_value()},
                        {"alpha (1/cm)", 0.0, std::numeric_limits<double>::infinity(), false},
                        {"n", 1.0, std::numeric_limits<double>::infinity(), false}};
  problem.residual_count = static_cast<Eigen::Index>(data.size());
  problem.residuals = [&data](const Eigen::VectorXd& v, Eigen::VectorXd& r) {
    const auto p = from_vector(v);
    for (std::size_t i = 0; i < data.size(); ++i)
      r[static_cast<Eigen::Index>(i)] = van_genuchten_water_content(p, data[i].suction_cm) - data[i].water_content;
  };
  problem.jacobian = [&data](const Eigen::VectorXd& v, Eigen::MatrixXd& j) {
    const auto p = from_vector(v);
    const double m = 1.0 - 1.0 / p.n;
    const double range = p.saturated_water_content - p.residual_water_content;
    for (std::size_t i = 0; i < data.size(); ++i) {
      const auto row = static_cast<Eigen::Index>(i);
      const double s = data[i].suction_cm;
      if (s <= 0.0) {
        j.row(row) << 0.0, 1.0, 0.0, 0.0;
        continue;
      }
      const double x = p.alpha_per_cm * s;
      const double xn = std::pow(x, p.n);
      const double log1p_xn = std::log1p(xn);
      const double se = std::exp(-m * log1p_xn);
      const double dlnse_dalpha = -m * p.n * xn / (p.alpha_per_cm * (1.0 + xn));
      const double dlnse_dn = -log1p_xn / (p.n * p.n) - m * xn * std::log(x) / (1.0 + xn);
      j.row(row) << 1.0 - se, se, range * se * dlnse_dalpha, range * se * dlnse_dn;
    }
  };

  // Starting points: theta_s from the wettest point, theta_r at zero and at half the driest
  // point, alpha around the inverse suction of the mid-range water content, n over its
  // usual range for soils (common practice).
  double theta_max = 0.0, theta_min = 1.0;
  for (const auto& p : data) {
    theta_max = std::max(theta_max, p.water_content);
    theta_min = std::min(theta_min, p.water_content);
  }
  const double theta_mid = 0.5 * (theta_max + theta_min);
  const auto mid = std::min_element(data.begin(), data.end(), [&](const auto& a, const auto& b) {
    return std::abs(a.water_content - theta_mid) < std::abs(b.water_content - theta_mid);
  });
  const double alpha_mid = 1.0 / std::max(mid->suction_cm, 1.0);
  const double theta_s0 = options.fixed_saturated_water_content.value_or(theta_max);
  std::vector<Eigen::VectorXd> starts;
  for (const double theta_r0 : {0.0, 0.5 * theta_min})
    for (const double alpha0 : {alpha_mid, 0.003, 0.02, 0.1})
      for (const double n0 : {1.3, 1.8, 2.8}) {
        Eigen::VectorXd s(4);
        s << options.fixed_residual_water_content.value_or(theta_r0), theta_s0, alpha0, n0;
        starts.push_back(s);
        if (options.fixed_residual_water_content && theta_r0 != 0.0) starts.pop_back();  // duplicate
      }
  const studies::LeastSquaresResult best = studies::solve_least_squares_multistart(problem, starts, options.solver);

  RetentionFit fit;
  fit.parameters = from_vector(best.parameters);
  fit.standard_errors = from_vector(best.standard_errors);
  if (best.correlation.size() == 16) fit.correlation = best.correlation;
  fit.covariance_note = best.covariance_note;
  fit.at_bound = best.at_bound;
  fit.notes = std::move(notes);
  fit.sum_of_squares = best.sum_of_squares;
  fit.point_count = static_cast<int>(data.size());
  fit.free_parameter_count = free_count;
  fit.rmse = std::sqrt(best.sum_of_squares / fit.point_count);
  double mean = 0.0;
  for (const auto& p : data) mean += p.water_content / fit.point_count;
  double total = 0.0;
  for (const auto& p : data) total += (p.water_content - mean) * (p.water_content - mean);
  fit.r_squared = total > 0.0 ? 1.0 - best.sum_of_squares / total : std::nan("");
  fit.stop_reason = best.stop_reason;
  fit.iterations = best.iterations;
  fit.starts_tried = static_cast<int>(starts.size());
  return fit;
}

}  // namespace wetfront::soils
