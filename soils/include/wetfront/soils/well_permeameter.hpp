// Constant-head well permeameter: field-saturated conductivity Kfs and matric flux
// potential phi_m from the steady outflow into an uncased auger hole.
//
// Reynolds & Elrick (1985, Soil Sci. 140:292) steady flow from a cylindrical well of
// radius a holding water at depth H:
//     Q = (2 pi H^2 / C + pi a^2) Kfs + (2 pi H / C) phi_m                      (1)
// with C a dimensionless shape factor. Here C follows Zhang, Groenevelt & Parkin (1998,
// Soil Tillage Res. 46:201), fitted to numerical solutions as a function of H/a:
//     sands:                      C = ((H/a) / (2.102 + 0.118 H/a))^0.655
//     structured loams and clays: C = ((H/a) / (1.992 + 0.091 H/a))^0.683
//     unstructured clays:         C = ((H/a) / (2.074 + 0.093 H/a))^0.754
// (coefficients from memory; they could not be checked against the paper here).
//
// Single-head analysis: with phi_m = Kfs / alpha* (Gardner soil), (1) gives
//     Kfs = C Q / (2 pi H^2 + pi a^2 C + 2 pi H / alpha*)
// using the alpha* of the soil category (Elrick, Reynolds & Tan 1989, Ground Water
// Monit. Rev. 9:184): 0.01 /cm compacted structureless clays, 0.04 /cm fine-textured
// unstructured soils, 0.12 /cm most structured soils, 0.36 /cm coarse sands and highly
// structured soils.
//
// Two-head analysis: (1) at two depths H1 < H2 is a 2x2 linear system in (Kfs, phi_m). In
// layered or heterogeneous soil it often returns a negative Kfs or phi_m; then the result
// falls back to the mean of the single-head values and says so.
#pragma once

#include <span>
#include <string>
#include <string_view>
#include <vector>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

// Which of the Zhang et al. (1998) shape-factor fits applies.
enum class ShapeFactorSoil { sand, structured_loam_or_clay, unstructured_clay };

// Soil category for the single-head analysis: sets alpha* and the shape-factor fit.
enum class WellSoilCategory {
  compacted_clay,     // alpha* 0.01 /cm, unstructured-clay C
  fine_unstructured,  // alpha* 0.04 /cm, unstructured-clay C
  structured,         // alpha* 0.12 /cm, structured C (the usual default)
  coarse_sand,        // alpha* 0.36 /cm, sand C
  highly_structured,  // alpha* 0.36 /cm, structured C
};

double sorptive_number_per_cm(WellSoilCategory category);  // alpha*, 1/cm
ShapeFactorSoil shape_factor_soil(WellSoilCategory category);
// Our plain names ("compacted-clay", "fine-unstructured", "structured", "coarse-sand",
// "highly-structured") and a one-line description for reports.
std::string_view category_name(WellSoilCategory category);
std::string_view category_description(WellSoilCategory category);
// Throws base::InputError listing the accepted names.
WellSoilCategory parse_category(std::string_view name);
std::span<const WellSoilCategory> all_categories();

// Dimensionless shape factor C(H/a). Throws base::InputError for H <= 0 or a <= 0.
double well_shape_factor(double water_depth_cm, double well_radius_cm, ShapeFactorSoil soil);

// One steady flow at one ponded depth.
struct WellFlow {
  double water_depth_cm = 0.0;            // H, depth of water in the well, cm
  double steady_outflow_cm3_per_d = 0.0;  // Q, cm3/d
};

// Steady outflow predicted by eq. (1); used for synthetic readings and checks.
double well_outflow(double water_depth_cm, double well_radius_cm, ShapeFactorSoil soil,
                    double field_saturated_conductivity_cm_per_d, double matric_flux_potential_cm2_per_d);

struct WellResult {
  double field_saturated_conductivity_cm_per_d = 0.0;  // Kfs, cm/d
  double matric_flux_potential_cm2_per_d = 0.0;        // phi_m, cm2/d
  double sorptive_number_per_cm = 0.0;                 // alpha* = Kfs / phi_m, 1/cm
  std::string method;                                  // "single head" / "two heads" / fallback
  std::vector<std::string> warnings;                   // physically doubtful results
};

WellResult single_head_analysis(const WellFlow& flow, double well_radius_cm, WellSoilCategory category);

// Solves eq. (1) at two depths. If Kfs or phi_m comes out negative (or not finite) the
// returned result is the mean of the two single-head analyses with the category's alpha*,
// and warnings say why. Throws base::InputError when the two depths are equal.
WellResult two_head_analysis(const WellFlow& shallower, const WellFlow& deeper, double well_radius_cm,
                             WellSoilCategory category);

}  // namespace wetfront::soils
