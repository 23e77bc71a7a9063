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

// The site-file key of a parameter goes in the error's column, so the loader can point at it.
void require_key(bool ok, std::string_view label, std::string_view key, std::string_view field, double value,
                 std::string_view expected) {
  if (!ok || !std::isfinite(value))
    throw base::InputError(
        "", 0, std::string(key),
        fmt::format("soil '{}': {} = {} is not allowed; it must be {}", label, field, value, expected));
}

void check_common(std::string_view label, double theta_r, double theta_s, double ks) {
  require_key(theta_r >= 0.0 && theta_r < 1.0, label, "residual_water_content", "residual water content", theta_r,
              "in [0, 1) cm3/cm3");
  require_key(theta_s > 0.0 && theta_s <= 1.0, label, "saturated_water_content", "saturated water content", theta_s,
              "in (0, 1] cm3/cm3");
  if (!(theta_s > theta_r)) {
    // Blame the one outside its usual range (residual 0 to 0.25, saturated 0.25 to 0.7; Carsel &
    // Parrish 1988 class averages span 0.034-0.1 and 0.36-0.46), the residual when both are usual.
    const bool saturated_odd = theta_s < 0.25 && theta_r <= 0.25;
    throw base::InputError(
        "", 0, saturated_odd ? "saturated_water_content" : "residual_water_content",
        fmt::format("soil '{}': the residual water content {} is not below the saturated water content {}; {}", label,
                    theta_r, theta_s,
                    saturated_odd ? "the saturated water content is unusually low (usually 0.25 to 0.7)"
                                  : "the residual water content is usually 0 to 0.25, well below saturation"));
  }
  require_key(ks > 0.0 && ks <= kMaxSaturatedConductivity_cm_per_d, label, "saturated_conductivity",
              "saturated conductivity", ks,
              fmt::format("a positive number of cm/d, at most {:g} cm/d (coarse clean gravel, common practice)",
                          kMaxSaturatedConductivity_cm_per_d));
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
