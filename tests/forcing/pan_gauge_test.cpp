#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/forcing/pan_gauge.hpp"

namespace wf = wetfront::forcing;
using Kind = wf::PanReadingKind;

namespace {
constexpr double minutes = 1.0 / 1440.0;

// Hand-worked sequence, run start 2024-05-01T08:00, Class A pan, rim 254 mm, operating band
// 179 to 204 mm above the floor (50 to 75 mm below the rim).
//   line time           level   rain  event           fall   E = fall + rain
//   2    05-01 08:00    200.0    -    reading          -       -
//   3    05-02 08:00    193.5   0.0   reading         6.5     6.5
//   4    05-03 08:00    195.0   8.0   reading        -1.5     6.5   (rain day)
//   5    05-04 08:00    186.2   0.0   before_refill   8.8     8.8
//   6    05-04 08:05    203.0    -    after_refill     -       -    (topped up)
//   7    05-05 08:00    196.4   0.0   reading         6.6     6.6
//   8    05-06 08:00    200.1  12.3   reading        -3.7     8.6   (rain day)
// Total evaporation 6.5 + 6.5 + 8.8 + 6.6 + 8.6 = 37.0 mm over the five days.
std::vector<wf::PanReading> hand_worked() {
  return {
      {0.0, 200.0, 0.0, Kind::reading, 2},
      {1.0, 193.5, 0.0, Kind::reading, 3},
      {2.0, 195.0, 8.0, Kind::reading, 4},
      {3.0, 186.2, 0.0, Kind::before_refill, 5},
      {3.0 + 5 * minutes, 203.0, 0.0, Kind::after_refill, 6},
      {4.0, 196.4, 0.0, Kind::reading, 7},
      {5.0, 200.1, 12.3, Kind::reading, 8},
  };
}
}  // namespace

TEST(PanGauge, HandWorkedSequenceWithRefillAndRain) {
  const auto readings = hand_worked();
  const auto iv = wf::pan_intervals_from_readings(readings, wf::PanGeometry{});
  ASSERT_EQ(iv.size(), 5u);
  const double expected_mm[] = {6.5, 6.5, 8.8, 6.6, 8.6};
  const double expected_fall_mm[] = {6.5, -1.5, 8.8, 6.6, -3.7};
  for (std::size_t i = 0; i < iv.size(); ++i) {
    EXPECT_NEAR(iv[i].evaporation_mm, expected_mm[i], 1e-9) << "interval " << i;
    EXPECT_NEAR(iv[i].level_fall_mm, expected_fall_mm[i], 1e-9) << "interval " << i;
    EXPECT_FALSE(iv[i].overflow_possible || iv[i].outside_operating_range || iv[i].level_rose_beyond_rain);
  }
  EXPECT_TRUE(iv[3].starts_at_refill);
  EXPECT_NEAR(iv[3].start_day, 3.0 + 5 * minutes, 1e-12);
  EXPECT_EQ(iv[2].end_line, 5);
  EXPECT_EQ(iv[3].start_line, 6);

  const auto start = *wetfront::base::parse_timestamp("2024-05-01T08:00");
  const auto depths = wf::pan_evaporation_depths(iv, wf::PanIntervalUse{}, start);
  // The five refill minutes are given to the interval after the refill: no gap.
  const auto rate = wf::depth_series_to_rate(depths, 5.0, wf::GapPolicy::error);
  EXPECT_NEAR(rate.rate_cm_per_day.series.integral(0, 5), 3.70, 1e-12);
  EXPECT_NEAR(rate.rate_cm_per_day.series.at(3.5), 0.66, 1e-12);
}

