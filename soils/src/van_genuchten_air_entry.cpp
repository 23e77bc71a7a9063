// van Genuchten-Mualem with an air-entry head h_e (Ippisch, Vogel & Bastian 2006, eq. 9-11):
//   Se = S(h) / S(h_e) for h < h_e, 1 otherwise, with S the plain van Genuchten curve;
//   K  = Ks Se^l [ f(h) / f(h_e) ]^2, f = 1 - (1 - S^(1/m))^m the Mualem factor.
#include <cmath>

#include "model_formulas.hpp"

namespace wetfront::soils::detail {

SaturationAndSlope saturation(const VanGenuchtenAirEntry& p, double h) {
  if (h >= p.air_entry_head_cm) return {1.0, 0.0};
  const double cutoff = saturation(p.base, p.air_entry_head_cm).saturation;
  const auto s = saturation(p.base, h);
  return {s.saturation / cutoff, s.slope_per_cm / cutoff};
}

ConductivityAndSlope conductivity(const VanGenuchtenAirEntry& p, double h) {
  const double ks = p.base.saturated_conductivity_cm_per_d;
  if (h >= p.air_entry_head_cm) return {ks, 0.0};
  const double l = p.base.pore_connectivity;
  const auto [se, dse] = saturation(p, h);
  if (se <= 0.0) return {0.0, 0.0};  // Se underflowed: K and dK/dh are zero to machine precision
  const auto [f, df] = mualem_factor(p.base, h);
  const double fc = mualem_factor(p.base, p.air_entry_head_cm).factor;
  const double se_l = std::pow(se, l);
  const double r = f / fc;
  return {ks * se_l * r * r, ks * (l * se_l / se * r * r * dse + se_l * 2.0 * r * df / fc)};
}

double head_at_saturation(const VanGenuchtenAirEntry& p, double se) {
  if (se >= 1.0) return p.air_entry_head_cm;
  const double cutoff = saturation(p.base, p.air_entry_head_cm).saturation;
  return head_at_saturation(p.base, se * cutoff);
}

}  // namespace wetfront::soils::detail
