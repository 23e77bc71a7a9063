// Observed series against simulated profiles, per sensor and overall.
#include <gtest/gtest.h>

#include <cmath>
#include <vector>

#include "wetfront/observations/sensor_comparison.hpp"

namespace wetfront::observations {
namespace {

// Simulated head falls linearly with time at every depth: h = -100 - 10 t - d.
SimulatedProfiles falling_heads() {
  SimulatedProfiles p;
  p.times_day = {0, 1, 2, 3, 4};
  p.depths_cm = {10, 30, 50, 70};
  for (double t : p.times_day) {
    std::vector<double> row;
    for (double d : p.depths_cm) row.push_back(-100 - 10 * t - d);
    p.values.push_back(row);
  }
  return p;
}

TEST(SensorComparison, BiasPerSensorAndPooled) {
  // Sensor at 30 cm reads 5 cm wetter than simulated (sim - obs = -5); sensor at 60 cm reads
  // 15 cm drier (sim - obs = +15) but its day-4 reading is unreliable, and one reading lies
  // after the end of the run.
  SensorSeries shallow{"tensiometer 30 cm", {}}, deep{"tensiometer 60 cm", {}};
  for (double t : {0.0, 1.0, 2.0, 3.0}) shallow.observations.push_back({t, 30, -100 - 10 * t - 30 + 5, true});
  for (double t : {1.0, 2.0, 3.0}) deep.observations.push_back({t, 60, -100 - 10 * t - 60 - 15, true});
  deep.observations.push_back({4.0, 60, -900, false});
  deep.observations.push_back({5.0, 60, -200, true});
  const std::vector<SensorSeries> sensors = {shallow, deep};

  const ComparisonReport report = compare_with_simulation(sensors, falling_heads());
  ASSERT_EQ(report.sensors.size(), 2u);
  EXPECT_EQ(report.sensors[0].metrics.count, 4);
  EXPECT_NEAR(report.sensors[0].metrics.bias, -5.0, 1e-12);
  EXPECT_NEAR(report.sensors[0].metrics.root_mean_square_error, 5.0, 1e-12);
  EXPECT_EQ(report.sensors[1].metrics.count, 3);
  EXPECT_NEAR(report.sensors[1].metrics.bias, 15.0, 1e-12);
  EXPECT_EQ(report.sensors[1].unreliable_left_out, 1);
  EXPECT_EQ(report.sensors[1].outside_simulation, 1);
  // Pooled: (4 * -5 + 3 * 15) / 7 = 25/7; RMSE = sqrt((4 * 25 + 3 * 225) / 7) = sqrt(775/7)
  EXPECT_EQ(report.overall.count, 7);
  EXPECT_NEAR(report.overall.bias, 25.0 / 7.0, 1e-12);
  EXPECT_NEAR(report.overall.root_mean_square_error, std::sqrt(775.0 / 7.0), 1e-12);
  EXPECT_EQ(report.unreliable_left_out, 1);
  EXPECT_EQ(report.outside_simulation, 1);

  // Asked to, the unreliable reading is used: sim at day 4, 60 cm = -200; sim - obs = 700.
  const ComparisonReport with_all = compare_with_simulation(sensors, falling_heads(), {true});
  EXPECT_EQ(with_all.sensors[1].metrics.count, 4);
  EXPECT_NEAR(with_all.sensors[1].metrics.bias, (3 * 15.0 + 700.0) / 4.0, 1e-12);
  EXPECT_EQ(with_all.unreliable_left_out, 0);
}

// A reading both after the run and beyond the working limit counts as outside the run; one
// within the run but below the deepest cell centre counts apart, as outside the depths.
TEST(SensorComparison, EachLeftOutReadingCountsOnceOutsideTheRunFirst) {
  SensorSeries s{"tensiometer 60 cm", {}};
  s.observations.push_back({1.0, 60, -170, true});
  s.observations.push_back({5.0, 60, -900, false});  // after the run and unreliable
  s.observations.push_back({2.0, 80, -200, true});   // below the deepest centre (70 cm)
  s.observations.push_back({3.0, 60, -900, false});  // unreliable only
  const std::vector<SensorSeries> sensors = {s};
  const ComparisonReport report = compare_with_simulation(sensors, falling_heads());
  EXPECT_EQ(report.sensors[0].metrics.count, 1);
  EXPECT_EQ(report.sensors[0].outside_simulation, 1);
  EXPECT_EQ(report.sensors[0].outside_depth, 1);
  EXPECT_EQ(report.sensors[0].unreliable_left_out, 1);
  EXPECT_EQ(report.outside_simulation, 1);
  EXPECT_EQ(report.outside_depth, 1);
  EXPECT_EQ(report.unreliable_left_out, 1);
}

}  // namespace
}  // namespace wetfront::observations
