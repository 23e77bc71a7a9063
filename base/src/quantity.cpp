#include "wetfront/base/quantity.hpp"

#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <span>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"

namespace wetfront::base {
namespace {

// internal value = value * factor + offset (the offset only for temperatures).
struct Unit {
  std::string_view name;
  double factor;
  double offset = 0.0;
};

constexpr std::array<Unit, 3> length_units = {{{"mm", 0.1}, {"cm", 1.0}, {"m", 100.0}}};
constexpr std::array<Unit, 3> area_units = {{{"mm2", 0.01}, {"cm2", 1.0}, {"m2", 1.0e4}}};
constexpr std::array<Unit, 4> time_units = {
    {{"s", 1.0 / 86400.0}, {"min", 1.0 / 1440.0}, {"h", 1.0 / 24.0}, {"d", 1.0}}};
constexpr std::array<Unit, 7> conductivity_units = {
    {{"mm/h", 2.4}, {"cm/h", 24.0}, {"cm/d", 1.0}, {"mm/d", 0.1}, {"m/d", 100.0}, {"cm/s", 86400.0}, {"m/s", 8.64e6}}};
constexpr std::array<Unit, 3> inverse_length_units = {{{"1/mm", 10.0}, {"1/cm", 1.0}, {"1/m", 0.01}}};
constexpr std::array<Unit, 5> head_units = {{{"mm", 0.1},
                                             {"cm", 1.0},
                                             {"m", 100.0},
                                             {"hPa", kCentimetresOfWaterPerKilopascal / 10.0},
                                             {"kPa", kCentimetresOfWaterPerKilopascal}}};
constexpr std::array<Unit, 3> water_content_units = {{{"cm3/cm3", 1.0}, {"m3/m3", 1.0}, {"%", 0.01}}};
constexpr std::array<Unit, 2> wind_speed_units = {{{"m/s", 1.0}, {"km/h", 1.0 / 3.6}}};
constexpr std::array<Unit, 1> percentage_units = {{{"%", 1.0}}};
// 0 degC = 273.15 K (common practice).
constexpr std::array<Unit, 3> temperature_units = {{{"degC", 1.0}, {"C", 1.0}, {"K", 1.0, -273.15}}};

std::span<const Unit> units_of(Dimension dimension) {
  switch (dimension) {
    case Dimension::length: return length_units;
    case Dimension::area: return area_units;
    case Dimension::time: return time_units;
    case Dimension::conductivity: return conductivity_units;
    case Dimension::inverse_length: return inverse_length_units;
    case Dimension::pressure_head: return head_units;
    case Dimension::water_content: return water_content_units;
    case Dimension::wind_speed: return wind_speed_units;
    case Dimension::percentage: return percentage_units;
    case Dimension::temperature: return temperature_units;
  }
  return {};
}

}  // namespace

std::optional<double> to_number(std::string_view text) {
  double value = 0.0;
  const char* first = text.data();
  const char* last = text.data() + text.size();
  if (!text.empty() && *first == '+') ++first;
  const auto [ptr, ec] = std::from_chars(first, last, value);
  if (text.empty() || ec != std::errc() || ptr != last || !std::isfinite(value)) return std::nullopt;
  return value;
}

std::string trim(std::string_view text) {
  std::size_t begin = 0;
  std::size_t end = text.size();
  while (begin < end && std::isspace(static_cast<unsigned char>(text[begin]))) ++begin;
  while (end > begin && std::isspace(static_cast<unsigned char>(text[end - 1]))) --end;
  return std::string(text.substr(begin, end - begin));
}

std::string_view internal_unit(Dimension dimension) {
  switch (dimension) {
    case Dimension::length: return "cm";
    case Dimension::area: return "cm2";
    case Dimension::time: return "d";
    case Dimension::conductivity: return "cm/d";
    case Dimension::inverse_length: return "1/cm";
    case Dimension::pressure_head: return "cm";
    case Dimension::water_content: return "cm3/cm3";
    case Dimension::wind_speed: return "m/s";
    case Dimension::percentage: return "%";
    case Dimension::temperature: return "degC";
  }
  return "";
}

std::string accepted_units(Dimension dimension) {
  const auto units = units_of(dimension);
  std::string list;
  for (std::size_t i = 0; i < units.size(); ++i) {
    if (i > 0) list += (i + 1 == units.size()) ? " or " : ", ";
    list += units[i].name;
  }
  return list;
}

std::optional<double> to_internal(Dimension dimension, double value, std::string_view unit) {
  for (const auto& u : units_of(dimension)) {
    if (u.name == unit) return value * u.factor + u.offset;
  }
  return std::nullopt;
}

bool is_known_unit(std::string_view unit) {
  for (const auto dimension : {Dimension::length, Dimension::area, Dimension::time, Dimension::conductivity,
                               Dimension::inverse_length, Dimension::pressure_head, Dimension::water_content}) {
    if (to_internal(dimension, 0.0, unit)) return true;
  }
  return false;
}

double parse_number(std::string_view text, const std::string& what) {
  const std::string trimmed = trim(text);
  if (const auto value = to_number(trimmed)) return *value;
  throw InputError(fmt::format("{}: expected a number, got '{}'", what, trimmed));
}

double parse_quantity(std::string_view text, Dimension dimension, const std::string& what) {
  const std::string trimmed = trim(text);
  // The number ends where the unit starts: the first character that cannot be part of a
  // decimal number (letters other than an exponent 'e' followed by a digit or sign).
  std::size_t split = 0;
  while (split < trimmed.size()) {
    const char c = trimmed[split];
    const bool numeric = std::isdigit(static_cast<unsigned char>(c)) || c == '.' || c == '-' || c == '+';
    const bool exponent = (c == 'e' || c == 'E') && split + 1 < trimmed.size() &&
                          (std::isdigit(static_cast<unsigned char>(trimmed[split + 1])) || trimmed[split + 1] == '-' ||
                           trimmed[split + 1] == '+');
    if (!numeric && !exponent) break;
    ++split;
  }
  const std::string number_text = trim(std::string_view(trimmed).substr(0, split));
  const std::string unit = trim(std::string_view(trimmed).substr(split));
  const auto value = to_number(number_text);
  if (!value) {
    throw InputError(
        fmt::format("{}: expected a number with a unit ({}), got '{}'", what, accepted_units(dimension), trimmed));
  }
  if (unit.empty()) {
    throw InputError(fmt::format("{}: '{}' has no unit; write it with one of {}, e.g. '{} {}'", what, trimmed,
                                 accepted_units(dimension), number_text, internal_unit(dimension)));
  }
  const auto internal = to_internal(dimension, *value, unit);
  if (!internal) {
    throw InputError(fmt::format("{}: unit '{}' is not accepted here; use {}", what, unit, accepted_units(dimension)));
  }
  return *internal;
}

}  // namespace wetfront::base
