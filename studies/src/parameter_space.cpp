#include "wetfront/studies/parameter_space.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {

double to_search_scale(const AdjustableParameter& parameter, double value) {
  if (parameter.scale == ParameterScale::linear) return value;
  if (!(value > 0.0))
    throw base::InputError(
        fmt::format("parameter '{}' is searched on a log scale but took the value {}", parameter.name, value));
  return std::log10(value);
}

double from_search_scale(const AdjustableParameter& parameter, double search_value) {
  return parameter.scale == ParameterScale::linear ? search_value : std::pow(10.0, search_value);
}

void check_parameter(const AdjustableParameter& p) {
  const std::string unit = p.unit.empty() ? "" : " " + p.unit;
  if (!(p.lower < p.upper))
    throw base::InputError(
        fmt::format("parameter '{}': the range must run from a lower to a higher value (got {}{} to {}{})", p.name,
                    p.lower, unit, p.upper, unit));
  if (p.scale == ParameterScale::log && !(p.lower > 0.0))
    throw base::InputError(
        fmt::format("parameter '{}': a log scale needs a range above zero (lower end {}{})", p.name, p.lower, unit));
  if (!(p.start >= p.lower && p.start <= p.upper))
    throw base::InputError(fmt::format("parameter '{}': the site's value {}{} lies outside the range {}{} to {}{}",
                                       p.name, p.start, unit, p.lower, unit, p.upper, unit));
  if (p.grid_points < 2)
    throw base::InputError(
        fmt::format("parameter '{}': a grid needs at least 2 points (got {})", p.name, p.grid_points));
}

}  // namespace wetfront::studies
