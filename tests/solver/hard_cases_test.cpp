// Hard but physically ordinary problems must run to the end: a sharp wetting front in dry
// sand, a fine clay (n close to 1) dried at its surface to the wilting-point head, and rain
// heavier than Ks on loam, where the surface ponds and later stops ponding. Each run's water
// balance must also close.
#include <fmt/format.h>
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <string>
#include <utility>
#include <vector>

#include "solver_test_soils.hpp"
#include "steady_flux_profile.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

void expect_complete_and_balanced(const solver::ColumnRun& run) {
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  ASSERT_FALSE(run.balances.empty());
  const auto& last = run.balances.back();
  const double turnover =
      last.water_input_cm + last.actual_evaporation_cm + std::abs(last.infiltration_cm) + std::abs(last.bottom_flux_cm);
  SCOPED_TRACE(
      fmt::format("{} steps, {} nonlinear failures, {} error-test failures, {} surface switches, "
                  "balance error {:.2e} cm",
                  run.statistics.steps, run.statistics.nonlinear_failures, run.statistics.error_test_failures,
                  run.statistics.surface_switches, last.balance_error_cm));
  EXPECT_LT(std::abs(last.balance_error_cm), 1e-5 * turnover + 1e-12);
}

// Runs the problem to end_day with outputs at those days and checks completion and balance.
solver::ColumnRun run_checked(solver::ColumnProblem problem, double end_day, std::vector<double> output_days) {
  problem.end_day = end_day;
  problem.output_days = std::move(output_days);
  solver::ColumnRun run = solver::simulate(problem);
  expect_complete_and_balanced(run);
  return run;
}

TEST(HardCases, HeavyRainOnDrySand) {
  // 10 cm/d on sand at -1000 cm: the front is a few millimetres wide.
  solver::ColumnProblem problem = graded_column(sand(), {100.0, {}, 0.2, 1.1, 1.0});
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(10.0)};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{-1000.0};
  const solver::ColumnRun run = run_checked(problem, 2.0, {0.25, 0.5, 1.0, 2.0});
  if (!run.complete) return;
  // All 20 cm entered the soil (prescribed flux, well below Ks).
  EXPECT_NEAR(run.balances.back().infiltration_cm, 20.0, 1e-6);
}

TEST(HardCases, PondedLoamAtEverySpecificStorage) {
  // Loam at -1000 cm under a surface held at 0 cm for 2 days, on 0.5 cm cells: behind the front
  // the soil saturates, where a small specific storage makes heads very sensitive to storage.
  // Every usual value must run, with every face mean. Ss barely changes what infiltrates (0.2 %),
  // except under the harmonic mean, whose front the dry side's conductivity holds back (about
  // 4 cm in where the others take 51 cm) and moves with anything that changes the wet side.
  const soils::VanGenuchtenMualem loam{0.078, 0.43, 0.036, 1.56, 24.96, 0.5};  // Carsel & Parrish 1988, loam
  for (const auto face : kFaceConductivities) {
    double first_infiltration = 0;
    for (double specific_storage : {1e-6, 1e-5, 1e-4, 1e-3}) {
      SCOPED_TRACE(fmt::format("{} mean, Ss {} /cm", face_name(face), specific_storage));
      solver::ColumnProblem problem{.soil = single_layer(100.0, loam), .grid = solver::uniform_grid(100.0, 200)};
      problem.top = solver::PrescribedHead{solver::StepSeries::constant(0.0)};
      problem.bottom = solver::FreeDrainage{};
      problem.initial = solver::UniformHead{-1000.0};
      problem.specific_storage_per_cm = specific_storage;
      problem.face_conductivity = face;
      const solver::ColumnRun run = run_checked(problem, 2.0, {0.5, 1.0, 2.0});
      if (!run.complete || face == solver::FaceConductivity::harmonic) continue;
      const double infiltration = run.balances.back().infiltration_cm;
      if (first_infiltration == 0) first_infiltration = infiltration;
      EXPECT_NEAR(infiltration, first_infiltration, 2e-3 * first_infiltration);
    }
  }
}

TEST(HardCases, FineClayDriedAtTheSurface) {
  // Clay with n = 1.09 under a surface head of -15000 cm for 30 days, water table 100 cm down.
  solver::ColumnProblem problem = graded_column(clay(), {100.0, {}, 0.1, 1.1, 2.0});
  problem.top = solver::PrescribedHead{solver::StepSeries::constant(-15000.0)};
  problem.bottom = solver::FixedHead{0.0};
  problem.initial = solver::Hydrostatic{100.0};
  const solver::ColumnRun run = run_checked(problem, 30.0, {1.0, 10.0, 30.0});
  if (!run.complete) return;
  // The soil loses water at the surface (upward, negative) and the top cell dries.
  EXPECT_LT(run.balances.back().infiltration_cm, 0.0);
  EXPECT_LT(run.profiles.back().head_cm.front(), -1000.0);
}

