// Google Benchmark: the full season model on the demo site (examples/demo): daily rain and
// irrigation, Class A pan evaporation x pan and crop coefficients, leaf-area split, Feddes
// root uptake, ponding events; 200 days on the demo grid (297 cells). Only the solver run is
// timed; the site file and its records are read once.
#include <benchmark/benchmark.h>

#include "timed_runs.hpp"

#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/site_file.hpp"

static void demo_season(benchmark::State& state) {
  const auto season = wetfront::site::prepare_season(
      wetfront::site::load_site_file(WETFRONT_SOURCE_DIR "/examples/demo/site.toml"));
  wetfront::bench::time_runs(state, season.problem);
}
BENCHMARK(demo_season)->Unit(benchmark::kMillisecond)->Repetitions(5)->ReportAggregatesOnly(true);

BENCHMARK_MAIN();
