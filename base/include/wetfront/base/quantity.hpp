// Numbers with units at the boundary (site-file values like "25 cm/d", options like "3 cm",
// CSV headers like "time [min]"), converted to the internal units of the design notes: cm,
// cm2, d, cm/d, 1/cm, cm of water. A bare number where a unit is needed is an InputError
// that lists the accepted units.
#pragma once

#include <optional>
#include <string>
#include <string_view>

namespace wetfront::base {

// 1 kPa of water pressure as cm of water: 1000 Pa / (1000 kg/m3 * 9.80665 m/s2) = 10.19716 cm
// (standard gravity; water density taken as 1000 kg/m3, common practice).
inline constexpr double kCentimetresOfWaterPerKilopascal = 100000.0 / (1000.0 * 9.80665);

enum class Dimension {
  length,          // internal cm; accepts mm, cm, m
  area,            // internal cm2; accepts mm2, cm2, m2
  time,            // internal d; accepts s, min, h, d
  conductivity,    // internal cm/d; accepts mm/h, cm/h, cm/d, mm/d, m/d, cm/s, m/s
  inverse_length,  // internal 1/cm; accepts 1/mm, 1/cm, 1/m
  pressure_head,   // internal cm of water; accepts mm, cm, m, hPa, kPa
  water_content,   // internal cm3/cm3; accepts cm3/cm3, m3/m3, %
  wind_speed,      // internal m/s; accepts m/s, km/h
  percentage,      // internal %; accepts %
  temperature,     // internal degC; accepts degC, C, K
};

std::string_view internal_unit(Dimension dimension);
// "mm, cm or m" etc., for error messages.
std::string accepted_units(Dimension dimension);

// Converts a value in `unit` to internal units; empty when the unit is not one of the accepted
// ones for the dimension.
std::optional<double> to_internal(Dimension dimension, double value, std::string_view unit);

// True when `unit` is accepted for a length, area, time, conductivity, inverse length,
// pressure head or water content (used to read "time_min" style CSV headers).
bool is_known_unit(std::string_view unit);

// Parses "<number> <unit>" (space optional: "3cm" also works) into internal units.
// Throws InputError naming `what` (e.g. "option --well-radius") and the accepted units
// when the unit is missing, unknown or the number does not parse.
double parse_quantity(std::string_view text, Dimension dimension, const std::string& what);

// The whole text as a finite decimal number (a leading '+' is allowed); empty otherwise.
std::optional<double> to_number(std::string_view text);
// Parses a plain number (no unit); throws InputError naming `what` otherwise.
double parse_number(std::string_view text, const std::string& what);

// The text without leading and trailing white space.
std::string trim(std::string_view text);

}  // namespace wetfront::base
