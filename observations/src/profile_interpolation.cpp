// Linear interpolation in depth, then in time, between simulated output profiles.
#include "wetfront/observations/profile_interpolation.hpp"

#include <algorithm>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

namespace {

void check_axis(const std::vector<double>& axis, const char* name) {
  if (axis.empty()) throw base::InputError(fmt::format("simulated profiles have no {}", name));
  for (std::size_t i = 1; i < axis.size(); ++i)
    if (!(axis[i] > axis[i - 1]))
      throw base::InputError(
          fmt::format("simulated {} must increase strictly: {} follows {}", name, axis[i], axis[i - 1]));
}

// Index i and weight w with x = (1 - w) axis[i] + w axis[i+1]; nullopt outside the axis.
// A one-point axis covers only its own point.
struct Bracket {
  std::size_t lower;
  double weight;
};

std::optional<Bracket> bracket(const std::vector<double>& axis, double x) {
  if (x < axis.front() || x > axis.back()) return std::nullopt;
  if (axis.size() == 1) return Bracket{0, 0.0};
  const auto upper = std::upper_bound(axis.begin(), axis.end(), x);
  const std::size_t i = upper == axis.end() ? axis.size() - 2 : static_cast<std::size_t>(upper - axis.begin()) - 1;
  return Bracket{i, (x - axis[i]) / (axis[i + 1] - axis[i])};
}

double lerp_at(const std::vector<double>& values, const Bracket& b) {
  if (b.weight == 0.0) return values[b.lower];
  return (1.0 - b.weight) * values[b.lower] + b.weight * values[b.lower + 1];
}

}  // namespace

void check_profiles(const SimulatedProfiles& profiles) {
  check_axis(profiles.times_day, "output times");
  check_axis(profiles.depths_cm, "cell depths");
  if (profiles.values.size() != profiles.times_day.size())
    throw base::InputError(
        fmt::format("{} simulated profiles for {} output times", profiles.values.size(), profiles.times_day.size()));
  for (std::size_t t = 0; t < profiles.values.size(); ++t)
    if (profiles.values[t].size() != profiles.depths_cm.size())
      throw base::InputError(fmt::format("simulated profile at day {} has {} values for {} cells",
                                         profiles.times_day[t], profiles.values[t].size(), profiles.depths_cm.size()));
}

std::optional<double> simulated_value_at(const SimulatedProfiles& profiles, double day, double depth_cm) {
  const auto in_time = bracket(profiles.times_day, day);
  const auto in_depth = bracket(profiles.depths_cm, depth_cm);
  if (!in_time || !in_depth) return std::nullopt;
  const double earlier = lerp_at(profiles.values[in_time->lower], *in_depth);
  if (in_time->weight == 0.0) return earlier;
  const double later = lerp_at(profiles.values[in_time->lower + 1], *in_depth);
  return (1.0 - in_time->weight) * earlier + in_time->weight * later;
}

}  // namespace wetfront::observations
