// Random numbers whose values the C++ standard fixes: std::mt19937_64 and our own conversions
// (the standard distributions leave their output to the library), so that a seed gives the same
// draws on every machine.
#pragma once

#include <cmath>
#include <numbers>
#include <random>

namespace wetfront::studies::detail {

// Uniform on (0, 1) from the top 53 bits of one 64-bit draw.
inline double uniform_open(std::mt19937_64& generator) {
  return (static_cast<double>(generator() >> 11) + 0.5) * 0x1.0p-53;
}

// Standard normal by the Box-Muller transform (Box & Muller 1958), one value per pair of draws.
inline double standard_normal(std::mt19937_64& generator) {
  const double u1 = uniform_open(generator);
  const double u2 = uniform_open(generator);
  return std::sqrt(-2.0 * std::log(u1)) * std::cos(2.0 * std::numbers::pi * u2);
}

}  // namespace wetfront::studies::detail
