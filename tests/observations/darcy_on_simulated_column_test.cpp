// The Darcy estimate from two simulated heads on a column held at a steady downward flux must
// return the imposed flux within 2 percent (the acceptance check; Darcy-Buckingham
// with the same K(h) as the model, so the only differences are the grid and the averaging).
#include <gtest/gtest.h>

#include "wetfront/observations/recharge_estimates.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::observations {
namespace {

TEST(DarcyOnSimulatedColumn, SteadyDownwardFluxIsRecovered) {
  // Carsel & Parrish (1988) loam class average (from memory): theta_r 0.078, theta_s 0.43,
  // alpha 0.036 /cm, n 1.56, Ks 24.96 cm/d; 2 cm/d imposed at the surface, free drainage.
  const soils::HydraulicModel loam = soils::VanGenuchtenMualem{0.078, 0.43, 0.036, 1.56, 24.96, 0.5};
  const double flux = 2.0;
  solver::ColumnProblem problem{.soil = soils::LayeredProfile({{"loam", 0.0, 200.0, loam}}),
                                .grid = solver::uniform_grid(200.0, 200)};
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(flux)};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{-100.0};
  problem.end_day = 200.0;
  problem.output_days = {200.0};
  const auto run = solver::simulate(problem);
  ASSERT_TRUE(run.complete);
  // Cups at 90.5 and 120.5 cm (cell centres 90 and 120).
  const auto& heads = run.profiles.back().head_cm;
  const double estimate = darcy_flux_cm_per_d(loam, 90.5, heads[90], 120.5, heads[120]);
  EXPECT_NEAR(estimate, flux, 0.02 * flux) << "heads " << heads[90] << " and " << heads[120] << " cm";
}

}  // namespace
}  // namespace wetfront::observations
