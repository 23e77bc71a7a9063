#include "wetfront/solver/step_series.hpp"

#include <algorithm>
#include <stdexcept>

namespace wetfront::solver {

double StepSeries::at(double t_days) const {
  if (values.empty()) throw std::logic_error("StepSeries has no values");
  const auto it = std::upper_bound(start_days.begin(), start_days.end(), t_days);
  const auto index = it == start_days.begin() ? 0 : static_cast<std::size_t>(it - start_days.begin()) - 1;
  return values[index];
}

double StepSeries::integral(double from_days, double to_days) const {
  if (to_days <= from_days) return 0.0;
  double total = 0.0;
  double t = from_days;
  while (t < to_days) {
    const auto it = std::upper_bound(start_days.begin(), start_days.end(), t);
    const double next = it == start_days.end() ? to_days : std::min(*it, to_days);
    total += at(t) * (next - t);
    t = next;
  }
  return total;
}

}  // namespace wetfront::solver
