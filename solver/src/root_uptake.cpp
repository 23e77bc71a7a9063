#include "wetfront/solver/root_uptake.hpp"

#include "series_checks.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

namespace wetfront::solver {

namespace {

FeddesResponse crop(double too_wet, double wet_optimum, double dry_high, double dry_low, double wilting) {
  return {too_wet, wet_optimum, dry_high, dry_low, wilting, 0.5, 0.1};
}

// Integral of the table's piecewise-linear density from fraction 0 to x (0 <= x <= 1).
double table_integral(const RootDensityTable& table, double x) {
  const auto& f = table.depth_fraction;
  const auto& r = table.relative_density;
  double total = 0.0;
  for (std::size_t k = 1; k < f.size(); ++k) {
    if (x <= f[k - 1]) break;
    const double right = std::min(x, f[k]);
    const double slope = (r[k] - r[k - 1]) / (f[k] - f[k - 1]);
    const double r_right = r[k - 1] + slope * (right - f[k - 1]);
    total += 0.5 * (r[k - 1] + r_right) * (right - f[k - 1]);  // trapezoid is exact for a line
  }
  return total;
}

// Normalised cumulative root fraction at x = z / L in [0, 1] (L the root depth).
struct CumulativeFraction {
  double root_depth_cm;
  double operator()(const UniformRoots&, double x) const { return x; }
  double operator()(const LinearRoots&, double x) const { return 1.0 - (1.0 - x) * (1.0 - x); }
  double operator()(const ExponentialRoots& e, double x) const {
    const double ratio = root_depth_cm / e.length_scale_cm;  // L / length
    return std::expm1(-ratio * x) / std::expm1(-ratio);
  }
  double operator()(const RootDensityTable& t, double x) const { return table_integral(t, x) / table_integral(t, 1.0); }
};

}  // namespace

// Wesseling et al. (1991), as commonly quoted; from memory (see the header).
FeddesResponse feddes_potatoes() { return crop(-10.0, -25.0, -320.0, -600.0, -16000.0); }
FeddesResponse feddes_sugar_beet() { return crop(-10.0, -25.0, -320.0, -600.0, -16000.0); }
FeddesResponse feddes_wheat() { return crop(0.0, -1.0, -500.0, -900.0, -16000.0); }
FeddesResponse feddes_grass() { return crop(-10.0, -25.0, -200.0, -800.0, -8000.0); }
FeddesResponse feddes_maize() { return crop(-15.0, -30.0, -325.0, -600.0, -8000.0); }

void check_feddes_response(const FeddesResponse& p) {
  const double dry_wettest = std::max(p.dry_optimum_head_high_demand_cm, p.dry_optimum_head_low_demand_cm);
  const double dry_driest = std::min(p.dry_optimum_head_high_demand_cm, p.dry_optimum_head_low_demand_cm);
  if (!(p.too_wet_head_cm >= p.wet_optimum_head_cm && p.wet_optimum_head_cm >= dry_wettest &&
        dry_driest > p.wilting_head_cm))
    throw std::invalid_argument(fmt::format(
        "Feddes heads must satisfy too wet ({}) >= wet optimum ({}) >= dry optimum ({} and {}) > wilting ({}) cm",
        p.too_wet_head_cm, p.wet_optimum_head_cm, p.dry_optimum_head_high_demand_cm,
        p.dry_optimum_head_low_demand_cm, p.wilting_head_cm));
  if (!(p.low_demand_cm_per_d >= 0 && p.high_demand_cm_per_d > p.low_demand_cm_per_d))
    throw std::invalid_argument(fmt::format("Feddes demands must satisfy 0 <= low ({}) < high ({}) cm/d",
                                            p.low_demand_cm_per_d, p.high_demand_cm_per_d));
}

double dry_optimum_head_cm(const FeddesResponse& p, double tp) {
  if (tp >= p.high_demand_cm_per_d) return p.dry_optimum_head_high_demand_cm;
  if (tp <= p.low_demand_cm_per_d) return p.dry_optimum_head_low_demand_cm;
  const double w = (tp - p.low_demand_cm_per_d) / (p.high_demand_cm_per_d - p.low_demand_cm_per_d);
  return p.dry_optimum_head_low_demand_cm + w * (p.dry_optimum_head_high_demand_cm - p.dry_optimum_head_low_demand_cm);
}

StressFactor feddes_stress(const FeddesResponse& p, double h, double tp) {
  if (!(h > p.wilting_head_cm) || h > p.too_wet_head_cm) return {0.0, 0.0};  // NaN falls here too
  if (h > p.wet_optimum_head_cm) {
    const double span = p.too_wet_head_cm - p.wet_optimum_head_cm;
    return {(p.too_wet_head_cm - h) / span, -1.0 / span};
  }
  const double dry_optimum = dry_optimum_head_cm(p, tp);
  if (h >= dry_optimum) return {1.0, 0.0};
  const double span = dry_optimum - p.wilting_head_cm;
  return {(h - p.wilting_head_cm) / span, 1.0 / span};
}

void check_root_distribution(const RootDistribution& distribution) {
  if (const auto* e = std::get_if<ExponentialRoots>(&distribution)) {
    if (!(e->length_scale_cm > 0) || !std::isfinite(e->length_scale_cm))
      throw std::invalid_argument(
          fmt::format("the exponential root length scale must be positive (found {} cm)", e->length_scale_cm));
  } else if (const auto* t = std::get_if<RootDensityTable>(&distribution)) {
    const auto& f = t->depth_fraction;
    const auto& r = t->relative_density;
    if (f.size() < 2 || f.size() != r.size())
      throw std::invalid_argument("a root density table needs at least two rows and one density per depth");
    if (f.front() != 0.0 || f.back() != 1.0)
      throw std::invalid_argument("root density table fractions of the root depth must run from 0 to 1");
    for (std::size_t k = 1; k < f.size(); ++k)
      if (!(f[k] > f[k - 1])) throw std::invalid_argument("root density table fractions must increase");
    for (double v : r)
      if (!(v >= 0) || !std::isfinite(v))
        throw std::invalid_argument(fmt::format("root densities must be finite and not negative (found {})", v));
    if (!(table_integral(*t, 1.0) > 0)) throw std::invalid_argument("a root density table must not be all zero");
  }
}

double root_fraction_above(const RootDistribution& distribution, double root_depth_cm, double depth_cm) {
  if (!(root_depth_cm > 0) || depth_cm <= 0) return 0.0;
  if (depth_cm >= root_depth_cm) return 1.0;
  const double x = depth_cm / root_depth_cm;
  return std::visit([&](const auto& shape) { return CumulativeFraction{root_depth_cm}(shape, x); }, distribution);
}

std::vector<double> root_fractions_per_cell(const RootDistribution& distribution, double root_depth_cm,
                                            std::span<const double> faces) {
  std::vector<double> fractions(faces.size() - 1, 0.0);
  if (!(root_depth_cm > 0)) return fractions;
  // The column bottom holds roots that would reach deeper.
  const double depth = std::min(root_depth_cm, faces.back());
  double above = 0.0;
  for (std::size_t i = 0; i + 1 < faces.size(); ++i) {
    const double below = root_fraction_above(distribution, depth, faces[i + 1]);
    fractions[i] = below - above;
    above = below;
  }
  return fractions;
}

RootUptake::RootUptake(RootUptakeSettings settings, const Grid& grid) : settings_(std::move(settings)) {
  check_feddes_response(settings_.response);
  check_root_distribution(settings_.distribution);
  detail::check_step_series(settings_.root_depth_cm, "root depth", true);
  detail::check_step_series(settings_.potential_transpiration_cm_per_d, "potential transpiration", true);
  const auto faces = grid.face_depths_cm();
  face_depths_cm_.assign(faces.begin(), faces.end());
  for (std::size_t i = 0; i < grid.cell_count(); ++i) cell_thickness_cm_.push_back(grid.cell_thickness_cm(i));
  for (double root_depth : settings_.root_depth_cm.values)
    fractions_per_depth_period_.push_back(root_fractions_per_cell(settings_.distribution, root_depth, faces));
}

void RootUptake::evaluate(double t, std::span<const double> cell_depths_cm, std::span<const double> head_cm,
                          std::span<double> rate_per_day, std::span<double> rate_slope) const {
  // The leading n cells of the column (the solver passes only those the roots can reach).
  const std::size_t n = cell_depths_cm.size();
  if (n > cell_thickness_cm_.size() || head_cm.size() != n || rate_per_day.size() != n || rate_slope.size() != n)
    throw std::invalid_argument(fmt::format("root uptake was set up for {} cells but is evaluated on {}",
                                            cell_thickness_cm_.size(), cell_depths_cm.size()));
  const auto& depth_starts = settings_.root_depth_cm.start_days;
  const auto it = std::upper_bound(depth_starts.begin(), depth_starts.end(), t);
  const auto period = it == depth_starts.begin() ? 0 : static_cast<std::size_t>(it - depth_starts.begin()) - 1;
  const auto& fractions = fractions_per_depth_period_[period];
  const double tp = settings_.potential_transpiration_cm_per_d.at(t);
  for (std::size_t i = 0; i < n; ++i) {
    if (fractions[i] == 0.0 || tp == 0.0) {
      rate_per_day[i] = rate_slope[i] = 0.0;
      continue;
    }
    const double demand = fractions[i] / cell_thickness_cm_[i] * tp;  // 1/d without stress
    const auto alpha = feddes_stress(settings_.response, head_cm[i], tp);
    rate_per_day[i] = alpha.value * demand;
    rate_slope[i] = alpha.slope_per_cm * demand;
  }
}

double RootUptake::deepest_depth_cm() const {
  const auto& depths = settings_.root_depth_cm.values;
  return std::min(*std::max_element(depths.begin(), depths.end()), face_depths_cm_.back());
}

std::vector<double> RootUptake::breakpoints_days() const {
  std::vector<double> t = settings_.root_depth_cm.start_days;
  const auto& tp = settings_.potential_transpiration_cm_per_d.start_days;
  t.insert(t.end(), tp.begin(), tp.end());
  std::sort(t.begin(), t.end());
  t.erase(std::unique(t.begin(), t.end()), t.end());
  return t;
}

}  // namespace wetfront::solver
