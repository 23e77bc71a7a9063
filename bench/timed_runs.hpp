// The timing loop shared by the Google Benchmark programs: simulate one problem per iteration,
// fail the benchmark if a run stops early, and report the solver's work as counters.
#pragma once

#include <benchmark/benchmark.h>

#include "wetfront/solver/column_run.hpp"

namespace wetfront::bench {

inline void time_runs(benchmark::State& state, const solver::ColumnProblem& problem) {
  solver::RunStatistics stats;
  for (auto _ : state) {
    const auto run = solver::simulate(problem);
    if (!run.complete) state.SkipWithError("run did not complete");
    stats = run.statistics;
    benchmark::DoNotOptimize(run.balances.back().bottom_flux_cm);
  }
  state.counters["steps"] = static_cast<double>(stats.steps);
  state.counters["newton_iterations"] = static_cast<double>(stats.nonlinear_iterations);
  state.counters["jacobians"] = static_cast<double>(stats.jacobian_evaluations);
  state.counters["surface_switches"] = static_cast<double>(stats.surface_switches);
}

}  // namespace wetfront::bench
