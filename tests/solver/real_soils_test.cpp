// Documented inputs a user can write must run to the end on every common soil: uniform sands
// drying, every texture class drying and then taking a cloudburst, a coarse layer over clay, a
// dry gravel, a very dry clay under ponding whatever the output interval, and the plain van
// Genuchten clay (n = 1.09) ponded. Each run must complete with the water balance at round-off
// and every head finite.
#include <gtest/gtest.h>

#include <cmath>
#include <string>

#include "solver_test_soils.hpp"
#include "wetfront/soils/texture_classes.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

void expect_complete_finite_balanced(const solver::ColumnRun& run, const std::string& what) {
  ASSERT_TRUE(run.complete) << what << ": " << (run.failure ? run.failure->reason : "");
  ASSERT_FALSE(run.balances.empty());
  for (const auto& p : run.profiles)
    for (double h : p.head_cm) ASSERT_TRUE(std::isfinite(h)) << what << " at day " << p.time_days;
  const auto& last = run.balances.back();
  const double turnover = last.water_input_cm + last.actual_evaporation_cm + std::abs(last.bottom_flux_cm) +
                          last.runoff_cm + run.balances.front().soil_storage_cm;
  // Exact by construction (column_model.hpp): round-off of the sums only.
  EXPECT_LT(std::abs(last.balance_error_cm), 1e-12 * turnover) << what;
}

solver::Grid fine_top_grid(double depth_cm) {
  solver::GridRequest request;
  request.depth_cm = depth_cm;
  request.surface_cell_cm = 0.5;
  request.growth_factor = 1.1;
  request.max_cell_cm = 2.0;
  return solver::graded_grid(request);
}

std::vector<double> days(double end, double step) {
  std::vector<double> t;
  for (int k = 0; k * step <= end + 1e-12; ++k) t.push_back(k * step);
  return t;
}

// Uniform sand, Ks 500 cm/d, n from 2 to 8 (alpha 0.145 /cm, theta_r 0.045, theta_s 0.43 as
// the Carsel & Parrish sand; from memory), drying under 5 mm/d of potential evaporation
// with a dry limit of -15000 cm, from near saturation and from -100 cm.
class DryingSand : public testing::TestWithParam<std::tuple<double, double>> {};

TEST_P(DryingSand, CompletesWithFiniteHeads) {
  const auto [n, initial_head] = GetParam();
  const soils::VanGenuchtenMualem sand{0.045, 0.43, 0.145, n, 500.0, 0.5};
  auto problem = make_column(single_layer(100.0, sand), fine_top_grid(100.0));
  problem.top = solver::LimitedFlux{solver::StepSeries::constant(0.0), solver::StepSeries::constant(0.5), -15000.0,
                                    0.0};
  problem.initial = solver::UniformHead{initial_head};
  problem.end_day = 10.0;
  problem.output_days = days(10.0, 1.0);
  expect_complete_finite_balanced(solver::simulate(problem), "sand n " + std::to_string(n));
}

INSTANTIATE_TEST_SUITE_P(SandsN2To8, DryingSand,
                         testing::Combine(testing::Values(2.0, 3.0, 4.0, 5.0, 6.0, 8.0), testing::Values(-5.0, -100.0)));

// Every Carsel & Parrish (1988) class: 20 days drying under 6 mm/d from -50 cm, then 200 mm of
// rain in 10 minutes (surface storage 1 cm, the rest runs off), then 2 more days.
class TextureClassCloudburst : public testing::TestWithParam<std::size_t> {};

TEST_P(TextureClassCloudburst, DriesThenTakesTheStorm) {
  const auto& texture = soils::texture_classes()[GetParam()];
  auto problem = make_column(single_layer(100.0, texture.parameters), fine_top_grid(100.0));
  const double burst_start = 20.0, burst_end = 20.0 + 10.0 / 1440.0;
  const solver::StepSeries rain{{0.0, burst_start, burst_end}, {0.0, 20.0 / (10.0 / 1440.0), 0.0}};
  const solver::StepSeries demand{{0.0, burst_start, burst_end}, {0.6, 0.0, 0.6}};
  problem.top = solver::LimitedFlux{rain, demand, -15000.0, 1.0};
  problem.initial = solver::UniformHead{-50.0};
  problem.end_day = 22.0;
  problem.output_days = days(22.0, 0.5);
  const auto run = solver::simulate(problem);
  expect_complete_finite_balanced(run, std::string(texture.name));
  if (run.complete) {
    EXPECT_NEAR(run.balances.back().water_input_cm, 20.0, 1e-9) << texture.name;
  }
}

INSTANTIATE_TEST_SUITE_P(AllTwelveClasses, TextureClassCloudburst, testing::Range<std::size_t>(0, 12));

TEST(RealSoils, CoarseLayerOverClay) {
  // 30 cm of sand on clay: rain well above the clay's Ks perches water on the interface.
  const soils::LayeredProfile soil({soils::SoilLayer{"sand", 0.0, 30.0, sand()},
                                    soils::SoilLayer{"clay", 30.0, 100.0, clay_with_air_entry()}});
  auto problem = make_column(soil, fine_top_grid(100.0));
  const solver::StepSeries rain{{0.0, 1.0}, {20.0, 0.0}};
  const solver::StepSeries demand{{0.0, 1.0}, {0.0, 0.5}};
  problem.top = solver::LimitedFlux{rain, demand, -15000.0, 0.5};
  problem.initial = solver::UniformHead{-300.0};
  problem.end_day = 10.0;
  problem.output_days = days(10.0, 0.5);
  expect_complete_finite_balanced(solver::simulate(problem), "sand over clay");
}

