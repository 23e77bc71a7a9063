// A season-like run on a layered column with every water-balance term present: rain (with
// storms heavy enough to pond and run off), evaporation, root uptake under a growing crop,
// surface storage and drainage at the bottom. The stored water of each cell and the boundary
// amounts are integrated by the same BDF formula, so the balance closes to the accuracy of the
// nonlinear solve (common practice: a linear multistep method preserves linear invariants).
#include <fmt/format.h>
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <memory>

#include "surface_test_columns.hpp"
#include "wetfront/solver/root_uptake.hpp"

namespace wetfront::surface_tests {
namespace {

// Invented daily forcing for 90 days: a few heavy storms, light rain spells and dry spells.
solver::StepSeries season_rain() {
  std::vector<double> start, value;
  for (int day = 0; day < 90; ++day) {
    start.push_back(day);
    double rain = 0.0;
    if (day % 7 == 3) rain = 0.8;                              // light rain weekly
    if (day == 12 || day == 47) rain = 25.0;                   // storms (25 cm/d > Ks of silt loam)
    if (day >= 60 && day < 63) rain = 2.0;                     // a wet spell
    value.push_back(rain);
  }
  return {start, value};
}

// Potential evaporation falls as the canopy closes; potential transpiration rises.
solver::StepSeries season_evaporation() {
  return {{0.0, 20.0, 40.0, 60.0}, {0.35, 0.25, 0.12, 0.08}};
}
solver::StepSeries season_transpiration() {
  return {{0.0, 20.0, 40.0, 60.0}, {0.05, 0.2, 0.4, 0.45}};
}

solver::ColumnProblem season() {
  const soils::LayeredProfile soil({soils::SoilLayer{"silt loam topsoil", 0.0, 25.0, silt_loam()},
                                    soils::SoilLayer{"loam subsoil", 25.0, 80.0, loam()},
                                    soils::SoilLayer{"sand", 80.0, 150.0, sand()}});
  solver::GridRequest request{150.0, {25.0, 80.0, 100.0}, 0.5, 1.1, 2.0};
  auto problem = make_column(soil, solver::graded_grid(request));
  problem.top = solver::LimitedFlux{season_rain(), season_evaporation(), -15000.0, 0.5};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::Hydrostatic{200.0};
  problem.flux_plane_depths_cm = {100.0};
  solver::RootUptakeSettings roots;
  roots.response = solver::feddes_maize();
  roots.distribution = solver::LinearRoots{};
  roots.root_depth_cm = {{0.0, 20.0, 40.0, 60.0}, {10.0, 25.0, 45.0, 60.0}};
  roots.potential_transpiration_cm_per_d = season_transpiration();
  problem.sink = std::make_shared<solver::RootUptake>(roots, problem.grid);
  problem.end_day = 90.0;
  problem.output_days = every(1.0, 0.0, 90.0);
  return problem;  // solver settings at their defaults: what a user's season run gets
}

TEST(SeasonBalance, EveryTermPresentAndTheBalanceCloses) {
  const auto problem = season();
  const auto run = solver::simulate(problem);
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  double worst = 0.0, deepest_pond = 0.0;
  for (const auto& b : run.balances) {
    const double throughflow = b.water_input_cm + b.actual_evaporation_cm + b.runoff_cm + b.transpiration_cm +
                               std::abs(b.bottom_flux_cm);
    deepest_pond = std::max(deepest_pond, b.ponded_depth_cm);
    if (throughflow == 0.0) continue;
    worst = std::max(worst, std::abs(b.balance_error_cm) / throughflow);
    EXPECT_LT(std::abs(soil_balance_error(run, b)), 1e-6 * throughflow) << "day " << b.time_days;
    EXPECT_LT(std::abs(surface_balance_error(b)), 1e-6 * throughflow) << "day " << b.time_days;
    EXPECT_LT(std::abs(b.balance_error_cm), 1e-6 * throughflow) << "day " << b.time_days;
    EXPECT_LE(b.actual_evaporation_cm, b.potential_evaporation_cm + 1e-9);
    EXPECT_LE(b.transpiration_cm, season_transpiration().integral(0.0, b.time_days) + 1e-9);
    EXPECT_NEAR(b.water_input_cm, season_rain().integral(0.0, b.time_days), 1e-9 * (1.0 + b.water_input_cm));
  }
  const auto& last = run.balances.back();
  SCOPED_TRACE(
      fmt::format("90 days: rain {:.3f}, evaporation {:.3f} (potential {:.3f}), transpiration {:.3f} (potential "
                  "{:.3f}), runoff {:.3f}, "
                  "drainage {:.3f}, at 100 cm {:.3f}, deepest pond {:.3f} cm, storage change {:.3f} cm; worst |error| "
                  "/ throughflow "
                  "{:.2e}; {} steps, {} surface switches",
                  last.water_input_cm, last.actual_evaporation_cm, last.potential_evaporation_cm, last.transpiration_cm,
                  season_transpiration().integral(0.0, 90.0), last.runoff_cm, last.bottom_flux_cm,
                  last.plane_flux_cm[0], deepest_pond, last.soil_storage_cm - run.balances.front().soil_storage_cm,
                  worst, run.statistics.steps, run.statistics.surface_switches));
  // Every term is present.
  EXPECT_GT(last.water_input_cm, 10.0);
  EXPECT_GT(last.actual_evaporation_cm, 1.0);
  EXPECT_GT(last.transpiration_cm, 5.0);
  EXPECT_GT(last.runoff_cm, 0.1);
  EXPECT_GT(deepest_pond, 0.1);
  EXPECT_GT(std::abs(last.bottom_flux_cm), 0.01);
  EXPECT_LT(last.actual_evaporation_cm, last.potential_evaporation_cm);  // the surface dried at times
}

}  // namespace
}  // namespace wetfront::surface_tests
