// Google Benchmark: the full season model on the demo site (examples/demo): daily rain and
// irrigation, Class A pan evaporation x pan and crop coefficients, leaf-area split, Feddes
// root uptake, ponding events; 200 days, 66 cells. Only the solver run is timed; the site
// file and its records are read once.
#include <benchmark/benchmark.h>

#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/site_file.hpp"

static void demo_season(benchmark::State& state) {
  const auto season = wetfront::site::prepare_season(
      wetfront::site::load_site_file(WETFRONT_SOURCE_DIR "/examples/demo/site.toml"));
  wetfront::solver::RunStatistics stats;
  for (auto _ : state) {
    const auto run = wetfront::solver::simulate(season.problem);
    if (!run.complete) state.SkipWithError("run did not complete");
    stats = run.statistics;
    benchmark::DoNotOptimize(run.balances.back().bottom_flux_cm);
  }
  state.counters["steps"] = static_cast<double>(stats.steps);
  state.counters["newton_iterations"] = static_cast<double>(stats.nonlinear_iterations);
  state.counters["jacobians"] = static_cast<double>(stats.jacobian_evaluations);
  state.counters["surface_switches"] = static_cast<double>(stats.surface_switches);
}
BENCHMARK(demo_season)->Unit(benchmark::kMillisecond)->Repetitions(5)->ReportAggregatesOnly(true);

BENCHMARK_MAIN();
