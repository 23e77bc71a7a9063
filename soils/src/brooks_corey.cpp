// Brooks & Corey (1964) retention with Burdine (1953) conductivity:
//   Se = (h_b / h)^lambda for h < h_b (both negative), 1 otherwise;
//   K  = Ks Se^(3 + 2/lambda).
#include <cmath>

#include "model_formulas.hpp"

namespace wetfront::soils::detail {

SaturationAndSlope saturation(const BrooksCorey& p, double h) {
  if (h >= p.bubbling_head_cm) return {1.0, 0.0};
  const double se = std::pow(p.bubbling_head_cm / h, p.pore_size_index);
  return {se, -p.pore_size_index * se / h};
}

ConductivityAndSlope conductivity(const BrooksCorey& p, double h) {
  const double ks = p.saturated_conductivity_cm_per_d;
  if (h >= p.bubbling_head_cm) return {ks, 0.0};
  const double exponent = 3.0 + 2.0 / p.pore_size_index;
  const auto [se, dse] = saturation(p, h);
  const double k = ks * std::pow(se, exponent);
  return {k, exponent * k / se * dse};
}

double head_at_saturation(const BrooksCorey& p, double se) {
  if (se >= 1.0) return p.bubbling_head_cm;
  return p.bubbling_head_cm * std::pow(se, -1.0 / p.pore_size_index);
}

}  // namespace wetfront::soils::detail
