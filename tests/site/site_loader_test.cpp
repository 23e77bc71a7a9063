// The site-file loader and season setup on the demo site (examples/demo/site.toml).
#include <gtest/gtest.h>

#include <cmath>
#include <fstream>
#include <sstream>
#include <variant>

#include "wetfront/base/input_error.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/site_file.hpp"
#include "wetfront/site/site_keys.hpp"
#include "site_test_helpers.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace wetfront::site {
namespace {

SiteSetup demo() { return load_site_file(testing::demo_folder() / "site.toml"); }

// Sum of the depth column of a demo CSV over rows whose first field starts with a date in
// [first, last] (ISO dates compare as text).
double csv_total_mm(const std::string& name, std::size_t column, const std::string& first, const std::string& last) {
  std::ifstream in(testing::demo_folder() / name);
  std::string line;
  double total = 0;
  bool header = true;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    if (header) {
      header = false;
      continue;
    }
    std::vector<std::string> fields;
    std::stringstream row(line);
    for (std::string field; std::getline(row, field, ',');) fields.push_back(field);
    const std::string date = fields[0].substr(0, 10);
    if (date >= first && date <= last) total += std::stod(fields[column]);
  }
  return total;
}

TEST(SiteLoader, DemoSiteAndPeriod) {
  const SiteSetup site = demo();
  EXPECT_EQ(site.name, "Demo plot 7 (invented)");
  EXPECT_EQ(site.run_start_text, "2025-04-01");
  EXPECT_DOUBLE_EQ(site.run_length_days, 200.0);  // 2025-04-01 to 2025-10-18
  EXPECT_DOUBLE_EQ(site.output_interval_days, 1.0);
  ASSERT_EQ(site.visit_days.size(), 28u);
  EXPECT_DOUBLE_EQ(site.visit_days.front(), 7.0);
  EXPECT_DOUBLE_EQ(site.visit_days.back(), 196.0);
}

TEST(SiteLoader, DemoLayers) {
  const SiteSetup site = demo();
  ASSERT_EQ(site.layers.size(), 2u);
  EXPECT_DOUBLE_EQ(site.layers[0].bottom_depth_cm, 40.0);
  EXPECT_DOUBLE_EQ(site.layers[1].bottom_depth_cm, 250.0);
  // Texture class: the library's Carsel & Parrish (1988) entry, whatever its numbers.
  const auto& top = std::get<soils::VanGenuchtenMualem>(site.layers[0].model);
  const auto expected = *soils::find_texture_class("sandy loam");
  EXPECT_EQ(top.n, expected.n);
  EXPECT_EQ(top.saturated_conductivity_cm_per_d, expected.saturated_conductivity_cm_per_d);
  // Explicit parameters as written in the demo file.
  const auto& sub = std::get<soils::VanGenuchtenMualem>(site.layers[1].model);
  EXPECT_DOUBLE_EQ(sub.residual_water_content, 0.08);
  EXPECT_DOUBLE_EQ(sub.saturated_water_content, 0.42);
  EXPECT_DOUBLE_EQ(sub.alpha_per_cm, 0.03);
  EXPECT_DOUBLE_EQ(sub.n, 1.5);
  EXPECT_DOUBLE_EQ(sub.saturated_conductivity_cm_per_d, 20.0);
}

TEST(SiteLoader, DemoBoundariesSensorsAndGrid) {
  const SiteSetup site = demo();
  // Water table at 300 cm under a 250 cm column: head at the bottom -50 cm.
  ASSERT_TRUE(std::holds_alternative<solver::FixedHead>(site.bottom));
  EXPECT_DOUBLE_EQ(std::get<solver::FixedHead>(site.bottom).head_cm, -50.0);
  ASSERT_TRUE(std::holds_alternative<solver::Hydrostatic>(site.initial));
  EXPECT_DOUBLE_EQ(std::get<solver::Hydrostatic>(site.initial).water_table_depth_cm, 300.0);
  ASSERT_EQ(site.sensors.size(), 9u);  // four tensiometers, probes at 20, 50 and 80 cm, cores, a well
  EXPECT_EQ(site.sensors[0].name, "T30");
  EXPECT_EQ(site.sensors[0].kind, "tensiometer");
  EXPECT_DOUBLE_EQ(site.sensors[3].depth_cm, 120.0);
  EXPECT_EQ(site.sensors[4].kind, "water content probe");
  EXPECT_EQ(site.sensors[7].kind, "core samples");
  EXPECT_EQ(site.sensors[8].kind, "observation well");
  EXPECT_DOUBLE_EQ(site.sensors[8].specific_yield, 0.10);
  EXPECT_DOUBLE_EQ(site.sensors[8].depth_cm, 0.0);  // no fixed depth: no grid face for it
  EXPECT_DOUBLE_EQ(site.recharge_plane_depth_cm, 150.0);
  const std::vector<double> faces = {20, 30, 40, 50, 60, 80, 90, 120, 150, 250};
  EXPECT_EQ(site.grid.required_face_depths_cm, faces);
  // -1500 kPa in cm of water with standard gravity and 1000 kg/m3 (common practice).
  EXPECT_NEAR(site.dry_limit_head_cm, -1500.0 * 100000.0 / (1000.0 * 9.80665), 1e-6);
}

