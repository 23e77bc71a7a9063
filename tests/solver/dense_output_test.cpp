// Values at an output time between the integrator's steps come from IDA's interpolating
// polynomial (dense output). They must agree with an exact stop at the same time: the same
// run with a forcing breakpoint there (the same flux on both sides) stops and restarts at it.
// The comparison is an identity of the method (common practice for BDF dense output): both
// are the same solution to within the integration tolerance.
#include <fmt/format.h>
#include <gtest/gtest.h>

#include <cmath>

#include "solver_test_soils.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

solver::ColumnRun infiltration_run(const solver::StepSeries& flux) {
  solver::ColumnProblem problem = graded_column(loam(), {100.0, {}, 0.5, 1.1, 2.0});
  problem.top = solver::PrescribedFlux{flux};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{-200.0};
  problem.end_day = 2.0;
  problem.output_days = {0.37, 1.3};
  // The tolerances the limits below were set for (tighter than the defaults).
  problem.settings.relative_tolerance = 1e-4;
  problem.settings.absolute_tolerance_storage_cm = 1e-6;
  return solver::simulate(problem);
}

TEST(DenseOutput, AgreesWithAnExactStopAtTheSameTime) {
  const auto dense = infiltration_run(solver::StepSeries::constant(3.0));
  const auto stopped = infiltration_run(solver::StepSeries{{0.0, 0.37}, {3.0, 3.0}});
  ASSERT_TRUE(dense.complete && stopped.complete);
  ASSERT_EQ(dense.profiles.size(), 2u);
  const auto& a = dense.profiles.front();
  const auto& b = stopped.profiles.front();
  ASSERT_DOUBLE_EQ(a.time_days, 0.37);
  ASSERT_DOUBLE_EQ(b.time_days, 0.37);
  double largest = 0.0;
  for (std::size_t i = 0; i < a.head_cm.size(); ++i) {
    // Heads within 0.03 cm plus 0.1 % (the run's relative tolerance is 1e-4 per step; measured
    // 6e-3 cm at most); water contents within 1e-4.
    EXPECT_NEAR(a.head_cm[i], b.head_cm[i], 0.03 + 1e-3 * std::abs(b.head_cm[i])) << "cell " << i;
    EXPECT_NEAR(a.water_content[i], b.water_content[i], 1e-4) << "cell " << i;
    largest = std::max(largest, std::abs(a.head_cm[i] - b.head_cm[i]));
  }
  // Cumulative infiltration is exact in both: 3 cm/d for 0.37 d.
  EXPECT_NEAR(dense.balances.front().infiltration_cm, 1.11, 1e-9);
  EXPECT_NEAR(stopped.balances.front().infiltration_cm, 1.11, 1e-9);
  RecordProperty("largest_head_difference_cm", fmt::format("{:.3e}", largest));
}

}  // namespace
}  // namespace wetfront::solver_tests
