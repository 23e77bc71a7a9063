// Transient infiltration toward a water table in a homogeneous Gardner soil, checked against
// the analytical solution of Srivastava & Yeh (1991, WRR 27(5):753-762): the surface flux
// steps from qA to qB at t = 0 on a column at the steady qA profile. The cell-centred scheme
// should converge at second order in space on uniform grids.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <fmt/format.h>

#include "gardner_water_table_infiltration.hpp"
#include "solver_test_soils.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

using reference::GardnerWaterTableInfiltration;
using reference::GardnerWaterTableProblem;

// a = 0.1 /cm, Ks = 1 cm/d, theta_s = 0.40, theta_r = 0.06, L = 100 cm, qA = 0.1, qB = 0.9 cm/d.
GardnerWaterTableProblem water_table_problem() { return {}; }

constexpr double kOutputDays[] = {1.0, 3.0, 6.0, 12.0};  // t* = 0.29, 0.88, 1.76, 3.53

solver::ColumnProblem gardner_column(std::size_t cells, solver::FaceConductivity face, double relative_tolerance) {
  const GardnerWaterTableProblem p = water_table_problem();
  const GardnerWaterTableInfiltration exact(p, kOutputDays[0]);
  solver::HeadTable initial;
  for (int i = 0; i <= 4000; ++i) {  // 0.025 cm spacing: interpolation error < 1e-5 cm
    const double depth = p.column_height_cm * i / 4000.0;
    initial.depth_cm.push_back(depth);
    initial.head_cm.push_back(exact.initial_pressure_head_cm(depth));
  }
  const soils::GardnerExponential soil{p.residual_water_content, p.saturated_water_content, p.sorptive_number_per_cm,
                                       p.saturated_conductivity_cm_per_d};
  solver::ColumnProblem problem = make_column(single_layer(p.column_height_cm, soil), solver::uniform_grid(p.column_height_cm, cells));
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(p.new_surface_flux_cm_per_d)};
  problem.bottom = solver::FixedHead{0.0};
  problem.initial = initial;
  problem.specific_storage_per_cm = 1e-8;
  problem.face_conductivity = face;
  problem.end_day = kOutputDays[std::size(kOutputDays) - 1];
  problem.output_days.assign(std::begin(kOutputDays), std::end(kOutputDays));
  problem.settings.relative_tolerance = relative_tolerance;
  problem.settings.absolute_tolerance_storage_cm = 1e-12;
  problem.settings.max_step_days = 0.1;
  return problem;
}

// Largest |h_numerical - h_exact| over every cell centre and output time, cm.
double max_head_error(const solver::ColumnRun& run) {
  const GardnerWaterTableInfiltration exact(water_table_problem(), kOutputDays[0]);
  double worst = 0.0;
  for (const auto& profile : run.profiles) {
    for (std::size_t i = 0; i < run.cell_depths_cm.size(); ++i) {
      const double reference = exact.pressure_head_cm(run.cell_depths_cm[i], profile.time_days);
      worst = std::max(worst, std::abs(profile.head_cm[i] - reference));
    }
  }
  return worst;
}

double run_error(std::size_t cells, solver::FaceConductivity face, double relative_tolerance) {
  const solver::ColumnRun run = solver::simulate(gardner_column(cells, face, relative_tolerance));
  EXPECT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  EXPECT_EQ(run.profiles.size(), std::size(kOutputDays));
  return max_head_error(run);
}

TEST(GardnerInfiltrationToWaterTable, HeadsConvergeAtSecondOrderInSpace) {
  // Srivastava & Yeh (1991) analytical heads; uniform grids of 25, 50, 100, 200 cells.
  const std::size_t cells[] = {25, 50, 100, 200};
  double errors[4];
  for (int k = 0; k < 4; ++k) {
    errors[k] = run_error(cells[k], solver::FaceConductivity::arithmetic, 1e-9);
    RecordProperty(fmt::format("max_head_error_cm_{}_cells", cells[k]), fmt::format("{:.3e}", errors[k]));
  }
  for (int k = 1; k < 4; ++k) {
    const double order = std::log2(errors[k - 1] / errors[k]);
    RecordProperty(fmt::format("observed_order_{}_to_{}", cells[k - 1], cells[k]), fmt::format("{:.3f}", order));
    SCOPED_TRACE(fmt::format("{} -> {} cells: max error {:.3e} -> {:.3e} cm, observed order {:.3f}", cells[k - 1],
                             cells[k], errors[k - 1], errors[k], order));
    if (k >= 2) {
      EXPECT_GE(order, 1.8) << cells[k - 1] << " -> " << cells[k] << " cells";
    }
  }
  EXPECT_LT(errors[3], 0.05);  // 0.5 cm cells: the head is right to well under a millimetre
}

