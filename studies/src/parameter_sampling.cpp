#include "wetfront/studies/parameter_sampling.hpp"

#include <random>
#include <stdexcept>
#include <utility>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::studies {
namespace {

// Uniform on [0, 1) from the top 53 bits of one 64-bit draw.
double uniform(std::mt19937_64& generator) { return static_cast<double>(generator() >> 11) * 0x1.0p-53; }

// Uniform integer on [0, bound) by rejection, free of modulo bias.
std::size_t below(std::mt19937_64& generator, std::size_t bound) {
  const std::uint64_t limit = std::mt19937_64::max() - std::mt19937_64::max() % bound;
  std::uint64_t draw = generator();
  while (draw >= limit) draw = generator();
  return static_cast<std::size_t>(draw % bound);
}

}  // namespace

std::vector<ParameterSet> full_grid(std::span<const AdjustableParameter> parameters, std::size_t max_sets) {
  if (parameters.empty()) throw base::InputError("a grid needs at least one adjustable parameter");
  std::size_t total = 1;
  for (const auto& p : parameters) {
    check_parameter(p);
    total *= static_cast<std::size_t>(p.grid_points);
    if (total > max_sets)
      throw base::InputError(
          fmt::format("the full grid has more than {} parameter sets; use fewer points or a sample", max_sets));
  }
  std::vector<ParameterSet> sets;
  sets.reserve(total);
  std::vector<int> index(parameters.size(), 0);
  for (std::size_t s = 0; s < total; ++s) {
    ParameterSet set;
    for (std::size_t k = 0; k < parameters.size(); ++k) {
      const auto& p = parameters[k];
      const double low = to_search_scale(p, p.lower);
      const double high = to_search_scale(p, p.upper);
      const double fraction = static_cast<double>(index[k]) / (p.grid_points - 1);
      // The ends exactly as written (pow(10, log10(x)) need not return x).
      set.push_back(index[k] == 0                   ? p.lower
                    : index[k] == p.grid_points - 1 ? p.upper
                                                    : from_search_scale(p, low + fraction * (high - low)));
    }
    sets.push_back(std::move(set));
    for (std::size_t k = parameters.size(); k-- > 0;) {  // odometer: last parameter fastest
      if (++index[k] < parameters[k].grid_points) break;
      index[k] = 0;
    }
  }
  return sets;
}

std::vector<ParameterSet> latin_hypercube(std::span<const AdjustableParameter> parameters, std::size_t count,
                                          std::uint64_t seed) {
  if (parameters.empty()) throw base::InputError("a sample needs at least one adjustable parameter");
  if (count == 0) throw base::InputError("a sample needs at least one parameter set");
  for (const auto& p : parameters) check_parameter(p);
  std::mt19937_64 generator(seed);
  std::vector<ParameterSet> sets(count, ParameterSet(parameters.size()));
  std::vector<std::size_t> strata(count);
  for (std::size_t k = 0; k < parameters.size(); ++k) {
    for (std::size_t i = 0; i < count; ++i) strata[i] = i;
    for (std::size_t i = count; i > 1; --i) std::swap(strata[i - 1], strata[below(generator, i)]);  // Fisher-Yates
    const auto& p = parameters[k];
    const double low = to_search_scale(p, p.lower);
    const double high = to_search_scale(p, p.upper);
    for (std::size_t i = 0; i < count; ++i) {
      const double fraction = (static_cast<double>(strata[i]) + uniform(generator)) / static_cast<double>(count);
      sets[i][k] = from_search_scale(p, low + fraction * (high - low));
    }
  }
  return sets;
}

}  // namespace wetfront::studies
