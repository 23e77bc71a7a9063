// Adjustable model parameters and the space searched over them.
//
// A parameter is searched on its own scale: linear (the value itself) or log (log10 of the
// value, for quantities that span orders of magnitude such as a saturated conductivity).
// Sweeps space their points evenly on that scale and calibration steps on it; standard errors
// from a calibration are therefore on that scale too (for a log parameter, an error of 0.1 is
// a factor of 10^0.1 = 1.26 either way).
#pragma once

#include <span>
#include <string>
#include <vector>
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {

enum class ParameterScale { linear, log };

struct AdjustableParameter {
  std::string name;  // as the user wrote it, e.g. "loam subsoil: saturated_conductivity"
  std::string unit;  // display unit of lower, upper and start, e.g. "cm/d"; "" when none
  double lower = 0;  // in `unit`
  double upper = 0;
  ParameterScale scale = ParameterScale::linear;
  double start = 0;     // the site file's value: where a calibration starts
  int grid_points = 5;  // points of a full-grid sweep, ends included
};

// Value on the search scale and back. Throws base::InputError for a log parameter at a
// value <= 0.
double to_search_scale(const AdjustableParameter& parameter, double value);
double from_search_scale(const AdjustableParameter& parameter, double search_value);

// Throws base::InputError naming the parameter when lower >= upper, a log range does not
// lie above zero, the start lies outside the range, or grid_points < 2.
void check_parameter(const AdjustableParameter& parameter);

// One parameter set: one value per adjustable parameter, in their units, in order.
using ParameterSet = std::vector<double>;

}  // namespace wetfront::studies
