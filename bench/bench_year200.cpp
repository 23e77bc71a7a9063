// Google Benchmark: one simulated year of the year200 column (bench/README.md).
#include <benchmark/benchmark.h>

#include "year200_column.hpp"

static void year200_one_year(benchmark::State& state) {
  const auto problem = wetfront::bench::year200_column(WETFRONT_BENCH_DIR "/surface_flux.csv");
  wetfront::solver::RunStatistics stats;
  for (auto _ : state) {
    const auto run = wetfront::solver::simulate(problem);
    if (!run.complete) state.SkipWithError("run did not complete");
    stats = run.statistics;
    benchmark::DoNotOptimize(run.balances.back().bottom_flux_cm);
  }
  state.counters["steps"] = static_cast<double>(stats.steps);
  state.counters["newton_iterations"] = static_cast<double>(stats.nonlinear_iterations);
  state.counters["jacobians"] = static_cast<double>(stats.jacobian_evaluations);
  state.counters["residuals"] = static_cast<double>(stats.residual_evaluations);
}
BENCHMARK(year200_one_year)->Unit(benchmark::kMillisecond)->Repetitions(5)->ReportAggregatesOnly(true);

BENCHMARK_MAIN();
