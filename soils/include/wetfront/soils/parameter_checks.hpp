// Physical checks on hydraulic-model parameters, for use wherever parameters enter the
// program (site file, fitted values, texture defaults) before the solver sees them.
#pragma once

#include <string_view>

#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

// Hard upper limit of a saturated conductivity: 1e5 cm/d (about 1 m/min), beyond clean coarse
// gravel (common practice); larger values are typing errors and only stall the solver.
inline constexpr double kMaxSaturatedConductivity_cm_per_d = 1e5;

// Throws base::InputError naming `label` (e.g. the layer name) and the offending field
// when a parameter is outside its physical range; the error's column() is the site-file key
// (residual_water_content, saturated_water_content, saturated_conductivity) where known:
//   0 <= theta_r < theta_s <= 1; 0 < Ks <= kMaxSaturatedConductivity_cm_per_d; all values finite;
//   van Genuchten: alpha > 0, n > 1; air entry h_e < 0;
//   Brooks & Corey: h_b < 0, lambda > 0; Gardner: a > 0.
void check_hydraulic_model(const HydraulicModel& model, std::string_view label);

}  // namespace wetfront::soils
