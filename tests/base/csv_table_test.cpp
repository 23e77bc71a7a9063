#include <gtest/gtest.h>

#include <sstream>
#include <string>

#include "wetfront/base/csv_table.hpp"

namespace wb = wetfront::base;

namespace {

wb::CsvTable parse(const std::string& text) {
  std::istringstream in(text);
  return wb::CsvTable::parse(in, "t.csv");
}

std::string message_of(const std::string& text) {
  try {
    (void)parse(text);
  } catch (const wb::InputError& error) {
    return error.what();
  }
  ADD_FAILURE() << "accepted:\n" << text;
  return {};
}

}  // namespace

TEST(CsvTable, SkipsCommentsAndBlankLinesAndKeepsLineNumbers) {
  const auto t = parse("# a comment\n\ntime [min],level_cm\n0,5\n  # later comment\n1.5, 4.5 \r\n");
  ASSERT_EQ(t.row_count(), 2u);
  EXPECT_EQ(t.header_line(), 3u);
  EXPECT_EQ(t.line_of(1), 6u);
  EXPECT_EQ(t.text(1, 1), "4.5");
}

TEST(CsvTable, QuotedFieldsKeepCommasAndDoubledQuotes) {
  // The usual CSV quoting: a field in double quotes may hold commas, and "" is one quote.
  const auto t = parse("sample,note\n\"ring A\",\"wet, after \"\"rain\"\"\"\n");
  EXPECT_EQ(t.text(0, 0), "ring A");
  EXPECT_EQ(t.text(0, 1), "wet, after \"rain\"");
  EXPECT_NE(message_of("a,b\n\"open,1\n").find("t.csv:2: a quoted field is not closed"), std::string::npos);
}

TEST(CsvTable, HeaderUnitsInBracketsOrAfterTheLastUnderscore) {
  const auto t = parse("Water_Level [cm],time_min,steady\n57.8,3,yes\n");
  EXPECT_EQ(t.column(0).name, "Water_Level");
  EXPECT_EQ(t.column(0).unit, "cm");
  EXPECT_EQ(t.column(1).name, "time");
  EXPECT_EQ(t.column(1).unit, "min");
  EXPECT_EQ(t.column(1).header, "time_min");
  EXPECT_EQ(t.find_column("water level"), 0u);
  EXPECT_EQ(t.find_header("time_min"), 1u);
  EXPECT_FALSE(t.find_header("time"));
  EXPECT_DOUBLE_EQ(t.quantity(0, 0, wb::Dimension::length), 57.8);
  EXPECT_DOUBLE_EQ(t.quantity(0, 1, wb::Dimension::time), 3.0 / 1440.0);
  EXPECT_TRUE(t.flag(0, 2));
}

TEST(CsvTable, ErrorsNameFileLineAndColumn) {
  EXPECT_NE(
      message_of("a,b\n1,2,3\n").find("t.csv:2: expected 2 comma-separated fields as in the header (line 1), found 3"),
      std::string::npos);
  EXPECT_NE(message_of("a,,b\n").find("empty column name"), std::string::npos);
  EXPECT_NE(message_of("a,b,a\n1,2,3\n").find("column 'a': appears more than once"), std::string::npos);
  EXPECT_NE(message_of("# nothing\n").find("no header line"), std::string::npos);
  const auto t = parse("depth [cm],level [cm]\n10,12x\n");
  try {
    (void)t.quantity(0, 1, wb::Dimension::length);
    ADD_FAILURE() << "accepted '12x'";
  } catch (const wb::InputError& error) {
    EXPECT_STREQ(error.what(), "t.csv:2: column 'level': expected a number in cm, got '12x'");
  }
  EXPECT_THROW((void)t.require_column("steady"), wb::InputError);
}
