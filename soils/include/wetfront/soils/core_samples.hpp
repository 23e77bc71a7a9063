// Laboratory soil cores: water content and dry bulk density from ring masses, and retention
// points from a core weighed at each suction step (pressure plate or hanging column).
//
//   water mass           M_w = wet - oven-dry                        (g)
//   dry soil mass        M_s = oven-dry - tare                       (g)
//   gravimetric content  w = M_w / M_s                               (g/g)
//   volumetric content   theta = M_w / (rho_w V)                     (cm3/cm3)
//   dry bulk density     rho_b = M_s / V                             (g/cm3)
//   porosity             phi = 1 - rho_b / rho_p                     (rho_p = 2.65 g/cm3 for
//                                                                     mineral soil, common practice)
// All masses include the tare (ring plus any lid or cloth) that is weighed with the soil.
#pragma once

#include <span>
#include <string>
#include <vector>

#include "wetfront/soils/retention_fit.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

inline constexpr double kMineralParticleDensity_g_per_cm3 = 2.65;  // quartz-like minerals, common practice
inline constexpr double kWaterDensity_g_per_cm3 = 1.0;             // at lab temperature, to 0.3 %

struct CoreSample {
  std::string name;              // sample label used in messages
  double ring_volume_cm3 = 0.0;  // inner volume of the ring = soil volume
  double tare_mass_g = 0.0;      // empty ring (and lid, cloth) as weighed
  double wet_mass_g = 0.0;       // tare + moist soil
  double oven_dry_mass_g = 0.0;  // tare + soil dried at 105 degC
};

struct CoreProperties {
  double water_mass_g = 0.0;
  double dry_soil_mass_g = 0.0;
  double gravimetric_water_content_g_per_g = 0.0;
  double volumetric_water_content = 0.0;  // cm3/cm3
  double dry_bulk_density_g_per_cm3 = 0.0;
};

// Throws base::InputError naming the sample for impossible data: non-positive or
// non-finite volume, oven-dry mass not above the tare, wet mass below the oven-dry mass,
// or a water content above 1.
CoreProperties core_properties(const CoreSample& core, double water_density_g_per_cm3 = kWaterDensity_g_per_cm3);

// Total porosity 1 - rho_b / rho_p (cm3/cm3). Throws for rho_b <= 0 or rho_b >= rho_p.
double porosity(double dry_bulk_density_g_per_cm3,
                double particle_density_g_per_cm3 = kMineralParticleDensity_g_per_cm3);

// Comparison of a fitted or measured theta_s with the porosity of the same soil. A theta_s
// above the porosity is physically impossible (beyond a tolerance for weighing and particle
// density error); one far below it usually means entrapped air or a poorly saturated core.
struct PorosityCheck {
  double porosity = 0.0;
  double saturated_water_content = 0.0;
  double ratio = 0.0;             // theta_s / porosity
  bool exceeds_porosity = false;  // theta_s > porosity + tolerance
  std::string message;            // empty when consistent
};
PorosityCheck check_against_porosity(double saturated_water_content, double porosity_value, double tolerance = 0.02);

// One equilibrium weighing of a core at a suction step.
struct SuctionStep {
  double suction_cm = 0.0;  // applied suction, cm of water
  double wet_mass_g = 0.0;  // tare + moist soil at equilibrium
};

// Volumetric water content at each step from the core's ring volume, tare and final oven-dry
// mass (core.wet_mass_g is not used). Throws naming the sample and step for a wet mass below
// the oven-dry mass.
std::vector<RetentionPoint> retention_points_from_core(const CoreSample& core, std::span<const SuctionStep> steps,
                                                       double water_density_g_per_cm3 = kWaterDensity_g_per_cm3);

}  // namespace wetfront::soils
