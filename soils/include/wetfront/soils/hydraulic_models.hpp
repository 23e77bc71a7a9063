// Soil hydraulic property models: water retention theta(h) and conductivity K(h).
//
// Units: pressure head h in cm of water (negative when unsaturated), conductivity in cm/d,
// water content as a volume fraction (cm3/cm3), alpha in 1/cm.
// Each model is a value type of named parameters; the formulas are free functions
// dispatched over the HydraulicModel variant.
#pragma once

#include <variant>

namespace wetfront::soils {

// van Genuchten (1980, SSSAJ 44:892) retention, eq. (3), with m = 1 - 1/n, and
// Mualem (1976, WRR 12:513) conductivity, van Genuchten eq. (8) generalised by the
// pore-connectivity exponent l:  K = Ks Se^l [1 - (1 - Se^(1/m))^m]^2.
struct VanGenuchtenMualem {
  double residual_water_content = 0.0;           // theta_r, cm3/cm3
  double saturated_water_content = 0.0;          // theta_s, cm3/cm3
  double alpha_per_cm = 0.0;                     // alpha, 1/cm
  double n = 0.0;                                // n > 1, dimensionless
  double saturated_conductivity_cm_per_d = 0.0;  // Ks, cm/d
  double pore_connectivity = 0.5;                // l, dimensionless (Mualem 1976)
};

// van Genuchten-Mualem with an air-entry head h_e < 0 (Ippisch, Vogel & Bastian 2006,
// Adv. Water Resour. 29:1780): the retention curve is rescaled so that Se = 1 at h = h_e,
// eq. (9) and (10) there, which keeps K finite in slope for n near 1.
struct VanGenuchtenAirEntry {
  VanGenuchtenMualem base;
  double air_entry_head_cm = -2.0;  // h_e, cm (negative)
};

// Brooks & Corey (1964, Hydrology Paper 3) retention, Se = (h_b/h)^lambda for h < h_b,
// with Burdine (1953) conductivity K = Ks Se^(3 + 2/lambda).
struct BrooksCorey {
  double residual_water_content = 0.0;           // theta_r
  double saturated_water_content = 0.0;          // theta_s
  double bubbling_head_cm = -10.0;               // h_b, cm (negative)
  double pore_size_index = 0.5;                  // lambda, dimensionless
  double saturated_conductivity_cm_per_d = 0.0;  // Ks, cm/d
};

// Gardner (1958, Soil Sci. 85:228) exponential conductivity K = Ks exp(a h), with water
// content linear in K: theta = theta_r + (theta_s - theta_r) exp(a h)
// (the pair used by Srivastava & Yeh 1991, WRR 27:753).
struct GardnerExponential {
  double residual_water_content = 0.0;
  double saturated_water_content = 0.0;
  double sorptive_number_per_cm = 0.0;  // a (often alpha*), 1/cm
  double saturated_conductivity_cm_per_d = 0.0;
};

using HydraulicModel = std::variant<VanGenuchtenMualem, VanGenuchtenAirEntry, BrooksCorey, GardnerExponential>;

// Effective saturation Se = (theta - theta_r) / (theta_s - theta_r), in [0, 1].
double effective_saturation(const HydraulicModel& model, double pressure_head_cm);
// Volumetric water content theta(h), cm3/cm3.
double water_content(const HydraulicModel& model, double pressure_head_cm);
// Specific moisture capacity C(h) = d theta / dh, 1/cm.
double moisture_capacity(const HydraulicModel& model, double pressure_head_cm);
// Unsaturated conductivity K(h), cm/d.
double conductivity(const HydraulicModel& model, double pressure_head_cm);
// dK/dh, cm/d per cm.
double conductivity_slope(const HydraulicModel& model, double pressure_head_cm);
// Relative conductivity K(h) / Ks.
double relative_conductivity(const HydraulicModel& model, double pressure_head_cm);
// Inverse retention h(theta) for theta_r < theta <= theta_s. At theta = theta_s it returns the
// driest head that is still saturated: the air-entry head h_e (Ippisch et al.) or bubbling
// head h_b (Brooks & Corey), and 0 for the other models. Throws std::domain_error for
// theta <= theta_r or theta > theta_s.
double pressure_head_at(const HydraulicModel& model, double water_content);

double saturated_water_content(const HydraulicModel& model);
double residual_water_content(const HydraulicModel& model);
double saturated_conductivity(const HydraulicModel& model);

// Property bundle for one head: what the solver needs per cell per residual evaluation.
struct HydraulicState {
  double water_content;       // cm3/cm3
  double moisture_capacity;   // 1/cm
  double conductivity;        // cm/d
  double conductivity_slope;  // cm/d per cm
};
HydraulicState evaluate(const HydraulicModel& model, double pressure_head_cm);

}  // namespace wetfront::soils