TEST(HardCases, RainAboveKsOnLoamPondsAndRecovers) {
  // 60 cm/d for half a day on loam (Ks about 25 cm/d) at -300 cm, then evaporation at
  // 0.5 cm/d: flux-limited surface -> ponded (excess runs off) -> flux-limited again.
  solver::ColumnProblem problem = graded_column(loam(), {100.0, {}, 0.5, 1.1, 2.0});
  const solver::StepSeries rain{{0.0, 0.5}, {60.0, 0.0}};
  const solver::StepSeries evaporation{{0.0, 0.5}, {0.0, 0.5}};
  problem.top = solver::LimitedFlux{rain, evaporation, -15000.0, 0.0};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{-300.0};
  const solver::ColumnRun run = run_checked(problem, 5.0, {0.25, 0.5, 1.0, 5.0});
  if (!run.complete) return;
  // Expected: flux -> ponded (runoff) early on, back to flux when the rain stops at 0.5 d,
  // and to the dry limit late in the run if the surface dries to -15000 cm: 2 or 3 switches;
  // one spare allows for the dry limit being left and reached once more.
  EXPECT_GE(run.statistics.surface_switches, 2);
  EXPECT_LE(run.statistics.surface_switches, 4);
  const auto& last = run.balances.back();
  EXPECT_GT(last.runoff_cm, 0.0);
  EXPECT_NEAR(last.water_input_cm, 30.0, 1e-9);
  EXPECT_LT(last.infiltration_cm, 30.0);
}

// 4 cm/d (Ks = 4.8 cm/d) into 20 cm of clay on a water table: every cell sits within a few
// centimetres of saturation, where the Mualem K of a soil with n = 1.09 changes fastest. The
// run must reach the steady profile dz/dh = 1 / (q/K - 1) (Darcy; tests/reference).
void expect_wet_clay_reaches_steady_profile(const soils::HydraulicModel& model) {
  const double flux = 4.0;
  solver::ColumnProblem problem = make_column(single_layer(20.0, model), solver::uniform_grid(20.0, 40));
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(flux)};
  problem.bottom = solver::FixedHead{0.0};
  problem.initial = solver::Hydrostatic{20.0};
  const solver::ColumnRun run = run_checked(problem, 10.0, {1.0, 10.0});
  if (!run.complete) return;
  const auto& profile = run.profiles.back();
  for (const double f : profile.face_flux_cm_per_d) EXPECT_NEAR(f, flux, 1e-4);
  const reference::SteadyFluxProfile exact(model, flux);
  for (std::size_t i = 0; i < run.cell_depths_cm.size(); ++i)
    EXPECT_NEAR(profile.head_cm[i], exact.pressure_head_cm(20.0 - run.cell_depths_cm[i]), 0.1)
        << "depth " << run.cell_depths_cm[i];
}

// The plain van Genuchten-Mualem clay (n = 1.09) is not run in this regime: its conductivity
// falls to half of Ks within about 1e-4 cm below saturation (dK/dh ~ |h|^(n-2)), so the steady
// profile asks for heads resolved to 1e-10 cm, which no finite tolerance gives. The air-entry
// form (Ippisch, Vogel & Bastian 2006) removes that singularity; DEVELOPERS.md states the limit.

TEST(HardCases, FineClayWithAirEntryWettedNearSaturation) {
  expect_wet_clay_reaches_steady_profile(clay_with_air_entry());
}

// A wetting front after rain moving down 0.125 cm cells (1600 cells over 200 cm). A tolerance
// that let thin cells err as much as 1 cm cells (tried, bench/README.md) accepted a step that
// left one cell at the front at -3e5 cm between neighbours at -119 and -46 cm: a cell's
// storage error, diluted among 1600 in IDA's RMS norm, had emptied it. The heads are watched
// every 2e-5 d while the front of the third day's rain passes 10 to 30 cm.
TEST(HardCases, NoCellFarDrierThanBothNeighboursAtAFront) {
  const soils::VanGenuchtenMualem sandy_loam{0.065, 0.41, 0.075, 1.89, 106.1, 0.5};  // Carsel & Parrish 1988
  solver::ColumnProblem problem{
      .soil = soils::LayeredProfile({{"sandy loam", 0, 60, sandy_loam}, {"loam", 60, 200, loam()}}),
      .grid = solver::uniform_grid(200.0, 1600)};
  problem.face_conductivity = solver::FaceConductivity::arithmetic;
  // Invented forcing: a day of evaporation, then two days of rain (cm/d).
  const solver::StepSeries input{{0, 1, 2}, {0.0, 1.508, 3.499}}, evaporation{{0, 1, 2}, {0.164, 0.0, 0.0}};
  problem.top = solver::LimitedFlux{input, evaporation, -15000.0, 0.0};
  problem.bottom = solver::FixedHead{-50.0};
  problem.initial = solver::Hydrostatic{250.0};
  problem.end_day = 2.6;
  for (int k = 0; k <= 20000; ++k) problem.output_days.push_back(2.2 + 2e-5 * k);
  int outliers = 0;
  std::string first;
  const solver::OutputObserver watch = [&](const solver::ProfileSnapshot& p, const solver::CumulativeBalance&) {
    for (std::size_t i = 1; i + 1 < p.head_cm.size(); ++i) {
      const double h = p.head_cm[i], beside = std::max(std::abs(p.head_cm[i - 1]), std::abs(p.head_cm[i + 1]));
      if (h < -1000.0 && std::abs(h) > 10.0 * beside && outliers++ == 0)
        first = fmt::format("day {:.6f}, cell {}: {:.4g} cm between {:.4g} and {:.4g} cm", p.time_days, i, h,
                            p.head_cm[i - 1], p.head_cm[i + 1]);
    }
  };
  const solver::ColumnRun run = solver::simulate(problem, watch);
  expect_complete_and_balanced(run);
  EXPECT_EQ(outliers, 0) << first;
}

}  // namespace
}  // namespace wetfront::solver_tests
