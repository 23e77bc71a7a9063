// Flags two recharge estimates that differ by more than a factor and says what to look at.
#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/observations/recharge_estimates.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

namespace {
std::vector<std::string> reasons() {
  return {
      "soil parameters: a Darcy or simulated flux scales with the conductivity of the layer around "
      "the sensors, so an error in its saturated conductivity or curve shape moves the estimate by "
      "the same factor",
      "sensor depth: the gradient is a head difference over a depth difference; a cup a few "
      "centimetres off its recorded depth, or a pair still inside the root zone, changes the "
      "gradient and can change the sign of the flux",
      "preferential flow: water moving through cracks, root channels or worm holes bypasses the "
      "soil the tensiometers and probes sense, so the water table can rise while the flux through "
      "the soil matrix stays small",
  };
}
}  // namespace

EstimateAgreement compare_recharge_estimates(double first_cm, double second_cm, ComparisonRule rule) {
  if (!(rule.factor > 1) || !(rule.negligible_cm >= 0))
    throw base::InputError(
        fmt::format("comparison factor {} must exceed 1 and the negligible amount {} cm must not be negative",
                    rule.factor, rule.negligible_cm));
  EstimateAgreement result;
  const double larger = std::max(std::abs(first_cm), std::abs(second_cm));
  const double smaller = std::min(std::abs(first_cm), std::abs(second_cm));
  if (larger == 0)
    result.ratio = std::numeric_limits<double>::quiet_NaN();
  else if (smaller == 0)
    result.ratio = std::numeric_limits<double>::infinity();
  else
    result.ratio = larger / smaller;

  if (larger <= rule.negligible_cm) return result;
  const bool opposite_signs = (first_cm > 0 && second_cm < 0) || (first_cm < 0 && second_cm > 0);
  result.disagree = opposite_signs || !(larger <= rule.factor * smaller);
  if (result.disagree) result.reasons_to_consider = reasons();
  return result;
}

}  // namespace wetfront::observations
