// Laboratory cores: water content, bulk density, porosity and retention from suction steps.
#include <gtest/gtest.h>

#include "input_error_of.hpp"
#include "wetfront/base/input_error.hpp"

#include <stdexcept>
#include <string>
#include <vector>

#include "wetfront/soils/core_samples.hpp"

namespace ws = wetfront::soils;

using wetfront::test_support::input_error_message;

namespace {
// An invented 100 cm3 ring: tare 80 g, moist 250 g, oven-dry 220 g.
ws::CoreSample ring() { return {"ring A3", 100.0, 80.0, 250.0, 220.0}; }

std::string error_of(const ws::CoreSample& c) {
  return input_error_message([&] { ws::core_properties(c); });
}
}  // namespace

// Definitions of gravimetric and volumetric water content and dry bulk density (common practice).
TEST(CoreSamples, WaterContentAndBulkDensity) {
  const auto p = ws::core_properties(ring());
  EXPECT_DOUBLE_EQ(p.water_mass_g, 30.0);
  EXPECT_DOUBLE_EQ(p.dry_soil_mass_g, 140.0);
  EXPECT_DOUBLE_EQ(p.gravimetric_water_content_g_per_g, 30.0 / 140.0);
  EXPECT_DOUBLE_EQ(p.volumetric_water_content, 0.30);
  EXPECT_DOUBLE_EQ(p.dry_bulk_density_g_per_cm3, 1.40);
  // theta = w rho_b / rho_w
  EXPECT_DOUBLE_EQ(p.volumetric_water_content, p.gravimetric_water_content_g_per_g * p.dry_bulk_density_g_per_cm3);
}

// Porosity 1 - rho_b / rho_p with rho_p = 2.65 g/cm3 (common practice).
TEST(CoreSamples, PorosityAndThetaSCheck) {
  EXPECT_NEAR(ws::porosity(1.40), 1.0 - 1.40 / 2.65, 1e-15);
  EXPECT_NEAR(ws::porosity(1.0, 2.0), 0.5, 1e-15);
  EXPECT_THROW(ws::porosity(0.0), wetfront::base::InputError);
  EXPECT_THROW(ws::porosity(2.7), wetfront::base::InputError);
  const double phi = ws::porosity(1.40);  // 0.4717
  EXPECT_FALSE(ws::check_against_porosity(0.44, phi).exceeds_porosity);
  EXPECT_TRUE(ws::check_against_porosity(0.44, phi).message.empty());
  const auto bad = ws::check_against_porosity(0.52, phi);
  EXPECT_TRUE(bad.exceeds_porosity);
  EXPECT_NE(bad.message.find("exceeds the porosity"), std::string::npos);
  EXPECT_NEAR(bad.ratio, 0.52 / phi, 1e-15);
}

TEST(CoreSamples, ImpossibleDataNameTheSample) {
  auto c = ring();
  c.oven_dry_mass_g = 260.0;  // dry heavier than wet
  auto msg = error_of(c);
  EXPECT_NE(msg.find("'ring A3'"), std::string::npos) << msg;
  EXPECT_NE(msg.find("below the oven-dry mass"), std::string::npos) << msg;
  c = ring();
  c.oven_dry_mass_g = 80.0;  // no soil
  msg = error_of(c);
  EXPECT_NE(msg.find("not above the tare"), std::string::npos) << msg;
  c = ring();
  c.ring_volume_cm3 = 0.0;
  msg = error_of(c);
  EXPECT_NE(msg.find("ring volume"), std::string::npos) << msg;
  c = ring();
  c.ring_volume_cm3 = -5.0;
  EXPECT_NE(error_of(c).find("positive"), std::string::npos);
  c = ring();
  c.wet_mass_g = 330.0;  // 110 g of water in 100 cm3
  EXPECT_NE(error_of(c).find("not below 1"), std::string::npos);
}

TEST(CoreSamples, RetentionPointsFromSuctionSteps) {
  const std::vector<ws::SuctionStep> steps{{0.0, 264.0}, {100.0, 255.0}, {1000.0, 241.0}};
  const auto points = ws::retention_points_from_core(ring(), steps);
  ASSERT_EQ(points.size(), 3u);
  EXPECT_DOUBLE_EQ(points[0].water_content, 0.44);
  EXPECT_DOUBLE_EQ(points[1].water_content, 0.35);
  EXPECT_DOUBLE_EQ(points[2].water_content, 0.21);
  EXPECT_EQ(points[2].suction_cm, 1000.0);
  const std::vector<ws::SuctionStep> bad{{0.0, 264.0}, {100.0, 210.0}};
  try {
    ws::retention_points_from_core(ring(), bad);
    FAIL();
  } catch (const wetfront::base::InputError& e) {
    const std::string msg = e.what();
    EXPECT_NE(msg.find("'ring A3'"), std::string::npos) << msg;
    EXPECT_NE(msg.find("step 2 (suction 100 cm)"), std::string::npos) << msg;
  }
}
