#include "wetfront/base/step_series.hpp"

#include <algorithm>
#include <cstddef>
#include <limits>
#include <stdexcept>

namespace wetfront::base {

double StepSeries::at(double t_days) const {
  if (values.empty()) throw std::logic_error("StepSeries::at on a series without values");
  // The last start <= t, or the first value before the first start.
  const auto after = std::upper_bound(start_days.begin(), start_days.end(), t_days);
  const auto i = after == start_days.begin() ? 0 : static_cast<std::size_t>(after - start_days.begin()) - 1;
  return values[i];
}

double StepSeries::integral(double from_days, double to_days) const {
  if (to_days < from_days) return -integral(to_days, from_days);
  constexpr double infinity = std::numeric_limits<double>::infinity();
  double total = 0;
  for (std::size_t i = 0; i < values.size(); ++i) {
    const double lo = i == 0 ? -infinity : start_days[i];
    const double hi = i + 1 < start_days.size() ? start_days[i + 1] : infinity;
    const double overlap = std::min(hi, to_days) - std::max(lo, from_days);
    if (overlap > 0) total += values[i] * overlap;
  }
  return total;
}

}  // namespace wetfront::base
