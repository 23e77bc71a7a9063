#include "wetfront/soils/parameter_checks.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {
namespace {

void require(bool ok, std::string_view label, std::string_view field, double value, std::string_view expected) {
  if (!ok || !std::isfinite(value))
    throw base::InputError(
        fmt::format("soil '{}': {} = {} is not allowed; it must be {}", label, field, value, expected));
}

void check_common(std::string_view label, double theta_r, double theta_s, double ks) {
  require(theta_r >= 0.0 && theta_r < 1.0, label, "residual water content", theta_r, "in [0, 1) cm3/cm3");
  require(theta_s > theta_r && theta_s <= 1.0, label, "saturated water content", theta_s,
          fmt::format("above the residual water content {} and at most 1 cm3/cm3", theta_r));
  require(ks > 0.0, label, "saturated conductivity", ks, "a positive number of cm/d");
}

void check(const VanGenuchtenMualem& p, std::string_view label) {
  check_common(label, p.residual_water_content, p.saturated_water_content, p.saturated_conductivity_cm_per_d);
  require(p.alpha_per_cm > 0.0, label, "alpha", p.alpha_per_cm, "a positive number of 1/cm");
  require(p.n > 1.0, label, "n", p.n, "greater than 1 (m = 1 - 1/n must be positive)");
  require(true, label, "pore connectivity", p.pore_connectivity, "a finite number");
}
void check(const VanGenuchtenAirEntry& p, std::string_view label) {
  check(p.base, label);
  require(p.air_entry_head_cm < 0.0, label, "air-entry head", p.air_entry_head_cm, "negative (cm of water)");
}
void check(const BrooksCorey& p, std::string_view label) {
  check_common(label, p.residual_water_content, p.saturated_water_content, p.saturated_conductivity_cm_per_d);
  require(p.bubbling_head_cm < 0.0, label, "bubbling head", p.bubbling_head_cm, "negative (cm of water)");
  require(p.pore_size_index > 0.0, label, "pore-size index", p.pore_size_index, "positive");
}
void check(const GardnerExponential& p, std::string_view label) {
  check_common(label, p.residual_water_content, p.saturated_water_content, p.saturated_conductivity_cm_per_d);
  require(p.sorptive_number_per_cm > 0.0, label, "sorptive number", p.sorptive_number_per_cm,
          "a positive number of 1/cm");
}

}  // namespace

void check_hydraulic_model(const HydraulicModel& model, std::string_view label) {
  std::visit([label](const auto& m) { check(m, label); }, model);
}

}  // namespace wetfront::soils
