// Tensiometer readings: unit conversion, gauge-height correction, working-limit flags.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <vector>

#include "wetfront/observations/tensiometer.hpp"

namespace wetfront::observations {
namespace {

TEST(TensionUnits, AllUnitsGiveTheSameHead) {
  // 1 kPa = 1 centibar = 10 mbar = 10.197 cm of water (common practice).
  // 25 kPa -> 25 * 10.197 = 254.925 cm.
  EXPECT_NEAR(tension_as_head_cm({25.0, TensionUnit::kilopascal}), 254.925, 1e-9);
  EXPECT_NEAR(tension_as_head_cm({25.0, TensionUnit::centibar}), 254.925, 1e-9);
  EXPECT_NEAR(tension_as_head_cm({250.0, TensionUnit::millibar}), 254.925, 1e-9);
  EXPECT_NEAR(tension_as_head_cm({254.925, TensionUnit::cm_of_water}), 254.925, 1e-12);
  EXPECT_NEAR(tension_in_kilopascal({254.925, TensionUnit::cm_of_water}), 25.0, 1e-12);
}

TEST(CupHead, GaugeAboveGroundAddsTheWaterColumn) {
  // Gauge 30 cm above ground, cup at 60 cm: the column is 90 cm long.
  // h_cup = -254.925 + (30 + 60) = -164.925 cm.
  const TensiometerInstallation gauge{60.0, ReadingPoint::gauge_above_ground, 30.0};
  EXPECT_NEAR(cup_pressure_head_cm(gauge, {25.0, TensionUnit::kilopascal}), -164.925, 1e-9);
  // A gauge at ground level still has the cup depth of water below it: -254.925 + 60.
  const TensiometerInstallation at_ground{60.0, ReadingPoint::gauge_above_ground, 0.0};
  EXPECT_NEAR(cup_pressure_head_cm(at_ground, {25.0, TensionUnit::kilopascal}), -194.925, 1e-9);
}

TEST(CupHead, TransducerAtCupReadsTheCupDirectly) {
  // The gauge height is ignored: the reading is already at the cup.
  const TensiometerInstallation transducer{60.0, ReadingPoint::transducer_at_cup, 30.0};
  EXPECT_NEAR(cup_pressure_head_cm(transducer, {25.0, TensionUnit::kilopascal}), -254.925, 1e-9);
}

TEST(CupHead, RejectsNegativeGeometry) {
  EXPECT_THROW(cup_pressure_head_cm({-5.0, ReadingPoint::transducer_at_cup, 0.0}, {1.0}), wetfront::base::InputError);
  EXPECT_THROW(cup_pressure_head_cm({50.0, ReadingPoint::gauge_above_ground, -1.0}, {1.0}), wetfront::base::InputError);
}

TEST(WorkingLimit, ReadingsBeyondTheLimitAreKeptFlaggedAndCounted) {
  const TensiometerInstallation gauge{45.0, ReadingPoint::gauge_above_ground, 20.0};
  const std::vector<TensiometerReading> readings = {
      {1.0, {30.0, TensionUnit::kilopascal}}, {2.0, {79.9, TensionUnit::centibar}},
      {3.0, {80.0, TensionUnit::kilopascal}},  // at the limit: still within
      {4.0, {85.0, TensionUnit::kilopascal}},  // beyond
      {5.0, {900.0, TensionUnit::millibar}},   // 90 kPa, beyond
  };
  const CupHeadSeries series = cup_pressure_heads(gauge, readings);  // default limit 80 kPa
  ASSERT_EQ(series.heads.size(), 5u);
  EXPECT_EQ(series.unreliable_count, 2);
  const std::vector<bool> expected_reliable = {true, true, true, false, false};
  for (std::size_t i = 0; i < readings.size(); ++i) {
    EXPECT_EQ(series.heads[i].reliable, expected_reliable[i]) << "reading " << i;
    EXPECT_DOUBLE_EQ(series.heads[i].depth_cm, 45.0);
    EXPECT_DOUBLE_EQ(series.heads[i].day, readings[i].day);
  }
  // The flagged reading keeps its converted head: -85 * 10.197 + 65 = -801.745 cm.
  EXPECT_NEAR(series.heads[3].value, -801.745, 1e-9);

  // A stricter limit of 70 kPa also flags 79.9 and 80.
  EXPECT_EQ(cup_pressure_heads(gauge, readings, WorkingLimit{70.0}).unreliable_count, 4);
}

}  // namespace
}  // namespace wetfront::observations
