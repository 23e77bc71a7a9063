// Gardner (1958) exponential model: K = Ks exp(a h), Se = exp(a h) for h < 0
// (theta linear in K, as in Srivastava & Yeh 1991, eq. 4 and 5).
#include <cmath>

#include "model_formulas.hpp"

namespace wetfront::soils::detail {

SaturationAndSlope saturation(const GardnerExponential& p, double h) {
  if (h >= 0.0) return {1.0, 0.0};
  const double se = std::exp(p.sorptive_number_per_cm * h);
  return {se, p.sorptive_number_per_cm * se};
}

ConductivityAndSlope conductivity(const GardnerExponential& p, double h) {
  if (h >= 0.0) return {p.saturated_conductivity_cm_per_d, 0.0};
  const double k = p.saturated_conductivity_cm_per_d * std::exp(p.sorptive_number_per_cm * h);
  return {k, p.sorptive_number_per_cm * k};
}

double head_at_saturation(const GardnerExponential& p, double se) {
  if (se >= 1.0) return 0.0;
  return std::log(se) / p.sorptive_number_per_cm;
}

}  // namespace wetfront::soils::detail
