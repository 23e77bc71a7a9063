// A quantity that is constant between breakpoints: a rain rate, a potential evaporation rate,
// a root depth. Time in days since the run start. Same shape as the solver's StepSeries, kept
// separate so that forcing does not depend on the solver.
#pragma once

#include <vector>

namespace wetfront::forcing {

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

// A step series of a rate together with the end of the time it is known for: the rate is
// defined on [start_days.front(), end_day) and says nothing after end_day.
struct CoveredSeries {
  StepSeries series;
  double end_day = 0;
};

}  // namespace wetfront::forcing
