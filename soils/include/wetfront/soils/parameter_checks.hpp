// Physical checks on hydraulic-model parameters, for use wherever parameters enter the
// program (site file, fitted values, texture defaults) before the solver sees them.
#pragma once

#include <string_view>

#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

// Throws base::InputError naming `label` (e.g. the layer name) and the offending field
// when a parameter is outside its physical range:
//   0 <= theta_r < theta_s <= 1; Ks > 0; all values finite;
//   van Genuchten: alpha > 0, n > 1; air entry h_e < 0;
//   Brooks & Corey: h_b < 0, lambda > 0; Gardner: a > 0.
void check_hydraulic_model(const HydraulicModel& model, std::string_view label);

}  // namespace wetfront::soils
