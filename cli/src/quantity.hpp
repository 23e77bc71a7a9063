// Numbers with units at the boundary (options like "3 cm", CSV headers like "time [min]"),
// converted to the internal units of the design notes: cm, cm2, d, cm/d, 1/cm, cm of water.
#pragma once

#include <optional>
#include <string>
#include <string_view>

namespace wetfront::cli {

enum class Dimension {
  length,          // internal cm; accepts mm, cm, m
  area,            // internal cm2; accepts mm2, cm2, m2
  time,            // internal d; accepts s, min, h, d
  conductivity,    // internal cm/d; accepts mm/h, cm/h, cm/d, mm/d, m/d, cm/s, m/s
  inverse_length,  // internal 1/cm; accepts 1/mm, 1/cm, 1/m
  pressure_head,   // internal cm of water; accepts mm, cm, m, hPa, kPa
  water_content,   // internal cm3/cm3; accepts cm3/cm3, m3/m3, %
};

std::string_view internal_unit(Dimension dimension);
// "mm, cm or m" etc., for error messages.
std::string accepted_units(Dimension dimension);

// Factor that multiplies a value in `unit` to give internal units; empty when the unit is
// not one of the accepted ones for the dimension.
std::optional<double> unit_factor(Dimension dimension, std::string_view unit);

// True when `unit` is accepted for some dimension (used to read "time_min" style headers).
bool is_known_unit(std::string_view unit);

// Parses "<number> <unit>" (space optional: "3cm" also works) into internal units.
// Throws InputError naming `what` (e.g. "option --well-radius") and the accepted units
// when the unit is missing, unknown or the number does not parse.
double parse_quantity(std::string_view text, Dimension dimension, const std::string& what);

// Parses a plain number (no unit); throws InputError naming `what` otherwise.
double parse_number(std::string_view text, const std::string& what);

std::string trim(std::string_view text);

}  // namespace wetfront::cli