TEST(GardnerInfiltrationToWaterTable, DefaultTolerancesStayCloseToTheExactSolution) {
  // Same problem at the default tolerances on 100 cells: time error does not swamp the answer.
  solver::ColumnProblem problem = gardner_column(100, solver::FaceConductivity::arithmetic, 1e-6);
  problem.settings = solver::SolverSettings{};
  const solver::ColumnRun run = solver::simulate(problem);
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  const double error = max_head_error(run);
  SCOPED_TRACE(
      fmt::format("default tolerances, 100 cells: max head error {:.3e} cm, {} steps", error, run.statistics.steps));
  EXPECT_LT(error, 0.1);
  // The flux at the surface is the prescribed qB = 0.9 cm/d.
  for (const auto& profile : run.profiles) EXPECT_NEAR(profile.face_flux_cm_per_d.front(), 0.9, 1e-9);
}

TEST(GardnerInfiltrationToWaterTable, FluxChangeAtABreakpointMidRun) {
  // The flux stays at qA for 5 days (the steady qA profile must hold still), then steps to
  // qB: afterwards the Srivastava & Yeh (1991) solution applies with t counted from day 5.
  const GardnerWaterTableProblem p = water_table_problem();
  solver::ColumnProblem problem = gardner_column(100, solver::FaceConductivity::arithmetic, 1e-9);
  problem.top = solver::PrescribedFlux{solver::StepSeries{{0.0, 5.0},
                                                          {p.initial_surface_flux_cm_per_d, p.new_surface_flux_cm_per_d}}};
  problem.end_day = 17.0;
  problem.output_days = {2.0, 5.0, 6.0, 8.0, 11.0, 17.0};
  const solver::ColumnRun run = solver::simulate(problem);
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  ASSERT_EQ(run.profiles.size(), 6u);
  const GardnerWaterTableInfiltration exact(p, 1.0);
  double worst = 0.0;
  for (const auto& profile : run.profiles) {
    for (std::size_t i = 0; i < run.cell_depths_cm.size(); ++i) {
      const double depth = run.cell_depths_cm[i];
      const double reference = profile.time_days <= 5.0 ? exact.initial_pressure_head_cm(depth)
                                                         : exact.pressure_head_cm(depth, profile.time_days - 5.0);
      worst = std::max(worst, std::abs(profile.head_cm[i] - reference));
    }
  }
  SCOPED_TRACE(fmt::format("flux step at day 5, 100 cells: max head error {:.3e} cm", worst));
  EXPECT_LT(worst, 0.05);  // the same size as the error of the run that starts with the step
  // Surface flux as prescribed on either side of the step (at day 5 itself either value is
  // defensible: the output closes the qA period and the series gives qB from day 5 on).
  EXPECT_NEAR(run.profiles[0].face_flux_cm_per_d.front(), p.initial_surface_flux_cm_per_d, 1e-12);
  EXPECT_NEAR(run.profiles[2].face_flux_cm_per_d.front(), p.new_surface_flux_cm_per_d, 1e-12);
}

TEST(GardnerInfiltrationToWaterTable, FaceConductivityChoicesOnACoarseGrid) {
  // The three face means on 20 and 40 cells (5 and 2.5 cm): all converge on this smooth
  // problem; the errors are recorded to inform the default.
  for (const auto face : kFaceConductivities) {
    const double coarse = run_error(20, face, 1e-8);
    const double finer = run_error(40, face, 1e-8);
    const char* name = face_name(face);
    SCOPED_TRACE(fmt::format("{} mean: max head error {:.3e} cm (20 cells), {:.3e} cm (40 cells), order {:.2f}", name,
                             coarse, finer, std::log2(coarse / finer)));
    RecordProperty(fmt::format("{}_error_cm_20_cells", name), fmt::format("{:.3e}", coarse));
    RecordProperty(fmt::format("{}_error_cm_40_cells", name), fmt::format("{:.3e}", finer));
    EXPECT_LT(finer, coarse) << name;
    EXPECT_LT(coarse, 5.0) << name;
  }
}

}  // namespace
}  // namespace wetfront::solver_tests
