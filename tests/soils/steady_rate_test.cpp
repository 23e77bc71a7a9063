// Steady outflow from reservoir readings: exact lines, drift and scatter checks, bad input.
#include "wetfront/soils/steady_rate.hpp"

#include <vector>

#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

namespace {

using wetfront::soils::InvalidReading;
using wetfront::soils::ReservoirReading;
using wetfront::soils::steady_outflow;

constexpr double minute_d = 1.0 / 1440.0;

// Level falling 0.5 cm per minute from 40 cm, read every 2 minutes.
std::vector<ReservoirReading> straight_line(std::size_t count) {
  std::vector<ReservoirReading> readings;
  for (std::size_t i = 0; i < count; ++i) {
    const double minutes = 2.0 * static_cast<double>(i);
    readings.push_back({minutes * minute_d, 40.0 - 0.5 * minutes});
  }
  return readings;
}

TEST(SteadyOutflow, ExactLineGivesAreaTimesFallRate) {
  // Continuity: Q = A v. A = 35 cm2, v = 0.5 cm/min = 720 cm/d -> Q = 25200 cm3/d
  // = 17.5 cm3/min (hand arithmetic).
  const auto readings = straight_line(6);
  const auto result = steady_outflow(readings, 35.0);
  EXPECT_NEAR(result.level_fall_rate_cm_per_d, 720.0, 1e-9);
  EXPECT_NEAR(result.outflow_cm3_per_d, 25200.0, 1e-7);
  EXPECT_NEAR(wetfront::soils::cm3_per_d_to_cm3_per_min(result.outflow_cm3_per_d), 17.5, 1e-10);
  EXPECT_NEAR(result.relative_drift, 0.0, 1e-12);
  EXPECT_NEAR(result.residual_std_cm, 0.0, 1e-9);
  EXPECT_TRUE(result.steady);
  EXPECT_TRUE(result.steadiness_note.empty());
  EXPECT_EQ(result.reading_count, 6u);
}

TEST(SteadyOutflow, OddCountSharesTheMiddleReading) {
  const auto readings = straight_line(5);
  const auto result = steady_outflow(readings, 10.0);
  EXPECT_NEAR(result.first_half_rate_cm_per_d, 720.0, 1e-9);
  EXPECT_NEAR(result.second_half_rate_cm_per_d, 720.0, 1e-9);
}

TEST(SteadyOutflow, SlowingFlowIsFlaggedAsDrift) {
  // Fall rate 1 cm/min over the first three readings, then 0.5 cm/min: halves give 1.0
  // and 0.5 cm/min, far beyond a 10% drift.
  const std::vector<ReservoirReading> readings = {{0.0, 40.0},          {2 * minute_d, 38.0}, {4 * minute_d, 36.0},
                                                  {6 * minute_d, 35.0}, {8 * minute_d, 34.0}, {10 * minute_d, 33.0}};
  const auto result = steady_outflow(readings, 20.0);
  EXPECT_NEAR(result.first_half_rate_cm_per_d, 1440.0, 1e-9);
  EXPECT_NEAR(result.second_half_rate_cm_per_d, 720.0, 1e-9);
  EXPECT_FALSE(result.steady);
  EXPECT_NE(result.steadiness_note.find("drifts"), std::string::npos);
}

TEST(SteadyOutflow, ScatteredReadingsAreFlagged) {
  auto readings = straight_line(8);  // 7 cm total fall over 14 minutes
  // Alternate +-0.6 cm about the line: residual std near 0.6 cm, about 9% of the fall.
  for (std::size_t i = 0; i < readings.size(); ++i) readings[i].water_level_cm += (i % 2 == 0 ? 0.6 : -0.6);
  const auto result = steady_outflow(readings, 20.0, {.max_relative_drift = 10.0, .max_relative_scatter = 0.05});
  EXPECT_GT(result.relative_scatter, 0.05);
  EXPECT_FALSE(result.steady);
  EXPECT_NE(result.steadiness_note.find("scatter"), std::string::npos);
}

TEST(SteadyOutflow, RejectsTooFewReadings) {
  const auto readings = straight_line(3);
  EXPECT_THROW(steady_outflow(readings, 35.0), wetfront::base::InputError);
}

TEST(SteadyOutflow, RejectsNonIncreasingTimesAndNamesTheReading) {
  auto readings = straight_line(6);
  readings[3].time_d = readings[2].time_d;
  try {
    steady_outflow(readings, 35.0);
    FAIL() << "expected InvalidReading";
  } catch (const InvalidReading& error) {
    EXPECT_EQ(error.reading_index(), 3u);
  }
}

TEST(SteadyOutflow, RejectsRisingLevelAndBadArea) {
  auto readings = straight_line(6);
  for (auto& r : readings) r.water_level_cm = 80.0 - r.water_level_cm;  // level rises
  EXPECT_THROW(steady_outflow(readings, 35.0), wetfront::base::InputError);
  EXPECT_THROW(steady_outflow(straight_line(6), 0.0), wetfront::base::InputError);
  EXPECT_THROW(steady_outflow(straight_line(6), -2.0), wetfront::base::InputError);
}

}  // namespace