TEST(RealSoils, DryGravelWetted) {
  // A coarse gravel (illustrative parameters in the range of coarse gravels, common practice:
  // theta_r 0.02, theta_s 0.35, alpha 0.5 /cm, n 4, Ks 5000 cm/d) at -1000 cm takes rain.
  const soils::VanGenuchtenMualem gravel{0.02, 0.35, 0.5, 4.0, 5000.0, 0.5};
  auto problem = make_column(single_layer(100.0, gravel), fine_top_grid(100.0));
  problem.top = solver::LimitedFlux{solver::StepSeries{{0.0, 2.0}, {5.0, 0.0}}, solver::StepSeries::constant(0.3),
                                    -15000.0, 0.0};
  problem.initial = solver::UniformHead{-1000.0};
  problem.end_day = 5.0;
  problem.output_days = days(5.0, 0.5);
  expect_complete_finite_balanced(solver::simulate(problem), "dry gravel");
}

// A very dry clay under a ponded surface: the answer must not depend on how often the run
// writes (outputs are read from the integrator's interpolant between its own steps).
TEST(RealSoils, DryClayPondedSameAtEveryOutputInterval) {
  auto run_with_outputs = [](double interval_days) {
    auto problem = make_column(single_layer(50.0, clay()), fine_top_grid(50.0));
    problem.top = solver::PrescribedHead{solver::StepSeries::constant(2.0)};
    problem.initial = solver::UniformHead{-10000.0};
    problem.end_day = 1.0;
    problem.output_days = days(1.0, interval_days);
    return solver::simulate(problem);
  };
  const auto daily = run_with_outputs(1.0);
  const auto hourly = run_with_outputs(1.0 / 24.0);
  const auto each_minute = run_with_outputs(1.0 / 1440.0);
  for (const auto* run : {&daily, &hourly, &each_minute}) expect_complete_finite_balanced(*run, "dry clay ponded");
  if (!daily.complete || !hourly.complete || !each_minute.complete) return;
  // Identical steps, so identical results at the common final time (identity, not a tolerance).
  EXPECT_EQ(daily.statistics.steps, hourly.statistics.steps);
  EXPECT_EQ(daily.statistics.steps, each_minute.statistics.steps);
  EXPECT_EQ(daily.balances.back().infiltration_cm, hourly.balances.back().infiltration_cm);
  EXPECT_EQ(daily.balances.back().infiltration_cm, each_minute.balances.back().infiltration_cm);
  EXPECT_GT(daily.balances.back().infiltration_cm, 0.0);
}

TEST(RealSoils, PlainVanGenuchtenClayPonded) {
  // n = 1.09 without an air-entry head: the Mualem K falls to half of Ks within 1e-4 cm below
  // saturation. The storage table caps its slope over the first 1e-3 cm (storage_table.hpp).
  auto problem = make_column(single_layer(50.0, clay()), fine_top_grid(50.0));
  problem.top = solver::LimitedFlux{solver::StepSeries{{0.0, 1.0}, {20.0, 0.0}}, solver::StepSeries::constant(0.2),
                                    -15000.0, 2.0};
  problem.bottom = solver::FixedHead{0.0};
  problem.initial = solver::Hydrostatic{50.0};
  problem.end_day = 5.0;
  problem.output_days = days(5.0, 0.25);
  const auto run = solver::simulate(problem);
  expect_complete_finite_balanced(run, "plain clay ponded");
  if (run.complete) {
    EXPECT_GT(run.balances.back().runoff_cm + run.balances.back().ponded_depth_cm, 0.0);
  }
}

// Output times and breakpoints built by different arithmetic differ by round-off and must count
// as one time: 300 days with a 10-day output interval built by repeated addition.
TEST(RealSoils, OutputTimesByRepeatedAdditionMeetBreakpoints) {
  auto problem = make_column(single_layer(100.0, loam()), fine_top_grid(100.0));
  solver::StepSeries rain, demand;
  for (int k = 0; k < 3000; ++k) {
    const double start = 300.0 * k / 3000.0;  // 0.1 d periods placed as a + (b - a) k / n
    rain.start_days.push_back(start);
    rain.values.push_back(k % 50 == 0 ? 5.0 : 0.0);
    demand.start_days.push_back(start);
    demand.values.push_back(0.3);
  }
  problem.top = solver::LimitedFlux{rain, demand, -15000.0, 0.0};
  problem.end_day = 300.0;
  problem.output_days.clear();
  for (double t = 0.0; t <= 300.0 + 1e-9; t += 10.0 / 3.0) problem.output_days.push_back(t);
  const auto run = solver::simulate(problem);
  expect_complete_finite_balanced(run, "300 days");
  if (run.complete) {
    EXPECT_EQ(run.profiles.size(), problem.output_days.size());
  }
}

}  // namespace
}  // namespace wetfront::solver_tests
