// A run the integrator cannot finish, told in plain words: when, at what depth, what the soil
// there was doing, and what to try.
#pragma once

#include <cstddef>
#include <span>

#include "column_model.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver::detail {

// Our own stop: the run needed more steps than SolverSettings::max_steps_per_day allows.
inline constexpr int step_budget_exceeded = 1000;

RunFailure describe_failure(int flag, double t_days, double last_step_days, long step_budget, std::size_t cell,
                            const ColumnModel& model, std::span<const double> y);

}  // namespace wetfront::solver::detail
