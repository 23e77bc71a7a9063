// Long runs with a constant surface flux above a water table reach the steady profile
// dz/dh = 1 / (q / K(h) - 1) (Darcy's law with z up from the table, q positive down), here
// integrated to about 1e-9 cm by adaptive quadrature (tests/reference/steady_flux_profile).
#include <fmt/format.h>
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>

#include "solver_test_soils.hpp"
#include "steady_flux_profile.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

struct SteadyCase {
  double flux_cm_per_d;  // positive down
  double column_cm;
  double run_days;
};

void expect_steady_profile(const SteadyCase& c) {
  solver::ColumnProblem problem = make_column(single_layer(c.column_cm, loam()), solver::uniform_grid(c.column_cm,
                                                static_cast<std::size_t>(c.column_cm / 0.5)));
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(c.flux_cm_per_d)};
  problem.bottom = solver::FixedHead{0.0};
  problem.initial = solver::Hydrostatic{c.column_cm};
  problem.end_day = c.run_days;
  problem.output_days = {c.run_days};
  const solver::ColumnRun run = solver::simulate(problem);
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  ASSERT_EQ(run.profiles.size(), 1u);
  const auto& profile = run.profiles.back();

  // Steady: every face carries q.
  for (const double face_flux : profile.face_flux_cm_per_d)
    EXPECT_NEAR(face_flux, c.flux_cm_per_d, 1e-6 * (1.0 + std::abs(c.flux_cm_per_d)));

  const reference::SteadyFluxProfile exact(loam(), c.flux_cm_per_d);
  double worst = 0.0;
  for (std::size_t i = 0; i < run.cell_depths_cm.size(); ++i) {
    const double reference_head = exact.pressure_head_cm(c.column_cm - run.cell_depths_cm[i]);
    worst = std::max(worst, std::abs(profile.head_cm[i] - reference_head));
    EXPECT_NEAR(profile.head_cm[i], reference_head, 0.1) << "depth " << run.cell_depths_cm[i] << " cm";
  }
  testing::Test::RecordProperty(fmt::format("max_head_error_cm_q_{}", c.flux_cm_per_d), fmt::format("{:.3e}", worst));
}

TEST(SteadyFluxAboveWaterTable, InfiltrationIntoLoamReachesTheExactProfile) {
  // q = 0.5 cm/d (K/Ks = 0.02 far above the table) through 100 cm of loam.
  expect_steady_profile({0.5, 100.0, 600.0});
}

TEST(SteadyFluxAboveWaterTable, HeavyInfiltrationIntoLoamReachesTheExactProfile) {
  expect_steady_profile({5.0, 100.0, 300.0});
}

TEST(SteadyFluxAboveWaterTable, EvaporationFromLoamReachesTheExactProfile) {
  // q = -0.1 cm/d: the loam can lift this from a table at most about 82 cm below the surface
  // (the integral of dh / (1 + |q|/K) over all h < 0), so the column is 60 cm deep.
  expect_steady_profile({-0.1, 60.0, 1000.0});
}

}  // namespace
}  // namespace wetfront::solver_tests
