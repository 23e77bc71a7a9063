// A run whose profiles go to an observer (solver::simulate(problem, observe)) hands over each
// output time once, in order, keeps no profile itself, and computes what a run that keeps its
// profiles computes: the observer changes where the profiles go, not the integration.
#include <gtest/gtest.h>

#include <stdexcept>

#include "solver_test_soils.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

solver::ColumnProblem infiltration_problem() {
  solver::ColumnProblem problem = graded_column(loam(), {100.0, {}, 0.5, 1.1, 2.0});
  problem.top = solver::PrescribedFlux{solver::StepSeries{{0.0, 0.5}, {3.0, 0.0}}};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{-200.0};
  problem.end_day = 2.0;
  for (int k = 0; k <= 48; ++k) problem.output_days.push_back(k / 24.0);
  return problem;
}

TEST(OutputObserver, ReceivesEveryOutputOnceInOrderAndTheRunKeepsNoProfile) {
  const solver::ColumnProblem problem = infiltration_problem();
  std::vector<double> times;
  std::size_t cells = 0;
  const solver::ColumnRun run =
      solver::simulate(problem, [&](const solver::ProfileSnapshot& profile, const solver::CumulativeBalance& balance) {
        EXPECT_EQ(profile.time_days, balance.time_days);
        times.push_back(profile.time_days);
        cells = profile.head_cm.size();
      });
  ASSERT_TRUE(run.complete);
  EXPECT_EQ(times, problem.output_days);
  EXPECT_EQ(cells, run.cell_depths_cm.size());
  EXPECT_TRUE(run.profiles.empty());
  EXPECT_EQ(run.balances.size(), problem.output_days.size());
}

TEST(OutputObserver, ProfilesAndBalancesAreThoseOfARunThatKeepsThem) {
  const solver::ColumnProblem problem = infiltration_problem();
  const solver::ColumnRun kept = solver::simulate(problem);
  std::vector<solver::ProfileSnapshot> observed;
  const solver::ColumnRun streamed = solver::simulate(
      problem,
      [&](const solver::ProfileSnapshot& profile, const solver::CumulativeBalance&) { observed.push_back(profile); });
  ASSERT_EQ(observed.size(), kept.profiles.size());
  for (std::size_t t = 0; t < observed.size(); ++t) {
    EXPECT_EQ(observed[t].head_cm, kept.profiles[t].head_cm) << "output " << t;
    EXPECT_EQ(observed[t].face_flux_cm_per_d, kept.profiles[t].face_flux_cm_per_d) << "output " << t;
    EXPECT_EQ(streamed.balances[t].bottom_flux_cm, kept.balances[t].bottom_flux_cm) << "output " << t;
  }
  EXPECT_EQ(streamed.statistics.steps, kept.statistics.steps);
}

TEST(OutputObserver, AnExceptionFromTheObserverEndsTheRun) {
  const solver::ColumnProblem problem = infiltration_problem();
  int calls = 0;
  const auto observe = [&](const solver::ProfileSnapshot&, const solver::CumulativeBalance&) {
    if (++calls == 5) throw std::runtime_error("disk full");
  };
  EXPECT_THROW(solver::simulate(problem, observe), std::runtime_error);
  EXPECT_EQ(calls, 5);
}

}  // namespace
}  // namespace wetfront::solver_tests
