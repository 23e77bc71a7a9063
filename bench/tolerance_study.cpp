// The time-stepping error of the year200 daily heads against the work it costs: runs the column
// with a range of solver settings and prints, for each, CPU time, steps, Newton iterations and
// the RMS difference of the daily heads from a tight-tolerance run on the same grid.
// Usage: tolerance_study [relative_tolerance storage_tolerance_cm convergence_factor ...]
#include <ctime>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "year200_column.hpp"

namespace {

double cpu_ms(const std::clock_t start) { return 1000.0 * static_cast<double>(std::clock() - start) / CLOCKS_PER_SEC; }

}  // namespace

int main(int argc, char** argv) {
  using namespace wetfront;
  auto problem = bench::year200_column(WETFRONT_BENCH_DIR "/surface_flux.csv");
  struct Case {
    double relative, storage_cm, factor;
  };
  std::vector<Case> cases;
  for (int i = 1; i + 2 < argc; i += 3) cases.push_back({std::stod(argv[i]), std::stod(argv[i + 1]), std::stod(argv[i + 2])});
  if (cases.empty())
    cases = {{1e-4, 1e-6, 0.01}, {1e-4, 1e-6, 0.1}, {3e-4, 1e-6, 0.1}, {1e-3, 1e-6, 0.1}, {1e-3, 1e-5, 0.1},
             {1e-3, 1e-4, 0.1}, {3e-3, 1e-5, 0.1}};

  problem.settings = bench::tight_settings();
  auto start = std::clock();
  const auto tight = solver::simulate(problem);
  if (!tight.complete) return fmt::print("tight run failed: {}\n", tight.failure->reason), 2;
  fmt::print("tight reference: {:.0f} ms CPU, {} steps\n", cpu_ms(start), tight.statistics.steps);
  const auto reference = bench::daily_heads(tight);

  fmt::print("{:>9} {:>9} {:>6} {:>9} {:>7} {:>7} {:>6} {:>11} {:>10}\n", "rel_tol", "stor_tol", "conv", "CPU_ms",
             "steps", "newton", "jac", "rms_cm", "balance_cm");
  for (const auto& c : cases) {
    problem.settings = {};
    problem.settings.relative_tolerance = c.relative;
    problem.settings.absolute_tolerance_storage_cm = c.storage_cm;
    problem.settings.nonlinear_convergence_factor = c.factor;
    start = std::clock();
    const auto run = solver::simulate(problem);
    const double ms = cpu_ms(start);
    if (!run.complete) {
      fmt::print("{:9.1e} {:9.1e} {:6.2f} failed: {}\n", c.relative, c.storage_cm, c.factor, run.failure->reason);
      continue;
    }
    const auto& s = run.statistics;
    fmt::print("{:9.1e} {:9.1e} {:6.2f} {:9.1f} {:7} {:7} {:6} {:11.4e} {:10.2e}\n", c.relative, c.storage_cm, c.factor, ms, s.steps,
               s.nonlinear_iterations, s.jacobian_evaluations, bench::rms_difference(bench::daily_heads(run), reference),
               run.balances.back().balance_error_cm);
  }
  return 0;
}
