#include <gtest/gtest.h>

#include <string>

#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"

namespace wb = wetfront::base;
using wb::Dimension;

namespace {

std::string message_of(std::string_view text, Dimension dimension) {
  try {
    (void)wb::parse_quantity(text, dimension, "value");
  } catch (const wb::InputError& error) {
    return error.what();
  }
  ADD_FAILURE() << "accepted '" << text << "'";
  return {};
}

}  // namespace

TEST(Quantity, ConvertsToInternalUnits) {
  EXPECT_DOUBLE_EQ(wb::parse_quantity("25 cm/d", Dimension::conductivity, "k"), 25.0);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("1 cm/h", Dimension::conductivity, "k"), 24.0);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("3.2mm", Dimension::length, "d"), 0.32);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("2 m", Dimension::length, "d"), 200.0);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("90 min", Dimension::time, "t"), 90.0 / 1440.0);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("12 %", Dimension::water_content, "w"), 0.12);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("36 km/h", Dimension::wind_speed, "u"), 10.0);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("1e-2 1/mm", Dimension::inverse_length, "a"), 0.1);
}

TEST(Quantity, KilopascalsOfSuctionAsCentimetresOfWater) {
  // 1 kPa = 1000 Pa / (1000 kg/m3 * 9.80665 m/s2) = 0.1019716 m of water (common practice).
  EXPECT_NEAR(wb::parse_quantity("-35 kPa", Dimension::pressure_head, "h"), -356.90, 0.01);
  EXPECT_NEAR(wb::parse_quantity("1 hPa", Dimension::pressure_head, "h"), 1.019716, 1e-6);
}

TEST(Quantity, TemperaturesTakeAnOffset) {
  // 0 degC = 273.15 K (common practice).
  EXPECT_DOUBLE_EQ(wb::parse_quantity("20 degC", Dimension::temperature, "T"), 20.0);
  EXPECT_DOUBLE_EQ(wb::parse_quantity("20 C", Dimension::temperature, "T"), 20.0);
  EXPECT_NEAR(wb::parse_quantity("293.15 K", Dimension::temperature, "T"), 20.0, 1e-12);
}

TEST(Quantity, ABareNumberListsTheAcceptedUnits) {
  const std::string bare = message_of("3", Dimension::length);
  EXPECT_NE(bare.find("'3' has no unit"), std::string::npos) << bare;
  EXPECT_NE(bare.find("mm, cm or m"), std::string::npos) << bare;
  const std::string wrong = message_of("3 furlongs", Dimension::length);
  EXPECT_NE(wrong.find("unit 'furlongs' is not accepted here"), std::string::npos) << wrong;
  const std::string no_number = message_of("about 3 cm", Dimension::length);
  EXPECT_NE(no_number.find("expected a number with a unit"), std::string::npos) << no_number;
}

TEST(Quantity, PlainNumbers) {
  EXPECT_DOUBLE_EQ(wb::parse_number(" +0.5 ", "n"), 0.5);
  EXPECT_FALSE(wb::to_number(""));
  EXPECT_FALSE(wb::to_number("0.5x"));
  EXPECT_FALSE(wb::to_number("inf"));
  EXPECT_THROW((void)wb::parse_number("many", "n"), wb::InputError);
}

TEST(Quantity, KnownUnitsForCsvHeaders) {
  EXPECT_TRUE(wb::is_known_unit("min"));
  EXPECT_TRUE(wb::is_known_unit("kPa"));
  EXPECT_FALSE(wb::is_known_unit("level"));
  EXPECT_FALSE(wb::is_known_unit("K"));  // temperatures are not read from lab headers
}
