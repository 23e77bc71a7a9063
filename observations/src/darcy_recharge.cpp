// Darcy flux between two tensiometers, depth positive down, flux positive down:
//   q = K(h_mean) (1 - (h_lower - h_upper) / (d_lower - d_upper)),  h_mean arithmetic mean.
// Per visit interval: arithmetic mean of the fluxes at the two ends.
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/observations/recharge_estimates.hpp"
#include "wetfront/base/input_error.hpp"
#include "visit_pairs.hpp"

namespace wetfront::observations {

double darcy_flux_cm_per_d(const soils::HydraulicModel& soil, double upper_depth_cm, double upper_head_cm,
                           double lower_depth_cm, double lower_head_cm) {
  const double spacing = lower_depth_cm - upper_depth_cm;
  if (!(spacing > 0))
    throw base::InputError(fmt::format("the lower tensiometer ({} cm) must be deeper than the upper ({} cm)",
                                       lower_depth_cm, upper_depth_cm));
  const double mean_head = 0.5 * (upper_head_cm + lower_head_cm);
  const double head_gradient = (lower_head_cm - upper_head_cm) / spacing;
  return soils::conductivity(soil, mean_head) * (1.0 - head_gradient);
}

std::vector<IntervalRecharge> darcy_recharge(const TensiometerPair& pair, std::span<const PairHeads> visits) {
  auto flux_at = [&pair](const PairHeads& v) {
    return darcy_flux_cm_per_d(pair.soil, pair.upper_depth_cm, v.upper_head_cm, pair.lower_depth_cm, v.lower_head_cm);
  };
  auto rows = detail::rows_between_visits<IntervalRecharge>(
      visits, "tensiometer", [&](const PairHeads& from, const PairHeads& to) {
        IntervalRecharge row;
        row.start_day = from.day;
        row.end_day = to.day;
        row.mean_flux_cm_per_d = 0.5 * (flux_at(from) + flux_at(to));
        row.amount_cm = row.mean_flux_cm_per_d * (to.day - from.day);
        return row;
      });
  if (visits.size() == 1) flux_at(visits.front());  // still checks the depths
  return rows;
}

}  // namespace wetfront::observations
