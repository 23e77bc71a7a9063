// A quantity that is constant between breakpoints (daily rain, a prescribed head, ...):
// the project's one step series, base::StepSeries. Time in days since the run start.
#pragma once

#include <span>
#include <vector>

#include "wetfront/base/step_series.hpp"

namespace wetfront::solver {

using StepSeries = base::StepSeries;

}  // namespace wetfront::solver