TEST(SiteLoader, DryLimitFromAirHumidity) {
  testing::ScratchSite site("kelvin");
  site.replace("site.toml", "dry_limit = \"-1500 kPa\"",
               "dry_limit_air_humidity = \"50 %\"\ndry_limit_air_temperature = \"293.15 K\"");
  // Kelvin equation, h = R T ln(RH) / (M g) (forcing/dry_limit.hpp; as in Hillel 1998, from
  // memory): 13796.3 m * ln(0.5) = -9562.9 m at 20 degC.
  EXPECT_NEAR(load_site_file(site.site_file()).dry_limit_head_cm, -956286.0, 5.0);
  site.replace("site.toml", "\"293.15 K\"", "\"20 F\"");
  try {
    load_site_file(site.site_file());
    ADD_FAILURE() << "a temperature in F was accepted";
  } catch (const base::InputError& e) {
    EXPECT_NE(std::string(e.what()).find("dry_limit_air_temperature"), std::string::npos) << e.what();
  }
}

TEST(SiteLoader, DemoCropAndPan) {
  const SiteSetup site = demo();
  EXPECT_DOUBLE_EQ(site.crop.kc_curve.planting_day, 24.0);
  EXPECT_DOUBLE_EQ(site.crop.kc_curve.stages.season_days(), 165.0);
  EXPECT_DOUBLE_EQ(site.crop.kc_curve.kc_mid, 1.2);
  EXPECT_EQ(site.crop.uptake_response_name, "maize");
  EXPECT_TRUE(std::holds_alternative<solver::LinearRoots>(site.crop.root_shape));
  EXPECT_DOUBLE_EQ(site.crop.root_depth_cm.at(site.crop.root_depth_cm.days[1]), 90.0);
  ASSERT_TRUE(site.pan.readings.has_value());
  EXPECT_EQ(site.pan.coefficient.method, forcing::PanCoefficientChoice::Method::table);
  EXPECT_DOUBLE_EQ(site.pan.coefficient.site.fetch_m, 10.0);
  EXPECT_DOUBLE_EQ(site.pan.coefficient.site.wind_speed_2m_m_per_s, 2.5);
}

TEST(SiteLoader, DemoSeasonTotalsMatchTheRecords) {
  const Season season = prepare_season(demo());
  // The run covers 2025-04-01 to the end of 2025-10-17.
  EXPECT_NEAR(season.totals.rain_cm * 10, csv_total_mm("rain.csv", 1, "2025-04-01", "2025-10-17"), 1e-9);
  EXPECT_NEAR(season.totals.irrigation_cm * 10, csv_total_mm("irrigation.csv", 2, "2025-04-01", "2025-10-17"), 1e-9);
  EXPECT_GT(season.totals.pan_evaporation_cm, 0.0);
  EXPECT_DOUBLE_EQ(season.problem.end_day, 200.0);
  for (const double visit : season.site.visit_days) {
    EXPECT_TRUE(std::find(season.problem.output_days.begin(), season.problem.output_days.end(), visit) !=
                season.problem.output_days.end())
        << visit;
  }
  ASSERT_EQ(season.problem.flux_plane_depths_cm.size(), 1u);
  EXPECT_NO_THROW((void)season.problem.grid.face_at(150.0));
  EXPECT_TRUE(season.problem.sink != nullptr);
}

TEST(SiteLoader, PeriodOverrideKeepsVisitsInside) {
  const SiteSetup site = load_site_file(testing::demo_folder() / "site.toml", {"2025-05-01", "2025-06-01"});
  EXPECT_DOUBLE_EQ(site.run_length_days, 31.0);
  EXPECT_EQ(site.visit_dates, (std::vector<std::string>{"2025-05-06", "2025-05-13", "2025-05-20", "2025-05-27"}));
  EXPECT_DOUBLE_EQ(site.crop.kc_curve.planting_day, -6.0);  // 2025-04-25 is before the new start
}

TEST(SiteLoader, UnitsAreConverted) {
  testing::ScratchSite site("units");
  site.replace("site.toml", "plane_depth = \"150 cm\"", "plane_depth = \"1.5 m\"");
  site.replace("site.toml", "saturated_conductivity = \"20 cm/d\"", "saturated_conductivity = \"10 mm/h\"");
  site.replace("site.toml", "saturated_water_content = \"0.42 cm3/cm3\"", "saturated_water_content = \"42 %\"");
  const SiteSetup setup = load_site_file(site.site_file());
  EXPECT_DOUBLE_EQ(setup.recharge_plane_depth_cm, 150.0);
  const auto& sub = std::get<soils::VanGenuchtenMualem>(setup.layers[1].model);
  EXPECT_DOUBLE_EQ(sub.saturated_conductivity_cm_per_d, 24.0);  // 10 mm/h = 1 cm/h = 24 cm/d
  EXPECT_DOUBLE_EQ(sub.saturated_water_content, 0.42);
}

}  // namespace
}  // namespace wetfront::site
