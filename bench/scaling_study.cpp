// How the cost of a run grows with the number of cells and with the specific storage:
//  1. year200 (year200-column.md) on 100, 200, 400, 800 and 1600 uniform cells: CPU time per
//     column-year and the exponent of time against cells between successive grids;
//  2. ponded infiltration into dry loam: Carsel & Parrish (1988) loam (values from memory, as in
//     tests/solver/solver_test_soils.hpp), 100 cm, initially -1000 cm, surface held at 0 cm for
//     2 days, free drainage, on cells of 1, 0.5, 0.25, 0.125 and 0.0625 cm: time and the factor per
//     halving of the cell size;
//  3. the same ponded loam on 0.25 cm cells with specific storage from 1e-6 to 1e-3 /cm;
//  4. `ponded-spread`: the ponded loam of 2. from five initial heads within 0.1 cm of -1000 cm.
//     Which steps IDA accepts turns on round-off, so one trajectory's step count moves by up to
//     a third for a change of 0.01 cm in the initial head; the medians over the five give the
//     trend per halving, the range how far one run may stray from it.
// Usage: scaling_study [cells|cell-errors|ponded|ponded-spread|storage]...
//        (cells, ponded and storage without arguments)
#include <algorithm>
#include <array>
#include <cmath>
#include <ctime>
#include <set>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "year200_column.hpp"

