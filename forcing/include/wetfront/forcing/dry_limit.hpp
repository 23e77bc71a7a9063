// The driest head a soil surface can reach in contact with air: the Kelvin equation for the
// water potential in equilibrium with air of relative humidity RH at temperature T,
//   h = R T ln(RH) / (M g),
// R the gas constant, M the molar mass of water, g gravity (the form given in soil-physics
// texts, e.g. Hillel 1998, ch. 3: from memory).
#pragma once

#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

// Pressure head in cm of water (negative). relative_humidity is a fraction in (0, 1);
// air_temperature_c in degrees Celsius (above -273.15). Throws base::InputError otherwise.
double dry_limit_head_from_humidity(double relative_humidity, double air_temperature_c);

}  // namespace wetfront::forcing
