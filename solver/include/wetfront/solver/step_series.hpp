// A quantity that is constant between breakpoints (daily rain, a prescribed head, ...).
// Time in days since the run start.
#pragma once

#include <span>
#include <vector>

namespace wetfront::solver {

struct StepSeries {
  // values[i] holds on [start_days[i], start_days[i+1]); the last value holds from the last
  // start onward, and the first also before the first start. start_days strictly increasing.
  std::vector<double> start_days;
  std::vector<double> values;

  static StepSeries constant(double value) { return {{0.0}, {value}}; }
  double at(double t_days) const;
  // Integral of the series over [from, to], in value units times days.
  double integral(double from_days, double to_days) const;
};

}  // namespace wetfront::solver
