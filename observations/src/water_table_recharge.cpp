// Water-table fluctuation method (Healy & Cook 2002): R = Sy * rise, rises only, the rise taken
// against the depth the antecedent recession would have reached over the interval.
#include <algorithm>
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/observations/recharge_estimates.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

std::vector<IntervalRecharge> water_table_recharge(const WaterTableFluctuation& method,
                                                   std::span<const WaterTableReading> readings) {
  if (!(method.specific_yield > 0 && method.specific_yield < 1))
    throw base::InputError(fmt::format("specific yield {} must lie between 0 and 1", method.specific_yield));
  if (!(method.antecedent_recession_cm_per_d >= 0))
    throw base::InputError(
        fmt::format("antecedent recession rate {} cm/d must not be negative", method.antecedent_recession_cm_per_d));
  std::vector<IntervalRecharge> rows;
  for (std::size_t i = 1; i < readings.size(); ++i) {
    const WaterTableReading& from = readings[i - 1];
    const WaterTableReading& to = readings[i];
    const double days = to.day - from.day;
    if (!(days > 0))
      throw base::InputError(fmt::format("water-table readings out of order: day {} follows day {}", to.day, from.day));
    const double depth_without_recharge = from.depth_cm + method.antecedent_recession_cm_per_d * days;
    const double rise_cm = std::max(0.0, depth_without_recharge - to.depth_cm);
    IntervalRecharge row;
    row.start_day = from.day;
    row.end_day = to.day;
    row.amount_cm = method.specific_yield * rise_cm;
    row.mean_flux_cm_per_d = row.amount_cm / days;
    rows.push_back(row);
  }
  return rows;
}

}  // namespace wetfront::observations
