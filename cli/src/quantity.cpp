#include "quantity.hpp"

#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <span>
#include <utility>

#include <fmt/format.h>

#include "input_error.hpp"

namespace wetfront::cli {
namespace {

using UnitEntry = std::pair<std::string_view, double>;

// 1 kPa of water pressure = 1000 Pa / (1000 kg/m3 * 9.80665 m/s2) = 0.101972 m of water
// (standard gravity; water density taken as 1000 kg/m3, common practice).
constexpr double cm_of_water_per_kpa = 100000.0 / (1000.0 * 9.80665);

constexpr std::array<UnitEntry, 3> length_units = {{{"mm", 0.1}, {"cm", 1.0}, {"m", 100.0}}};
constexpr std::array<UnitEntry, 3> area_units = {{{"mm2", 0.01}, {"cm2", 1.0}, {"m2", 1.0e4}}};
constexpr std::array<UnitEntry, 4> time_units = {{{"s", 1.0 / 86400.0}, {"min", 1.0 / 1440.0}, {"h", 1.0 / 24.0}, {"d", 1.0}}};
constexpr std::array<UnitEntry, 7> conductivity_units = {{{"mm/h", 2.4}, {"cm/h", 24.0}, {"cm/d", 1.0}, {"mm/d", 0.1},
                                                          {"m/d", 100.0}, {"cm/s", 86400.0}, {"m/s", 8.64e6}}};
constexpr std::array<UnitEntry, 3> inverse_length_units = {{{"1/mm", 10.0}, {"1/cm", 1.0}, {"1/m", 0.01}}};
constexpr std::array<UnitEntry, 5> head_units = {
    {{"mm", 0.1}, {"cm", 1.0}, {"m", 100.0}, {"hPa", cm_of_water_per_kpa / 10.0}, {"kPa", cm_of_water_per_kpa}}};
constexpr std::array<UnitEntry, 3> water_content_units = {{{"cm3/cm3", 1.0}, {"m3/m3", 1.0}, {"%", 0.01}}};

std::span<const UnitEntry> units_of(Dimension dimension) {
  switch (dimension) {
    case Dimension::length: return length_units;
    case Dimension::area: return area_units;
    case Dimension::time: return time_units;
    case Dimension::conductivity: return conductivity_units;
    case Dimension::inverse_length: return inverse_length_units;
    case Dimension::pressure_head: return head_units;
    case Dimension::water_content: return water_content_units;
  }
  return {};
}

std::optional<double> to_double(std::string_view text) {
  double value = 0.0;
  const char* first = text.data();
  const char* last = text.data() + text.size();
  if (!text.empty() && *first == '+') ++first;
  const auto [ptr, ec] = std::from_chars(first, last, value);
  if (ec != std::errc() || ptr != last || !std::isfinite(value)) return std::nullopt;
  return value;
}

}  // namespace

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
  }
  return "";
}

std::string accepted_units(Dimension dimension) {
  const auto units = units_of(dimension);
  std::string list;
  for (std::size_t i = 0; i < units.size(); ++i) {
    if (i > 0) list += (i + 1 == units.size()) ? " or " : ", ";
    list += units[i].first;
  }
  return list;
}

std::optional<double> unit_factor(Dimension dimension, std::string_view unit) {
  for (const auto& [name, factor] : units_of(dimension)) {
    if (name == unit) return factor;
  }
  return std::nullopt;
}

bool is_known_unit(std::string_view unit) {
  for (const auto dimension : {Dimension::length, Dimension::area, Dimension::time, Dimension::conductivity,
                               Dimension::inverse_length, Dimension::pressure_head, Dimension::water_content}) {
    if (unit_factor(dimension, unit)) return true;
  }
  return false;
}

double parse_number(std::string_view text, const std::string& what) {
  const std::string trimmed = trim(text);
  if (const auto value = to_double(trimmed)) return *value;
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
                          (std::isdigit(static_cast<unsigned char>(trimmed[split + 1])) ||
                           trimmed[split + 1] == '-' || trimmed[split + 1] == '+');
    if (!numeric && !exponent) break;
    ++split;
  }
  const std::string number_text = trim(std::string_view(trimmed).substr(0, split));
  const std::string unit = trim(std::string_view(trimmed).substr(split));
  const auto value = to_double(number_text);
  if (!value) {
    throw InputError(fmt::format("{}: expected a number with a unit ({}), got '{}'", what,
                                 accepted_units(dimension), trimmed));
  }
  if (unit.empty()) {
    throw InputError(fmt::format("{}: '{}' has no unit; write it with one of {}, e.g. '{} {}'", what, trimmed,
                                 accepted_units(dimension), number_text, internal_unit(dimension)));
  }
  const auto factor = unit_factor(dimension, unit);
  if (!factor) {
    throw InputError(fmt::format("{}: unit '{}' is not accepted here; use {}", what, unit, accepted_units(dimension)));
  }
  return *value * *factor;
}

}  // namespace wetfront::cli
