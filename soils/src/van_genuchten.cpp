// van Genuchten (1980) retention with Mualem (1976) conductivity, m = 1 - 1/n.
//   Se = [1 + (alpha |h|)^n]^(-m)                               (van Genuchten 1980, eq. 3)
//   K  = Ks Se^l [1 - (1 - Se^(1/m))^m]^2                         (eq. 8, exponent l)
// Written in x = alpha |h| so that 1 - Se^(1/m) = x^n / (1 + x^n) has no cancellation.
#include <cmath>

#include "model_formulas.hpp"

namespace wetfront::soils::detail {

SaturationAndSlope saturation(const VanGenuchtenMualem& p, double h) {
  if (h >= 0.0) return {1.0, 0.0};
  const double m = 1.0 - 1.0 / p.n;
  const double x = -p.alpha_per_cm * h;
  const double xn = std::pow(x, p.n);
  const double se = std::pow(1.0 + xn, -m);
  // dSe/dh = m n alpha x^(n-1) (1 + x^n)^(-m-1)
  return {se, m * p.n * p.alpha_per_cm * (xn / x) * se / (1.0 + xn)};
}

MualemFactor mualem_factor(const VanGenuchtenMualem& p, double h) {
  if (h >= 0.0) return {1.0, 0.0};
  const double m = 1.0 - 1.0 / p.n;
  const double x = -p.alpha_per_cm * h;
  const double xn = std::pow(x, p.n);
  const double u = xn / (1.0 + xn);  // 1 - Se^(1/m)
  // f = 1 - u^m = -expm1(m log u) keeps full relative precision at large suction, where
  // u -> 1 and f ~ m / x^n. log u is taken as log(u) when u is small and as
  // -log1p(x^-n) when u is close to 1, accurate in both ranges.
  const double log_u = xn < 1.0 ? std::log(u) : -std::log1p(1.0 / xn);
  const double um = std::exp(m * log_u);
  const double f = -std::expm1(m * log_u);
  // df/dh = m n alpha u^(m-1) x^(n-1) / (1 + x^n)^2; infinite at h -> 0- when n < 2.
  return {f, m * p.n * p.alpha_per_cm * (um / u) * (xn / x) / ((1.0 + xn) * (1.0 + xn))};
}

ConductivityAndSlope conductivity(const VanGenuchtenMualem& p, double h) {
  const double ks = p.saturated_conductivity_cm_per_d;
  if (h >= 0.0) return {ks, 0.0};
  const double l = p.pore_connectivity;
  const auto [se, dse] = saturation(p, h);
  if (se <= 0.0) return {0.0, 0.0};  // Se underflowed: K and dK/dh are zero to machine precision
  const auto [f, df] = mualem_factor(p, h);
  const double se_l = std::pow(se, l);
  return {ks * se_l * f * f, ks * (l * se_l / se * f * f * dse + se_l * 2.0 * f * df)};
}

double head_at_saturation(const VanGenuchtenMualem& p, double se) {
  if (se >= 1.0) return 0.0;
  const double m = 1.0 - 1.0 / p.n;
  // x^n = Se^(-1/m) - 1, formed with expm1 so that it keeps its precision near saturation.
  const double xn = std::expm1(-std::log(se) / m);
  return -std::exp(std::log(xn) / p.n) / p.alpha_per_cm;
}

// The same formulas as saturation(), mualem_factor() and conductivity(), sharing the
// logarithms: L = log(1 + x^n), Se = exp(-m L), log u = n log x - L.
HydraulicState state(const VanGenuchtenMualem& p, double h) {
  const double range = p.saturated_water_content - p.residual_water_content;
  const double ks = p.saturated_conductivity_cm_per_d;
  if (h >= 0.0) return {p.saturated_water_content, 0.0, ks, 0.0};
  const double m = 1.0 - 1.0 / p.n;
  const double l = p.pore_connectivity;
  const double x = -p.alpha_per_cm * h;
  const double log_x = std::log(x);
  const double xn = std::exp(p.n * log_x);
  if (!(xn > 0.0)) return {p.saturated_water_content, 0.0, ks, 0.0};  // x^n underflows: saturated to machine precision
  const double log_1p_xn = std::log1p(xn);
  const double se = std::exp(-m * log_1p_xn);
  const double dse = m * p.n * p.alpha_per_cm * (xn / x) * se / (1.0 + xn);
  const double theta = se >= 1.0 ? p.saturated_water_content : p.residual_water_content + range * se;
  if (se <= 0.0) return {theta, range * dse, 0.0, 0.0};
  const double log_u = xn < 1.0 ? p.n * log_x - log_1p_xn : -std::log1p(1.0 / xn);
  const double um = std::exp(m * log_u);
  const double f = -std::expm1(m * log_u);
  const double df = m * p.n * p.alpha_per_cm * (um * (1.0 + xn) / xn) * (xn / x) / ((1.0 + xn) * (1.0 + xn));
  const double se_l = std::exp(-l * m * log_1p_xn);
  return {theta, range * dse, ks * se_l * f * f, ks * (l * se_l / se * f * f * dse + se_l * 2.0 * f * df)};
}

}  // namespace wetfront::soils::detail
