// Forcing as step series in time (base::StepSeries), and a series known only up to an end day.
#pragma once

#include "wetfront/base/step_series.hpp"

namespace wetfront::forcing {

// A step series of a rate together with the end of the time it is known for: the rate is
// defined on [start_days.front(), end_day) and says nothing after end_day.
struct CoveredSeries {
  base::StepSeries series;
  double end_day = 0;
};

}  // namespace wetfront::forcing