namespace {

using namespace wetfront;

struct Timed {
  solver::ColumnRun run;
  double cpu_ms;
};

// The median CPU time of three runs (single runs of the smallest cases vary by up to a third).
Timed timed(const solver::ColumnProblem& problem) {
  std::array<double, 3> ms{};
  solver::ColumnRun run;
  for (double& m : ms) {
    const std::clock_t start = std::clock();
    run = solver::simulate(problem);
    m = 1000.0 * static_cast<double>(std::clock() - start) / CLOCKS_PER_SEC;
  }
  std::ranges::sort(ms);
  return {std::move(run), ms[1]};
}

void print_row(const std::string& label, const Timed& t, double previous_ms, double exponent_base) {
  const auto& s = t.run.statistics;
  fmt::print("{:>14} {:10.1f} ms {:8} steps {:8} Newton {:7} failed", label, t.cpu_ms, s.steps, s.nonlinear_iterations,
             s.nonlinear_failures);
  if (previous_ms > 0)
    fmt::print("  x{:.2f} (exponent {:.2f})", t.cpu_ms / previous_ms,
               std::log(t.cpu_ms / previous_ms) / std::log(exponent_base));
  if (!t.run.complete) fmt::print("  INCOMPLETE: {}", t.run.failure ? t.run.failure->reason : "");
  fmt::print("\n");
}

void cells_study() {
  fmt::print("year200, one year, cells from 100 to 1600 (time against cells, median of 3)\n");
  double previous = 0, first = 0;
  for (std::size_t cells : {100, 200, 400, 800, 1600}) {
    auto problem = bench::year200_column(WETFRONT_BENCH_DIR "/surface_flux.csv");
    problem.grid = solver::uniform_grid(200.0, cells);
    const auto t = timed(problem);
    print_row(fmt::format("{} cells", cells), t, previous, 2.0);
    previous = t.cpu_ms;
    if (first == 0) first = t.cpu_ms;
  }
  fmt::print("{:>14} exponent {:.3f} from 100 to 1600 cells\n", "", std::log(previous / first) / std::log(16.0));
}

// The time-stepping error on each grid: daily heads at the report depths against a
// tight-tolerance run on the same grid.
void cell_error_study() {
  fmt::print("year200, time-stepping error of the daily heads on each grid (against tight tolerances)\n");
  for (std::size_t cells : {100, 200, 400, 800, 1600}) {
    auto problem = bench::year200_column(WETFRONT_BENCH_DIR "/surface_flux.csv");
    problem.grid = solver::uniform_grid(200.0, cells);
    const auto t = timed(problem);
    problem.settings = bench::tight_settings();
    const auto tight = solver::simulate(problem);
    fmt::print("{:>14} {:10.1f} ms {:8} steps  head error {:.4f} cm RMS  bottom flux {:.4f} cm (tight {:.4f})\n",
               fmt::format("{} cells", cells), t.cpu_ms, t.run.statistics.steps,
               bench::rms_difference(bench::daily_heads(t.run), bench::daily_heads(tight)),
               t.run.balances.back().bottom_flux_cm, tight.balances.back().bottom_flux_cm);
  }
}

solver::ColumnProblem ponded_loam(double cell_cm, double specific_storage, double initial_head_cm = -1000.0) {
  const soils::VanGenuchtenMualem loam{0.078, 0.43, 0.036, 1.56, 24.96, 0.5};
  solver::ColumnProblem problem{
      .soil = soils::LayeredProfile({{"loam", 0.0, 100.0, loam}}),
      .grid = solver::uniform_grid(100.0, static_cast<std::size_t>(std::lround(100.0 / cell_cm)))};
  problem.top = solver::PrescribedHead{solver::StepSeries::constant(0.0)};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{initial_head_cm};
  if (specific_storage > 0) problem.specific_storage_per_cm = specific_storage;  // else the default
  problem.end_day = 2.0;
  problem.output_days = {0.5, 1.0, 1.5, 2.0};
  return problem;
}

void ponded_study() {
  fmt::print("ponded infiltration into dry loam, 2 days (time against cell size, median of 3)\n");
  double previous = 0;
  for (double cell : {1.0, 0.5, 0.25, 0.125, 0.0625}) {
    const auto t = timed(ponded_loam(cell, 0.0));
    print_row(fmt::format("{} cm", cell), t, previous, 2.0);
    if (t.run.complete)
      fmt::print("{:>14} infiltrated {:.4f} cm in 2 days\n", "", t.run.balances.back().infiltration_cm);
    previous = t.cpu_ms;
  }
}

void ponded_spread_study() {
  fmt::print("ponded infiltration into dry loam from initial heads -1000 cm +- 0, 0.01, 0.1 cm: medians of the five\n");
  fmt::print("{:>14} {:>10} {:>19} {:>8} {:>8} {:>8}\n", "cell size", "CPU ms", "(range)", "steps", "Newton", "factor");
  double previous = 0, first = 0;
  for (double cell : {1.0, 0.5, 0.25, 0.125, 0.0625}) {
    std::vector<double> ms, steps, newton;
    for (double h0 : {-1000.0, -999.99, -1000.01, -999.9, -1000.1}) {
      const auto t = timed(ponded_loam(cell, 0.0, h0));
      if (!t.run.complete) fmt::print("  INCOMPLETE from {} cm: {}\n", h0, t.run.failure ? t.run.failure->reason : "");
      ms.push_back(t.cpu_ms);
      steps.push_back(static_cast<double>(t.run.statistics.steps));
      newton.push_back(static_cast<double>(t.run.statistics.nonlinear_iterations));
    }
    auto median = [](std::vector<double> v) {
      std::ranges::sort(v);
      return v[v.size() / 2];
    };
    const double m = median(ms);
    fmt::print("{:>14} {:10.1f} {:>19} {:8.0f} {:8.0f}", fmt::format("{} cm", cell), m,
               fmt::format("({:.1f} to {:.1f})", *std::ranges::min_element(ms), *std::ranges::max_element(ms)),
               median(steps), median(newton));
    if (previous > 0) fmt::print(" {:>8}", fmt::format("x{:.2f}", m / previous));
    fmt::print("\n");
    previous = m;
    if (first == 0) first = m;
  }
  fmt::print("{:>14} exponent {:.3f} from 1 to 0.0625 cm\n", "", std::log(previous / first) / std::log(16.0));
}

void storage_study() {
  fmt::print("ponded loam on 0.25 cm cells, specific storage from 1e-6 to 1e-3 /cm\n");
  for (double ss : {1e-6, 1e-5, 1e-4, 1e-3}) {
    const auto t = timed(ponded_loam(0.25, ss));
    print_row(fmt::format("Ss {:.0e}", ss), t, 0, 2.0);
    if (t.run.complete)
      fmt::print("{:>14} infiltrated {:.4f} cm in 2 days\n", "", t.run.balances.back().infiltration_cm);
  }
}

}  // namespace

int main(int argc, char** argv) {
  std::set<std::string> parts(argv + 1, argv + argc);
  if (parts.empty()) parts = {"cells", "ponded", "storage"};
  if (parts.count("cells")) cells_study();
  if (parts.count("cell-errors")) cell_error_study();
  if (parts.count("ponded")) ponded_study();
  if (parts.count("ponded-spread")) ponded_spread_study();
  if (parts.count("storage")) storage_study();
  return 0;
}
