// Evaporation from a wet sand: the soil supplies the full potential rate until the surface
// dries to the dry limit head; from then on the surface is held at that head and the actual
// rate falls. The switch is an event located in time, so the surface changes mode a few times
// at most instead of chattering between the two conditions.
#include <gtest/gtest.h>

#include <cmath>

#include <fmt/format.h>

#include "surface_test_columns.hpp"

namespace wetfront::surface_tests {
namespace {

constexpr double potential_rate = 0.5;  // cm/d

solver::ColumnProblem drying_sand(double dry_limit_head_cm) {
  auto problem = graded_column(sand(), {50.0, {}, 0.25, 1.1, 1.0});
  problem.top = solver::LimitedFlux{solver::StepSeries::constant(0.0), solver::StepSeries::constant(potential_rate),
                                    dry_limit_head_cm, 0.0};
  problem.bottom = solver::ZeroFlux{};
  problem.initial = solver::Hydrostatic{10.0};  // water table 10 cm down, sand near saturation above it
  problem.end_day = 20.0;
  problem.output_days = every(0.01, 0.0, 20.0);
  problem.settings.relative_tolerance = 1e-6;
  problem.settings.absolute_tolerance_storage_cm = 1e-9;
  return problem;
}

// Checks the run and returns the first output time at which evaporation falls below potential.
double check_drying(double dry_limit_head_cm) {
  SCOPED_TRACE(fmt::format("dry limit {} cm", dry_limit_head_cm));
  const auto problem = drying_sand(dry_limit_head_cm);
  const auto run = solver::simulate(problem);
  EXPECT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  if (!run.complete) return -1.0;
  // The first output at which the surface no longer supplies the potential rate.
  double limited_from = -1.0;
  for (const auto& b : run.balances)
    if (b.actual_evaporation_cm < b.potential_evaporation_cm * (1 - 1e-9)) {
      limited_from = b.time_days;
      break;
    }
  EXPECT_GT(limited_from, 0.25) << "the wet sand should first evaporate at the potential rate";
  if (limited_from <= 0.0) return -1.0;
  double previous_rate = potential_rate;
  for (std::size_t k = 1; k < run.balances.size(); ++k) {
    const auto& b = run.balances[k];
    const double turnover = b.potential_evaporation_cm;
    EXPECT_NEAR(b.potential_evaporation_cm, potential_rate * b.time_days, 1e-9);
    EXPECT_NEAR(surface_balance_error(b), 0.0, 1e-6 * turnover) << "day " << b.time_days;
    EXPECT_NEAR(soil_balance_error(run, b), 0.0, 1e-6 * turnover) << "day " << b.time_days;
    const double rate = (b.actual_evaporation_cm - run.balances[k - 1].actual_evaporation_cm) / 0.01;
    if (b.time_days < limited_from) {
      EXPECT_NEAR(b.actual_evaporation_cm, b.potential_evaporation_cm, 1e-9) << "day " << b.time_days;
    } else {
      // Surface held at the dry limit: the rate falls (stage-two drying) and stays below potential.
      EXPECT_LT(rate, potential_rate) << "day " << b.time_days;
      EXPECT_LE(rate, previous_rate * (1 + 1e-3) + 1e-9) << "day " << b.time_days;
      // and the top cell keeps drying, never below the dry limit held at the surface.
      EXPECT_LE(run.profiles[k].head_cm.front(), run.profiles[k - 1].head_cm.front() + 1e-9) << "day " << b.time_days;
      EXPECT_GT(run.profiles[k].head_cm.front(), dry_limit_head_cm) << "day " << b.time_days;
    }
    previous_rate = rate;
  }
  const auto& last = run.balances.back();
  const double last_rate = (last.actual_evaporation_cm - run.balances[run.balances.size() - 101].actual_evaporation_cm);
  SCOPED_TRACE(fmt::format(
      "dry limit {:.0f} cm: potential rate until {:.2f} d; 20 d: potential {:.3f}, actual {:.4f} cm, last-day rate "
      "{:.4f} cm/d; {} surface switches, {} steps",
      dry_limit_head_cm, limited_from, last.potential_evaporation_cm, last.actual_evaporation_cm, last_rate,
      run.statistics.surface_switches, run.statistics.steps));
  EXPECT_LT(last_rate, 0.2 * potential_rate);
  // One switch to the dry limit; allow one more pair for a brief return, no chattering.
  EXPECT_GE(run.statistics.surface_switches, 1);
  EXPECT_LE(run.statistics.surface_switches, 3);
  return limited_from;
}

TEST(EvaporationLimit, WetSandEvaporatesAtPotentialThenFallsOff) { check_drying(-15000.0); }

// A surface that cannot dry beyond -1000 cm reaches its limit sooner (or at the same output).
TEST(EvaporationLimit, AMilderDryLimitEndsStageOneSooner) {
  const double strict = check_drying(-15000.0);
  const double mild = check_drying(-1000.0);
  ASSERT_GT(strict, 0.0);
  ASSERT_GT(mild, 0.0);
  EXPECT_LE(mild, strict);
}

}  // namespace
}  // namespace wetfront::surface_tests
