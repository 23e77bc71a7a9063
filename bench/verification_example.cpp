// Runs the year200 benchmark column once and prints its water balance, solver work and the
// daily heads at 10, 30, 60, 100 and 150 cm (the numbers bench/README.md records).
#include <chrono>
#include <cstdio>

#include <fmt/format.h>

#include "year200_column.hpp"

int main(int argc, char** argv) {
  const bool daily = argc > 1 && std::string(argv[1]) == "--daily-heads";
  const auto problem = wetfront::bench::year200_column(WETFRONT_BENCH_DIR "/surface_flux.csv");
  const auto start = std::chrono::steady_clock::now();
  const auto run = wetfront::solver::simulate(problem);
  const double ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count();
  if (!run.complete) {
    fmt::print("run incomplete: {}\n", run.failure ? run.failure->reason : "unknown");
    return 2;
  }
  const auto& b = run.balances.back();
  const auto& s = run.statistics;
  fmt::print("year200 column: 200 cm, 200 cells, sandy loam over loam, one year (fluxes positive downward)\n");
  fmt::print("  water input          {:9.3f} cm\n", b.water_input_cm);
  fmt::print("  potential evaporation{:9.3f} cm\n", b.potential_evaporation_cm);
  fmt::print("  actual evaporation   {:9.3f} cm\n", b.actual_evaporation_cm);
  fmt::print("  surface flux (net)   {:9.3f} cm\n", b.infiltration_cm);
  fmt::print("  bottom flux          {:9.3f} cm\n", b.bottom_flux_cm);
  fmt::print("  storage change       {:9.3f} cm\n", b.soil_storage_cm - run.balances.front().soil_storage_cm);
  fmt::print("  balance error        {:9.2e} cm ({:.2e} of throughflow)\n", b.balance_error_cm,
             b.balance_error_cm / (b.water_input_cm + b.actual_evaporation_cm + std::abs(b.bottom_flux_cm)));
  fmt::print("  steps {}  Newton iterations {}  Jacobians {}  residuals {}  switches {}\n", s.steps,
             s.nonlinear_iterations, s.jacobian_evaluations, s.residual_evaluations, s.surface_switches);
  fmt::print("  wall time {:.1f} ms (one run, including start-up)\n", ms);
  if (daily) {
    fmt::print("day,h10_cm,h30_cm,h60_cm,h100_cm,h150_cm\n");
    // Cells are 1 cm thick: the face at depth d is between cells d-1 and d; report the mean of the two.
    for (const auto& p : run.profiles) {
      auto at = [&p](int depth) { return 0.5 * (p.head_cm[depth - 1] + p.head_cm[depth]); };
      fmt::print("{:.0f},{:.3f},{:.3f},{:.3f},{:.3f},{:.3f}\n", p.time_days, at(10), at(30), at(60), at(100),
                 at(150));
    }
  }
  return 0;
}
