// Per-model formulas behind the HydraulicModel dispatch (internal to wetfront_soils).
#pragma once

#include "wetfront/soils/hydraulic_models.hpp"

namespace wetfront::soils::detail {

// Each model provides, for pressure head h in cm:
//   effective saturation Se(h), dSe/dh (1/cm), K(h) (cm/d), dK/dh, and h(Se).
struct SaturationAndSlope {
  double saturation;
  double slope_per_cm;
};
struct ConductivityAndSlope {
  double conductivity;
  double slope;
};

SaturationAndSlope saturation(const VanGenuchtenMualem& m, double h);
// Mualem factor f = 1 - (1 - Se^(1/m))^m of the van Genuchten curve and df/dh.
struct MualemFactor {
  double factor;
  double slope_per_cm;
};
MualemFactor mualem_factor(const VanGenuchtenMualem& m, double h);
// theta, C, K and dK/dh of the van Genuchten-Mualem model in one pass (the solver's hot path).
HydraulicState state(const VanGenuchtenMualem& m, double h);
ConductivityAndSlope conductivity(const VanGenuchtenMualem& m, double h);
double head_at_saturation(const VanGenuchtenMualem& m, double se);

SaturationAndSlope saturation(const VanGenuchtenAirEntry& m, double h);
ConductivityAndSlope conductivity(const VanGenuchtenAirEntry& m, double h);
double head_at_saturation(const VanGenuchtenAirEntry& m, double se);

SaturationAndSlope saturation(const BrooksCorey& m, double h);
ConductivityAndSlope conductivity(const BrooksCorey& m, double h);
double head_at_saturation(const BrooksCorey& m, double se);

SaturationAndSlope saturation(const GardnerExponential& m, double h);
ConductivityAndSlope conductivity(const GardnerExponential& m, double h);
double head_at_saturation(const GardnerExponential& m, double se);

inline double theta_r(const VanGenuchtenMualem& m) { return m.residual_water_content; }
inline double theta_s(const VanGenuchtenMualem& m) { return m.saturated_water_content; }
inline double ks(const VanGenuchtenMualem& m) { return m.saturated_conductivity_cm_per_d; }
inline double theta_r(const VanGenuchtenAirEntry& m) { return theta_r(m.base); }
inline double theta_s(const VanGenuchtenAirEntry& m) { return theta_s(m.base); }
inline double ks(const VanGenuchtenAirEntry& m) { return ks(m.base); }
inline double theta_r(const BrooksCorey& m) { return m.residual_water_content; }
inline double theta_s(const BrooksCorey& m) { return m.saturated_water_content; }
inline double ks(const BrooksCorey& m) { return m.saturated_conductivity_cm_per_d; }
inline double theta_r(const GardnerExponential& m) { return m.residual_water_content; }
inline double theta_s(const GardnerExponential& m) { return m.saturated_water_content; }
inline double ks(const GardnerExponential& m) { return m.saturated_conductivity_cm_per_d; }

}  // namespace wetfront::soils::detail