TEST(PanGauge, FlagsOverflowRangeAndRisingLevel) {
  const std::vector<wf::PanReading> readings{
      {0.0, 203.0, 0.0, Kind::reading, 2},
      {1.0, 190.0, 60.0, Kind::reading, 3},  // 203 + 60 = 263 mm > 254 mm rim: may have spilled
      {2.0, 183.0, 0.0, Kind::reading, 4},   // clean
      {3.0, 176.0, 0.0, Kind::reading, 5},   // 176 mm is below the 179 mm bottom of the band
      {4.0, 178.0, 0.0, Kind::reading, 6},   // level rose 2 mm with no rain
  };
  const auto iv = wf::pan_intervals_from_readings(readings, wf::PanGeometry{});
  ASSERT_EQ(iv.size(), 4u);
  EXPECT_TRUE(iv[0].overflow_possible);
  EXPECT_NEAR(iv[0].evaporation_mm, 73.0, 1e-12);
  EXPECT_FALSE(iv[1].overflow_possible || iv[1].outside_operating_range || iv[1].level_rose_beyond_rain);
  EXPECT_TRUE(iv[2].outside_operating_range);
  EXPECT_TRUE(iv[3].level_rose_beyond_rain);
  EXPECT_NEAR(iv[3].evaporation_mm, -2.0, 1e-12);

  const auto start = *wetfront::base::parse_timestamp("2024-05-01");
  // Default use: negative evaporation is an error naming the lines.
  try {
    wf::pan_evaporation_depths(iv, wf::PanIntervalUse{}, start, "pan.csv");
    FAIL() << "expected an error";
  } catch (const wetfront::base::InputError& e) {
    EXPECT_NE(std::string(e.what()).find("pan.csv:6"), std::string::npos) << e.what();
  }
  wf::PanIntervalUse use;
  use.level_rose_beyond_rain = wf::PanIntervalUse::Flagged::treat_as_missing;
  const auto depths = wf::pan_evaporation_depths(iv, use, start);
  EXPECT_FALSE(depths.intervals[0].depth_cm);  // overflow: missing by default
  EXPECT_NEAR(*depths.intervals[1].depth_cm, 0.7, 1e-12);
  EXPECT_NEAR(*depths.intervals[2].depth_cm, 0.7, 1e-12);  // out of range: used by default
  EXPECT_FALSE(depths.intervals[3].depth_cm);
  // Missing intervals are gaps: an error unless the caller says how to fill them.
  EXPECT_THROW(wf::depth_series_to_rate(depths, 4.0, wf::GapPolicy::error), wetfront::base::InputError);

  use.overflow = wf::PanIntervalUse::Flagged::use;
  EXPECT_NEAR(*wf::pan_evaporation_depths(iv, use, start).intervals[0].depth_cm, 7.3, 1e-12);
}

TEST(PanGauge, RefillMarksMustPairUp) {
  auto r = hand_worked();
  r[4].kind = Kind::reading;  // before_refill not followed by after_refill
  try {
    wf::pan_intervals_from_readings(r, wf::PanGeometry{}, "pan.csv");
    FAIL() << "expected an error";
  } catch (const wetfront::base::InputError& e) {
    EXPECT_EQ(e.line(), 6u);
    EXPECT_EQ(e.column(), "event");
  }
  r = hand_worked();
  r[4].rain_since_previous_mm = 1.0;  // rain on the after_refill reading
  EXPECT_THROW(wf::pan_intervals_from_readings(r, wf::PanGeometry{}), wetfront::base::InputError);
  r = hand_worked();
  r[2].kind = Kind::after_refill;  // after_refill without before_refill
  EXPECT_THROW(wf::pan_intervals_from_readings(r, wf::PanGeometry{}), wetfront::base::InputError);
  r = hand_worked();
  r[2].time_day = 0.5;
  r[3].time_day = 0.4;  // time goes backwards
  EXPECT_THROW(wf::pan_intervals_from_readings(r, wf::PanGeometry{}), wetfront::base::InputError);
  r = hand_worked();
  r.pop_back();
  r.pop_back();
  r.pop_back();  // ends on before_refill
  EXPECT_THROW(wf::pan_intervals_from_readings(r, wf::PanGeometry{}), wetfront::base::InputError);
}

TEST(PanGauge, RimHeightIsConfigurable) {
  // A pan with a 200 mm rim: band 125 to 150 mm, so 190 mm is above it; with the standard
  // 254 mm rim the band is 179 to 204 mm and 190 and 183 mm lie inside it.
  wf::PanGeometry small{200.0, 50.0, 75.0};
  const std::vector<wf::PanReading> readings{{0.0, 190.0, 0.0, Kind::reading, 2}, {1.0, 183.0, 0.0, Kind::reading, 3}};
  EXPECT_TRUE(wf::pan_intervals_from_readings(readings, small)[0].outside_operating_range);
  EXPECT_FALSE(wf::pan_intervals_from_readings(readings, wf::PanGeometry{})[0].outside_operating_range);
  const std::vector<wf::PanReading> too_high{{0.0, 210.0, 0.0, Kind::reading, 2}};
  EXPECT_THROW(wf::pan_intervals_from_readings(too_high, small), wetfront::base::InputError);
}
