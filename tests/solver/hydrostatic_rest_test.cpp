// A layered column in hydrostatic equilibrium (h = d - water table depth, so the total head
// is uniform) under a zero-flux surface and a consistent fixed head at the bottom must stay
// at rest: the discrete Darcy flux -K (dh/dd - 1) vanishes on every face whatever face mean
// is used (Darcy's law; common practice as a solver check).
#include <gtest/gtest.h>

#include <cmath>

#include "solver_test_soils.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

void expect_rest(double water_table_depth_cm, solver::FaceConductivity face) {
  solver::GridRequest request;
  request.depth_cm = 150.0;
  request.required_face_depths_cm = {30.0, 70.0};
  solver::ColumnProblem problem = make_column(sand_loam_clay(), solver::graded_grid(request));
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(0.0)};
  problem.bottom = solver::FixedHead{150.0 - water_table_depth_cm};
  problem.initial = solver::Hydrostatic{water_table_depth_cm};
  problem.face_conductivity = face;
  problem.end_day = 365.0;
  problem.output_days = {1.0, 30.0, 365.0};
  const solver::ColumnRun run = solver::simulate(problem);
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  ASSERT_EQ(run.profiles.size(), 3u);
  for (const auto& profile : run.profiles) {
    for (std::size_t f = 0; f < profile.face_flux_cm_per_d.size(); ++f)
      EXPECT_LT(std::abs(profile.face_flux_cm_per_d[f]), 1e-10) << "face " << f << " at day " << profile.time_days;
    for (std::size_t i = 0; i < run.cell_depths_cm.size(); ++i)
      EXPECT_NEAR(profile.head_cm[i], run.cell_depths_cm[i] - water_table_depth_cm, 1e-8);
  }
  // The cumulative bottom flux is bounded by the face-flux bound times the run length.
  EXPECT_LT(std::abs(run.balances.back().bottom_flux_cm), 1e-10 * 365.0);
}

TEST(HydrostaticLayeredColumn, StaysAtRestWithTheTableAtTheBottom) {
  expect_rest(150.0, solver::FaceConductivity::arithmetic);
}

TEST(HydrostaticLayeredColumn, StaysAtRestWithTheTableInsideTheClay) {
  // Saturated cells below 100 cm (held well posed by the specific storage).
  expect_rest(100.0, solver::FaceConductivity::arithmetic);
  expect_rest(100.0, solver::FaceConductivity::harmonic);
}

}  // namespace
}  // namespace wetfront::solver_tests
