// A quantity that is constant between breakpoints: a rain rate, a potential evaporation rate,
// a prescribed head, a root depth. Time in days since the run start.
#pragma once

#include <vector>

namespace wetfront::base {

struct StepSeries {
  // values[i] holds on [start_days[i], start_days[i+1]); the last value holds from the last
  // start onward, and the first also before the first start. start_days strictly increasing.
  std::vector<double> start_days;
  std::vector<double> values;

  static StepSeries constant(double value) { return {{0.0}, {value}}; }
  // The value at t. A series without values is a fault of the program (std::logic_error).
  double at(double t_days) const;
  // The oriented integral over [from, to], in value units times days: the integral from
  // `from` to `to`, so that integral(b, a) = -integral(a, b) and integral(a, a) = 0.
  double integral(double from_days, double to_days) const;
};

}  // namespace wetfront::base
