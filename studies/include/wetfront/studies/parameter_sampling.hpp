// Parameter sets for a sweep: a full grid over few parameters, or a Latin hypercube sample
// over many (McKay, Beckman & Conover 1979: each parameter's range is cut into `count` equal
// strata on its search scale and every stratum is sampled exactly once).
//
// Both are deterministic: the grid by construction, the sample from its seed through a
// generator whose output the C++ standard fixes (std::mt19937_64) and our own conversions to
// uniform numbers and permutations, so a seed gives the same sets on every machine.
#pragma once

#include <cstdint>
#include <span>
#include <vector>

#include "wetfront/studies/parameter_space.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {

// Every combination of each parameter's grid_points values, evenly spaced on its search scale
// with both ends included. The first parameter varies slowest. Throws base::InputError
// when the grid would exceed max_sets sets (naming the count).
std::vector<ParameterSet> full_grid(std::span<const AdjustableParameter> parameters, std::size_t max_sets);

// `count` sets; within each stratum the point is drawn uniformly at random. Throws
// base::InputError when count is zero.
std::vector<ParameterSet> latin_hypercube(std::span<const AdjustableParameter> parameters, std::size_t count,
                                          std::uint64_t seed);

}  // namespace wetfront::studies
