// Google Benchmark: a parameter sweep of the demo site (examples/demo) with the site file's own
// study: 8 Latin hypercube sets of the loam subsoil's saturated conductivity (5-80 cm/d, log)
// and n (1.25-1.8), each a full 200-day season scored against the sensor readings. Run on 1 and on 2 threads; the counter
// `per_run` is the wall time of the sweep divided by its runs, and the ratio of the two rows
// is the speed-up from one core to two. The field records are read once, outside the timing.
#include <benchmark/benchmark.h>

#include "wetfront/site/adjustable_parameters.hpp"
#include "wetfront/site/parameter_study.hpp"
#include "wetfront/site/site_file.hpp"

namespace {

using namespace wetfront;

void sweep(benchmark::State& state) {
  site::SiteSetup demo = site::load_site_file(WETFRONT_SOURCE_DIR "/examples/demo/site.toml");
  site::ParameterStudy study = site::load_parameter_study(demo);  // the demo's own study
  const site::SeasonModel model(std::move(demo), std::move(study));
  const std::size_t runs = 8;
  const site::SweepSettings settings{.full_grid = false, .sample_size = runs, .seed = 1,
                                    .threads = static_cast<unsigned>(state.range(0))};
  for (auto _ : state) {
    const auto result = site::run_sweep(model, settings);
    for (const auto& run : result.runs)
      if (!run.complete) state.SkipWithError("a run did not complete");
    benchmark::DoNotOptimize(result.ranking.front());
  }
  state.counters["per_run"] = benchmark::Counter(static_cast<double>(runs), benchmark::Counter::kIsIterationInvariantRate |
                                                                              benchmark::Counter::kInvert);
}

}  // namespace

BENCHMARK(sweep)->Arg(1)->Arg(2)->ArgName("threads")->Unit(benchmark::kMillisecond)->UseRealTime()->Repetitions(5)
    ->ReportAggregatesOnly(true);

BENCHMARK_MAIN();
