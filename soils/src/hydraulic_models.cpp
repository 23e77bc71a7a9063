// Dispatch of the property functions over the HydraulicModel variant.
#include "wetfront/soils/hydraulic_models.hpp"

#include <stdexcept>
#include <string>

#include "model_formulas.hpp"

namespace wetfront::soils {
namespace {
// theta = theta_r + (theta_s - theta_r) Se, exactly theta_s at saturation (the sum can be
// one ulp off theta_s in floating point).
double water_content_from_saturation(double theta_r, double theta_s, double se) {
  return se >= 1.0 ? theta_s : theta_r + (theta_s - theta_r) * se;
}
}  // namespace

double effective_saturation(const HydraulicModel& model, double h) {
  return std::visit([h](const auto& m) { return detail::saturation(m, h).saturation; }, model);
}

// The van Genuchten-Mualem properties come from one shared evaluation (detail::state), so the
// single functions and evaluate() agree to the last bit.
double water_content(const HydraulicModel& model, double h) {
  if (const auto* vg = std::get_if<VanGenuchtenMualem>(&model)) return detail::state(*vg, h).water_content;
  return std::visit(
      [h](const auto& m) {
        return water_content_from_saturation(detail::theta_r(m), detail::theta_s(m),
                                             detail::saturation(m, h).saturation);
      },
      model);
}

double moisture_capacity(const HydraulicModel& model, double h) {
  if (const auto* vg = std::get_if<VanGenuchtenMualem>(&model)) return detail::state(*vg, h).moisture_capacity;
  return std::visit(
      [h](const auto& m) { return (detail::theta_s(m) - detail::theta_r(m)) * detail::saturation(m, h).slope_per_cm; },
      model);
}

double conductivity(const HydraulicModel& model, double h) {
  if (const auto* vg = std::get_if<VanGenuchtenMualem>(&model)) return detail::state(*vg, h).conductivity;
  return std::visit([h](const auto& m) { return detail::conductivity(m, h).conductivity; }, model);
}

double conductivity_slope(const HydraulicModel& model, double h) {
  if (const auto* vg = std::get_if<VanGenuchtenMualem>(&model)) return detail::state(*vg, h).conductivity_slope;
  return std::visit([h](const auto& m) { return detail::conductivity(m, h).slope; }, model);
}

double relative_conductivity(const HydraulicModel& model, double h) {
  return conductivity(model, h) / saturated_conductivity(model);
}

double pressure_head_at(const HydraulicModel& model, double theta) {
  return std::visit(
      [theta](const auto& m) {
        const double tr = detail::theta_r(m);
        const double ts = detail::theta_s(m);
        if (!(theta > tr) || theta > ts)
          throw std::domain_error("water content " + std::to_string(theta) + " is outside (theta_r, theta_s] = (" +
                                  std::to_string(tr) + ", " + std::to_string(ts) + "]");
        return detail::head_at_saturation(m, (theta - tr) / (ts - tr));
      },
      model);
}

double saturated_water_content(const HydraulicModel& model) {
  return std::visit([](const auto& m) { return detail::theta_s(m); }, model);
}
double residual_water_content(const HydraulicModel& model) {
  return std::visit([](const auto& m) { return detail::theta_r(m); }, model);
}
double saturated_conductivity(const HydraulicModel& model) {
  return std::visit([](const auto& m) { return detail::ks(m); }, model);
}

HydraulicState evaluate(const HydraulicModel& model, double h) {
  if (const auto* vg = std::get_if<VanGenuchtenMualem>(&model)) return detail::state(*vg, h);
  return std::visit(
      [h](const auto& m) {
        const auto s = detail::saturation(m, h);
        const auto k = detail::conductivity(m, h);
        const double range = detail::theta_s(m) - detail::theta_r(m);
        return HydraulicState{water_content_from_saturation(detail::theta_r(m), detail::theta_s(m), s.saturation),
                              range * s.slope_per_cm, k.conductivity, k.slope};
      },
      model);
}

}  // namespace wetfront::soils
