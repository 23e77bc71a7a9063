// year200 (year200-column.md) on a chosen number of uniform cells, its heads read every
// INTERVAL days: counts the readings in which a cell is far drier than both neighbours (below
// -1000 cm and ten times drier than either), the mark of a step that emptied one cell at a
// wetting front (see ColumnModel::step_norm). Prints the first few, the count, the solver's work
// and the CPU time (with the readings: compare times with bench_year200 or scaling_study).
// Usage: front_outliers [CELLS=1600] [INTERVAL_DAYS=0.002]
#include <cmath>
#include <cstdlib>
#include <ctime>
#include <string>

#include <fmt/format.h>

#include "year200_column.hpp"

int main(int argc, char** argv) {
  using namespace wetfront;
  const long cells = argc > 1 ? std::atol(argv[1]) : 1600;
  const double interval = argc > 2 ? std::atof(argv[2]) : 0.002;
  if (cells < 3 || !(interval > 0)) {
    fmt::print(stderr, "usage: front_outliers [CELLS >= 3] [INTERVAL_DAYS > 0]\n");
    return 2;
  }
  auto problem = bench::year200_column(WETFRONT_BENCH_DIR "/surface_flux.csv");
  problem.grid = solver::uniform_grid(200.0, static_cast<std::size_t>(cells));
  problem.output_days.clear();
  for (long k = 0; static_cast<double>(k) * interval <= problem.end_day; ++k)
    problem.output_days.push_back(static_cast<double>(k) * interval);

  long outliers = 0;
  double driest = 0;
  const solver::OutputObserver watch = [&](const solver::ProfileSnapshot& p, const solver::CumulativeBalance&) {
    for (std::size_t i = 1; i + 1 < p.head_cm.size(); ++i) {
      const double h = p.head_cm[i], beside = std::max(std::abs(p.head_cm[i - 1]), std::abs(p.head_cm[i + 1]));
      if (h < -1000.0 && std::abs(h) > 10.0 * beside) {
        if (outliers++ < 5)
          fmt::print("day {:.4f}, cell {}: {:.4g} cm between {:.4g} and {:.4g} cm\n", p.time_days, i, h,
                     p.head_cm[i - 1], p.head_cm[i + 1]);
        driest = std::min(driest, h);
      }
    }
  };
  const std::clock_t start = std::clock();
  const auto run = solver::simulate(problem, watch);
  const double ms = 1000.0 * static_cast<double>(std::clock() - start) / CLOCKS_PER_SEC;
  const auto& s = run.statistics;
  fmt::print("{} cells, read every {} d: {} outlying readings (driest {:.3g} cm); {} steps, {} Newton, {} failed; "
             "{:.0f} ms{}\n",
             cells, interval, outliers, driest, s.steps, s.nonlinear_iterations, s.nonlinear_failures, ms,
             run.complete ? "" : "; INCOMPLETE");
  return run.complete && outliers == 0 ? 0 : 1;
}
