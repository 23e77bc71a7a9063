// Rain at three times the saturated conductivity onto a moist loam. The surface takes all of it
// until the soil at the surface saturates; from then on the soil takes what it can, the rest is
// stored on the surface (up to the maximum ponded depth) and runs off. Checked: the surface
// and soil balances close at every output, the ponding time and the cumulative infiltration
// after ponding agree with a run on a 4x finer grid at tighter tolerances.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "surface_test_columns.hpp"

namespace wetfront::surface_tests {
namespace {

constexpr double rain_end_day = 0.2;
constexpr double run_end_day = 0.3;

double rain_rate() { return 3.0 * loam().saturated_conductivity_cm_per_d; }

// The test grid has 0.25 cm surface cells growing by 5 percent to at most 1 cm; the reference
// divides every cell length by 4 (refinement 4) and solves at tighter tolerances.
solver::ColumnProblem rain_on_moist_loam(double max_ponded_depth_cm, double refinement) {
  auto problem =
      graded_column(loam(), {100.0, {}, 0.25 / refinement, std::pow(1.05, 1.0 / refinement), 1.0 / refinement});
  problem.top = solver::LimitedFlux{{{0.0, rain_end_day}, {rain_rate(), 0.0}},
                                    solver::StepSeries::constant(0.0), -15000.0, max_ponded_depth_cm};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{-150.0};
  problem.end_day = run_end_day;
  problem.output_days = every(0.0025, 0.0, run_end_day);
  problem.settings.relative_tolerance = refinement > 1 ? 1e-6 : 1e-5;
  problem.settings.absolute_tolerance_storage_cm = refinement > 1 ? 1e-9 : 1e-8;
  problem.settings.max_step_days = 0.01;
  return problem;
}

// First output time at which the soil no longer takes all of the rain.
double first_output_after_ponding(const solver::ColumnRun& run) {
  for (const auto& b : run.balances)
    if (b.water_input_cm - b.infiltration_cm > 1e-9 * (1.0 + b.water_input_cm)) return b.time_days;
  return -1.0;
}

void check_ponded_run(double max_ponded_depth_cm) {
  SCOPED_TRACE(fmt::format("maximum ponded depth {} cm", max_ponded_depth_cm));
  const auto problem = rain_on_moist_loam(max_ponded_depth_cm, 1.0);
  const auto run = solver::simulate(problem);
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  const auto fine_problem = rain_on_moist_loam(max_ponded_depth_cm, 4.0);
  const auto fine = solver::simulate(fine_problem);
  ASSERT_TRUE(fine.complete) << (fine.failure ? fine.failure->reason : "");
  ASSERT_EQ(run.balances.size(), fine.balances.size());

  const double ponding = first_output_after_ponding(run);
  const double fine_ponding = first_output_after_ponding(fine);
  ASSERT_GT(ponding, 0.0) << "the surface never ponded";
  // Ponding times agree to one output interval (0.0025 d).
  EXPECT_NEAR(ponding, fine_ponding, 0.0025 + 1e-12);

  for (std::size_t k = 0; k < run.balances.size(); ++k) {
    const auto& b = run.balances[k];
    const double turnover = b.water_input_cm + std::abs(b.bottom_flux_cm);
    // Surface: water input - actual evaporation - runoff - infiltration - ponded depth = 0.
    EXPECT_NEAR(surface_balance_error(b), 0.0, 1e-6 * turnover) << "day " << b.time_days;
    // Soil: storage change = infiltration - transpiration - bottom flux.
    EXPECT_NEAR(soil_balance_error(run, b), 0.0, 1e-6 * turnover) << "day " << b.time_days;
    EXPECT_LE(b.ponded_depth_cm, max_ponded_depth_cm + 1e-9);
    EXPECT_GE(b.runoff_cm, 0.0);
    if (b.time_days < ponding - 1e-12) {
      // Before ponding the soil takes all of the rain; nothing is stored or runs off.
      EXPECT_NEAR(b.infiltration_cm, rain_rate() * b.time_days, 1e-9 * (1.0 + turnover)) << "day " << b.time_days;
      EXPECT_EQ(b.runoff_cm, 0.0);
      EXPECT_LT(run.profiles[k].head_cm.front(), 0.0);
    } else if (b.time_days <= rain_end_day) {
      // During ponded rain the surface cell is held near saturation (its centre lies 0.125 cm deep).
      EXPECT_GT(run.profiles[k].head_cm.front(), -3.0) << "day " << b.time_days;
      EXPECT_LT(run.profiles[k].face_flux_cm_per_d.front(), rain_rate()) << "day " << b.time_days;
    }
    // Cumulative infiltration against the fine grid, within 1 percent.
    if (b.time_days >= ponding) {
      const auto& f = fine.balances[k];
      EXPECT_NEAR(b.infiltration_cm, f.infiltration_cm, 0.01 * f.infiltration_cm) << "day " << b.time_days;
    }
  }
  const auto& last = run.balances.back();
  const auto& fine_last = fine.balances.back();
  SCOPED_TRACE(fmt::format(
      "max pond {:.2f} cm: ponding at {:.4f} d (fine {:.4f} d); rain {:.4f}, infiltration {:.4f} (fine {:.4f}), runoff "
      "{:.4f} (fine {:.4f}), pond {:.2e} cm; {} surface switches; soil balance {:.2e} cm",
      max_ponded_depth_cm, ponding, fine_ponding, last.water_input_cm, last.infiltration_cm, fine_last.infiltration_cm,
      last.runoff_cm, fine_last.runoff_cm, last.ponded_depth_cm, run.statistics.surface_switches,
      soil_balance_error(run, last)));
  EXPECT_GT(last.runoff_cm, 0.1 * last.water_input_cm);
  EXPECT_NEAR(last.runoff_cm, fine_last.runoff_cm, 0.01 * fine_last.runoff_cm);
  // After the rain the pond, if any, soaks in.
  EXPECT_NEAR(last.ponded_depth_cm, 0.0, 1e-9);
  EXPECT_LE(run.statistics.surface_switches, 4);
}

TEST(Ponding, RainAboveConductivityRunsOffWithoutSurfaceStorage) { check_ponded_run(0.0); }

TEST(Ponding, RainAboveConductivityFillsTheSurfaceStoreThenRunsOff) { check_ponded_run(0.5); }

// Surface storage keeps water that would run off and lets it soak in later.
TEST(Ponding, SurfaceStorageReducesRunoff) {
  const auto without = solver::simulate(rain_on_moist_loam(0.0, 1.0));
  const auto with = solver::simulate(rain_on_moist_loam(0.5, 1.0));
  ASSERT_TRUE(without.complete && with.complete);
  const auto& a = without.balances.back();
  const auto& b = with.balances.back();
  EXPECT_LT(b.runoff_cm, a.runoff_cm - 0.4);
  EXPECT_GT(b.infiltration_cm, a.infiltration_cm + 0.4);
  double deepest_pond = 0.0;
  for (const auto& x : with.balances) deepest_pond = std::max(deepest_pond, x.ponded_depth_cm);
  EXPECT_NEAR(deepest_pond, 0.5, 1e-9);
}

}  // namespace
}  // namespace wetfront::surface_tests
