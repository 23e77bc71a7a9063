// The one check of a step series given to the solver: one value per start time, start times
// increasing, values finite (and, where asked, not negative). Throws std::invalid_argument.
#pragma once

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/solver/step_series.hpp"

namespace wetfront::solver::detail {

inline void check_step_series(const StepSeries& s, const char* what, bool not_negative) {
  if (s.values.empty() || s.values.size() != s.start_days.size())
    throw std::invalid_argument(fmt::format("{}: a step series needs one value per start time", what));
  for (std::size_t i = 1; i < s.start_days.size(); ++i)
    if (!(s.start_days[i] > s.start_days[i - 1]))
      throw std::invalid_argument(fmt::format("{}: start times must increase", what));
  for (double v : s.values) {
    if (!std::isfinite(v) || (not_negative && !(v >= 0)))
      throw std::invalid_argument(fmt::format("{}: values must be finite{} (found {})", what,
                                              not_negative ? " and not negative" : "", v));
  }
}

}  // namespace wetfront::solver::detail
