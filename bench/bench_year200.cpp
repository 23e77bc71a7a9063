// Google Benchmark: one simulated year of the year200 column (bench/README.md), by wetfront's
// solver and by the textbook modified-Picard scheme (picard_scheme.hpp) on the same column,
// forcing and cells. After the timings it prints both schemes side by side: median CPU time,
// the ratio, steps, iterations, and each scheme's time-stepping error of the daily heads
// (RMS at 10, 30, 60, 100 and 150 cm against a tight-tolerance run of the same scheme).
#include <benchmark/benchmark.h>

#include <algorithm>
#include <cmath>
#include <map>
#include <string>

#include <fmt/format.h>

#include "picard_scheme.hpp"
#include "timed_runs.hpp"
#include "year200_column.hpp"

namespace {

using namespace wetfront;

const solver::ColumnProblem& column() {
  static const auto problem = bench::year200_column(WETFRONT_BENCH_DIR "/surface_flux.csv");
  return problem;
}

constexpr double report_depths[] = {10.0, 30.0, 60.0, 100.0, 150.0};

bench::DailyHeads picard_heads(const bench::PicardRun& run) {
  bench::DailyHeads rows;
  for (const auto& day : run.head_cm) rows.push_back({day[0], day[1], day[2], day[3], day[4]});
  return rows;
}

void year200_wetfront(benchmark::State& state) { bench::time_runs(state, column()); }
BENCHMARK(year200_wetfront)->Unit(benchmark::kMillisecond)->Repetitions(5)->ReportAggregatesOnly(true);

void year200_picard(benchmark::State& state) {
  bench::PicardRun run;
  for (auto _ : state) {
    run = bench::run_picard(column(), report_depths);
    if (!run.complete) state.SkipWithError("run did not complete");
    benchmark::DoNotOptimize(run.bottom_flux_cm);
  }
  state.counters["steps"] = static_cast<double>(run.steps);
  state.counters["iterations"] = static_cast<double>(run.iterations);
}
BENCHMARK(year200_picard)->Unit(benchmark::kMillisecond)->Repetitions(3)->ReportAggregatesOnly(true);

// Keeps the median CPU time (ms) of each benchmark as the console reporter prints it.
class MedianKeeper : public benchmark::ConsoleReporter {
 public:
  void ReportRuns(const std::vector<Run>& runs) override {
    for (const auto& run : runs)
      if (run.aggregate_name == "median") median_ms[run.run_name.function_name] = run.GetAdjustedCPUTime();
    ConsoleReporter::ReportRuns(runs);
  }
  std::map<std::string, double> median_ms;
};

void print_side_by_side(const std::map<std::string, double>& median_ms) {
  auto tight_problem = column();
  tight_problem.settings = bench::tight_settings();
  const auto ours = solver::simulate(column());
  const auto ours_tight = solver::simulate(tight_problem);
  bench::PicardSettings tight_picard;
  tight_picard.head_tolerance_cm = 1e-5;
  tight_picard.max_step_days = 0.01;
  const auto picard = bench::run_picard(column(), report_depths);
  const auto picard_tight = bench::run_picard(column(), report_depths, tight_picard);
  if (!ours.complete || !ours_tight.complete || !picard.complete || !picard_tight.complete) {
    fmt::print("a comparison run did not complete\n");
    return;
  }
  const double ours_ms = median_ms.at("year200_wetfront"), picard_ms = median_ms.at("year200_picard");
  const double ours_error = bench::rms_difference(bench::daily_heads(ours), bench::daily_heads(ours_tight));
  const double picard_error = bench::rms_difference(picard_heads(picard), picard_heads(picard_tight));
  fmt::print("\nyear200, one year, 200 cells of 1 cm       wetfront (IDA)   modified Picard\n");
  fmt::print("CPU time per column-year (median)   {:12.1f} ms {:14.1f} ms\n", ours_ms, picard_ms);
  fmt::print("Picard time / wetfront time         {:12.1f}\n", picard_ms / ours_ms);
  fmt::print("steps                               {:12} {:17}\n", ours.statistics.steps, picard.steps);
  fmt::print("iterations (Newton / Picard)        {:12} {:17}\n", ours.statistics.nonlinear_iterations,
             picard.iterations);
  fmt::print("daily-head time-stepping error RMS  {:12.4f} cm {:14.4f} cm\n", ours_error, picard_error);
  fmt::print("water balance error                 {:12.2e} cm {:14.2e} cm\n", ours.balances.back().balance_error_cm,
             picard.balance_error_cm);
  fmt::print("bottom flux                         {:12.3f} cm {:14.3f} cm\n", ours.balances.back().bottom_flux_cm,
             picard.bottom_flux_cm);
}

}  // namespace

int main(int argc, char** argv) {
  benchmark::Initialize(&argc, argv);
  if (benchmark::ReportUnrecognizedArguments(argc, argv)) return 1;
  MedianKeeper reporter;
  benchmark::RunSpecifiedBenchmarks(&reporter);
  if (reporter.median_ms.count("year200_wetfront") && reporter.median_ms.count("year200_picard"))
    print_side_by_side(reporter.median_ms);
  benchmark::Shutdown();
  return 0;
}
