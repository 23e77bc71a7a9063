#include "wetfront/forcing/dry_limit.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

double dry_limit_head_from_humidity(double relative_humidity, double air_temperature_c) {
  if (!(relative_humidity > 0.0 && relative_humidity < 1.0))
    throw base::InputError(
        fmt::format("relative humidity {} is not a fraction between 0 and 1 (exclusive)", relative_humidity));
  if (!(air_temperature_c > -273.15))
    throw base::InputError(fmt::format("air temperature {} degC is below absolute zero", air_temperature_c));
  constexpr double gas_constant = 8.314462618;     // J/(mol K), CODATA 2018
  constexpr double water_molar_mass = 0.01801528;  // kg/mol
  constexpr double gravity = 9.80665;              // m/s2, standard gravity
  const double kelvin = air_temperature_c + 273.15;
  const double head_m = gas_constant * kelvin * std::log(relative_humidity) / (water_molar_mass * gravity);
  return 100.0 * head_m;
}

}  // namespace wetfront::forcing
