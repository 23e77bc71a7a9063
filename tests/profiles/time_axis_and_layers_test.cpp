// Calendar origin text for time axes, and the layer table taken from a soil profile.
#include <gtest/gtest.h>

#include "wetfront/profiles/layer_table.hpp"
#include "wetfront/profiles/time_axis.hpp"

namespace wetfront::profiles {
namespace {

TEST(TimeAxis, DateAndDateTimeBecomeDaysSinceUnits) {
  EXPECT_EQ(days_since_units("2025-04-01"), "days since 2025-04-01");
  EXPECT_EQ(days_since_units("2025-04-01T06:30"), "days since 2025-04-01 06:30:00");
  EXPECT_EQ(days_since_units("2024-02-29T23:59:59"), "days since 2024-02-29 23:59:59");
}

TEST(TimeAxis, OtherTextIsRejectedWithTheAcceptedForms) {
  for (const char* text : {"2025-13-01", "2025-02-30", "01/04/2025", "2025-04-01 06:30", "2025-04-01Tnoon", ""}) {
    try {
      days_since_units(text);
      ADD_FAILURE() << "accepted '" << text << "'";
    } catch (const std::invalid_argument& error) {
      EXPECT_NE(std::string(error.what()).find("expected YYYY-MM-DD"), std::string::npos) << error.what();
    }
  }
}

TEST(LayerTable, EveryModelListsItsParametersWithUnits) {
  soils::VanGenuchtenMualem loam{0.078, 0.43, 0.036, 1.56, 24.96, 0.5};
  soils::VanGenuchtenAirEntry clay{{0.07, 0.36, 0.005, 1.09, 0.48, 0.5}, -2.0};
  soils::BrooksCorey sand{0.02, 0.40, -15.0, 0.7, 500.0};
  soils::GardnerExponential silt{0.05, 0.45, 0.02, 12.0};
  const soils::LayeredProfile profile(
      {{"a", 0, 10, loam}, {"b", 10, 20, clay}, {"c", 20, 30, sand}, {"d", 30, 50, silt}});
  const auto table = describe_layers(profile);
  ASSERT_EQ(table.size(), 4u);
  EXPECT_EQ(table[0].model_name, "van Genuchten-Mualem");
  ASSERT_EQ(table[0].parameters.size(), 6u);
  EXPECT_EQ(table[0].parameters[2].name, "alpha");
  EXPECT_EQ(table[0].parameters[2].value, 0.036);
  EXPECT_EQ(table[0].parameters[2].unit, "1/cm");
  EXPECT_EQ(table[1].model_name, "van Genuchten-Mualem with air-entry head");
  ASSERT_EQ(table[1].parameters.size(), 7u);
  EXPECT_EQ(table[1].parameters[6].name, "air_entry_head");
  EXPECT_EQ(table[1].parameters[6].value, -2.0);
  EXPECT_EQ(table[2].model_name, "Brooks-Corey-Burdine");
  EXPECT_EQ(table[2].parameters[2].name, "bubbling_head");
  EXPECT_EQ(table[2].parameters[4].value, 500.0);
  EXPECT_EQ(table[3].model_name, "Gardner exponential");
  EXPECT_EQ(table[3].parameters[2].unit, "1/cm");
  EXPECT_EQ(table[3].top_depth_cm, 30.0);
  EXPECT_EQ(table[3].bottom_depth_cm, 50.0);
  EXPECT_EQ(table[3].name, "d");
}

}  // namespace
}  // namespace wetfront::profiles
