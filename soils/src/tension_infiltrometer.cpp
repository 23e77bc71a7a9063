// Tension disc infiltrometer analysis (Wooding 1968); equations in tension_infiltrometer.hpp.
#include "wetfront/soils/tension_infiltrometer.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {
namespace {

constexpr double pi = std::numbers::pi;

// The bracket of eq. (1) times the disc area: Q = wooding_area * K(h0), cm2.
double wooding_area_cm2(double disc_radius_cm, double alpha_per_cm) {
  return pi * disc_radius_cm * disc_radius_cm * (1.0 + 4.0 / (pi * disc_radius_cm * alpha_per_cm));
}

}  // namespace

double disc_inflow(double supply_head_cm, double disc_radius_cm, double saturated_conductivity_cm_per_d,
                   double alpha_per_cm) {
  const double conductivity = saturated_conductivity_cm_per_d * std::exp(alpha_per_cm * supply_head_cm);
  return wooding_area_cm2(disc_radius_cm, alpha_per_cm) * conductivity;
}

DiscResult analyse_disc(std::span<const DiscFlow> flows, double disc_radius_cm) {
  if (!(disc_radius_cm > 0.0) || !std::isfinite(disc_radius_cm)) {
    throw base::InputError(fmt::format("disc radius must be positive, got {} cm", disc_radius_cm));
  }
  if (flows.size() < 2) {
    throw base::InputError(
        fmt::format("the disc analysis needs steady flows at two or more supply heads, got {}", flows.size()));
  }
  std::vector<DiscFlow> sorted(flows.begin(), flows.end());
  for (const auto& f : sorted) {
    if (!(f.supply_head_cm < 0.0) || !std::isfinite(f.supply_head_cm)) {
      throw base::InputError(
          fmt::format("supply heads must be negative (below atmospheric pressure), got {} cm", f.supply_head_cm));
    }
    if (!(f.steady_inflow_cm3_per_d > 0.0) || !std::isfinite(f.steady_inflow_cm3_per_d)) {
      throw base::InputError(fmt::format("the steady flow at {} cm must be positive, got {} cm3/d", f.supply_head_cm,
                                         f.steady_inflow_cm3_per_d));
    }
  }
  std::sort(sorted.begin(), sorted.end(),
            [](const DiscFlow& a, const DiscFlow& b) { return a.supply_head_cm < b.supply_head_cm; });
  for (std::size_t i = 1; i < sorted.size(); ++i) {
    if (sorted[i].supply_head_cm == sorted[i - 1].supply_head_cm) {
      throw base::InputError(
          fmt::format("supply head {} cm appears twice; give one steady flow per head", sorted[i].supply_head_cm));
    }
  }

  DiscResult result;
  for (std::size_t i = 0; i + 1 < sorted.size(); ++i) {
    const DiscFlow& drier = sorted[i];
    const DiscFlow& wetter = sorted[i + 1];
    // Eq. (2); with h1 the wetter head, ln(Q_wet / Q_dry) / (h_wet - h_dry) > 0.
    const double alpha = std::log(wetter.steady_inflow_cm3_per_d / drier.steady_inflow_cm3_per_d) /
                         (wetter.supply_head_cm - drier.supply_head_cm);
    if (!(alpha > 0.0)) {
      throw base::InputError(fmt::format(
          "the flow at {} cm ({:.4g} cm3/d) is not larger than at the drier {} cm ({:.4g} cm3/d); the Gardner "
          "model needs flow to rise toward saturation (check the readings or the disc contact)",
          wetter.supply_head_cm, wetter.steady_inflow_cm3_per_d, drier.supply_head_cm, drier.steady_inflow_cm3_per_d));
    }
    result.pairs.push_back({{drier.supply_head_cm, wetter.supply_head_cm}, alpha});
  }

  // K at each head with the pair reaching to the next wetter head; the wettest head uses
  // the wettest pair.
  for (std::size_t i = 0; i < sorted.size(); ++i) {
    const PairSlope& pair = result.pairs[std::min(i, result.pairs.size() - 1)];
    const double conductivity = sorted[i].steady_inflow_cm3_per_d / wooding_area_cm2(disc_radius_cm, pair.alpha_per_cm);
    result.conductivities.push_back({sorted[i].supply_head_cm, conductivity, pair.heads});
  }

  const PairSlope& wettest = result.pairs.back();
  const HeadConductivity& wettest_k = result.conductivities.back();
  // Eq. (3).
  result.saturated_conductivity_cm_per_d =
      wettest_k.conductivity_cm_per_d * std::exp(-wettest.alpha_per_cm * wettest_k.supply_head_cm);
  result.saturated_from = wettest.heads;
  return result;
}

}  // namespace wetfront::soils
