#include "steady_flux_profile.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <utility>

#include "adaptive_simpson.hpp"

namespace wetfront::reference {

SteadyFluxProfile::SteadyFluxProfile(soils::HydraulicModel model, double flux_cm_per_d, double quadrature_tolerance_cm,
                                     double base_head_cm)
    : model_(std::move(model)),
      flux_cm_per_d_(flux_cm_per_d),
      tolerance_cm_(quadrature_tolerance_cm),
      base_head_cm_(base_head_cm),
      asymptotic_head_cm_(-std::numeric_limits<double>::infinity()) {
  if (!(flux_cm_per_d < soils::saturated_conductivity(model_)))
    throw std::domain_error("steady flux must be below the saturated conductivity");
  if (flux_cm_per_d > 0.0) {
    // K is increasing in h: bisect for K(h) = q.
    double lower = -1.0;
    while (soils::conductivity(model_, lower) > flux_cm_per_d) lower *= 2.0;
    double upper = 0.0;
    for (int i = 0; i < 200 && upper - lower > 1e-15 * std::abs(lower); ++i) {
      const double middle = 0.5 * (lower + upper);
      (soils::conductivity(model_, middle) > flux_cm_per_d ? upper : lower) = middle;
    }
    asymptotic_head_cm_ = 0.5 * (lower + upper);
  }
  if (base_head_cm > 0.0) throw std::domain_error("base head must be <= 0");
  if (!(base_head_cm > asymptotic_head_cm_))
    throw std::domain_error("base head at or below the asymptotic head: the head would rise with height");
}

double SteadyFluxProfile::slope(double h) const { return 1.0 / (flux_cm_per_d_ / soils::conductivity(model_, h) - 1.0); }

double SteadyFluxProfile::height_above_table_cm(double head_cm) const {
  if (head_cm > base_head_cm_) throw std::domain_error("head above the base head");
  if (!(head_cm > asymptotic_head_cm_)) throw std::domain_error("head at or below the asymptotic head");
  // z(h) = integral_h^h0 dh / (1 - q/K) = -integral_h^h0 slope, h0 the base head.
  if (!std::isfinite(asymptotic_head_cm_))
    return adaptive_simpson([this](double h) { return -slope(h); }, head_cm, base_head_cm_, tolerance_cm_);
  // Infiltration: the integrand grows like 1/(h - h_q) near the asymptote h_q. With
  // h = h_q + e^s the integrand e^s / (1 - q/K) stays bounded and smooth.
  const double h_q = asymptotic_head_cm_;
  return adaptive_simpson([this, h_q](double s) { return -slope(h_q + std::exp(s)) * std::exp(s); },
                          std::log(head_cm - h_q), std::log(base_head_cm_ - h_q), tolerance_cm_);
}

double SteadyFluxProfile::pressure_head_cm(double height_cm) const {
  if (height_cm < 0.0) throw std::domain_error("height below the water table");
  if (height_cm == 0.0) return base_head_cm_;
  // Bracket [lower, upper] with z(lower) >= height >= z(upper); z decreases with h.
  double upper = base_head_cm_;
  double lower;
  if (std::isfinite(asymptotic_head_cm_)) {
    lower = asymptotic_head_cm_ + 1e-12 * std::abs(asymptotic_head_cm_);
  } else {
    lower = base_head_cm_ - height_cm;  // |dz/dh| <= 1 when q <= 0, so z(h0 - height) <= height
    while (height_above_table_cm(lower) < height_cm) lower *= 2.0;
  }
  double h = std::max(base_head_cm_ - height_cm, 0.5 * (lower + upper));
  if (!(h > lower)) h = 0.5 * (lower + upper);
  for (int iteration = 0; iteration < 200; ++iteration) {
    const double residual = height_above_table_cm(h) - height_cm;
    if (residual > 0.0) lower = h; else upper = h;
    const double step = residual / slope(h);  // Newton on z(h) - height
    if (std::abs(residual) < 1e-10 || std::abs(step) < 1e-11 || upper - lower < 1e-13) return h;
    double next = h - step;
    if (!(next > lower && next < upper)) next = 0.5 * (lower + upper);
    h = next;
  }
  throw std::runtime_error("steady profile inversion did not converge");
}

LayeredSteadyFluxProfile::LayeredSteadyFluxProfile(std::vector<SteadyLayer> layers_from_table, double flux_cm_per_d) {
  double base_height = 0.0;
  double base_head = 0.0;
  for (auto& layer : layers_from_table) {
    profiles_.emplace_back(std::move(layer.model), flux_cm_per_d, 1e-10, base_head);
    layer_base_heights_cm_.push_back(base_height);
    base_height += layer.thickness_cm;
    base_head = profiles_.back().pressure_head_cm(layer.thickness_cm);
  }
}

double LayeredSteadyFluxProfile::pressure_head_cm(double height_cm) const {
  std::size_t k = layer_base_heights_cm_.size() - 1;
  while (k > 0 && height_cm < layer_base_heights_cm_[k]) --k;
  return profiles_[k].pressure_head_cm(height_cm - layer_base_heights_cm_[k]);
}

}  // namespace wetfront::reference
