// CSV readers for laboratory data: columns, units, and errors with file, line and column.
#include <gtest/gtest.h>

#include "input_error_of.hpp"
#include "wetfront/base/input_error.hpp"

#include <sstream>
#include <string>

#include "wetfront/soils/lab_csv.hpp"

namespace ws = wetfront::soils;

using wetfront::test_support::input_error_of;
using wetfront::test_support::expect_mentions;

namespace {

std::vector<ws::RetentionSeries> retention(const std::string& text) {
  std::istringstream in(text);
  return ws::parse_retention_csv(in, "points.csv");
}
}  // namespace

TEST(LabCsv, RetentionFileReads) {
  const auto series = ws::read_retention_csv(WETFRONT_SOURCE_DIR "/tests/soils/data/retention_loam_core.csv");
  ASSERT_EQ(series.size(), 1u);
  EXPECT_EQ(series[0].sample, "");
  ASSERT_EQ(series[0].points.size(), 12u);
  EXPECT_EQ(series[0].points[3].suction_cm, 33.0);
  EXPECT_EQ(series[0].points[3].water_content, 0.3760);
  EXPECT_EQ(series[0].lines[0], 3);  // after the comment and the header
}

TEST(LabCsv, RetentionColumnsInAnyOrderWithSamplesAndKilopascals) {
  const auto series = retention(
      "water_content, suction_kPa, sample\n"
      "0.40, 0, A\n"
      "\n"
      "0.31, 10, A\n"
      "0.38, 0, B\n");
  ASSERT_EQ(series.size(), 2u);
  EXPECT_EQ(series[0].sample, "A");
  EXPECT_NEAR(series[0].points[1].suction_cm, 101.97162129779283, 1e-10);  // 10 kPa
  EXPECT_EQ(series[0].lines[1], 4);
  EXPECT_EQ(series[1].points[0].water_content, 0.38);
}

TEST(LabCsv, RetentionErrorsNameFileLineAndColumn) {
  auto e = input_error_of([] { retention("suction_cm,water_content\n0,0.4\n100,abc\n"); });
  EXPECT_EQ(e.file(), "points.csv");
  EXPECT_EQ(e.line(), 3u);
  EXPECT_EQ(e.column(), "water_content");
  expect_mentions(e.what(), {"points.csv:3: column 'water_content': expected a number in cm3/cm3, got 'abc'"});

  e = input_error_of([] { retention("suction_cm,water_content\n0,40\n"); });
  expect_mentions(e.what(), {"not percent"});

  e = input_error_of([] { retention("suction_cm,water_content\n-5,0.4\n"); });
  EXPECT_EQ(e.column(), "suction_cm");

  e = input_error_of([] { retention("suction_cm,theta\n0,0.4\n"); });
  EXPECT_EQ(e.line(), 1u);
  EXPECT_EQ(e.column(), "theta");
  expect_mentions(e.what(), {"accepted columns are: suction_cm, suction_kPa, water_content"});

  e = input_error_of([] { retention("suction_cm\n0\n"); });
  EXPECT_EQ(e.column(), "water_content");

  e = input_error_of([] { retention("water_content\n0.4\n"); });
  EXPECT_EQ(e.column(), "suction_cm");

  e = input_error_of([] { retention("suction_cm,suction_kPa,water_content\n0,0,0.4\n"); });
  EXPECT_EQ(e.column(), "suction_kPa");

  e = input_error_of([] { retention("suction_cm,water_content\n0,0.4,7\n"); });
  EXPECT_EQ(e.line(), 2u);
  EXPECT_NE(std::string(e.what()).find("expected 2 comma-separated fields as in the header (line 1), found 3"),
            std::string::npos);

  e = input_error_of([] { retention("# only a comment\n"); });
  EXPECT_NE(std::string(e.what()).find("no header"), std::string::npos);

  e = input_error_of([] { retention("suction_cm,water_content\n"); });
  EXPECT_NE(std::string(e.what()).find("not followed by any data"), std::string::npos);

  e = input_error_of([] { retention("suction_cm,water_content,suction_cm\n0,0.4,0\n"); });
  EXPECT_NE(std::string(e.what()).find("more than once"), std::string::npos);
}

TEST(LabCsv, CoreSamplesAndSuctionStepsGiveRetentionPoints) {
  const auto cores = ws::read_core_samples_csv(WETFRONT_SOURCE_DIR "/tests/soils/data/cores_demo.csv");
  ASSERT_EQ(cores.size(), 2u);
  EXPECT_EQ(cores[1].name, "subsoil 40 cm");
  EXPECT_EQ(cores[1].oven_dry_mass_g, 236.9);
  const auto steps = ws::read_suction_steps_csv(WETFRONT_SOURCE_DIR "/tests/soils/data/suction_steps_demo.csv");
  ASSERT_EQ(steps.size(), 2u);
  EXPECT_EQ(steps[0].steps.size(), 3u);
  const auto series = ws::retention_from_cores(cores, steps);
  ASSERT_EQ(series.size(), 2u);
  EXPECT_NEAR(series[0].points[2].water_content, 0.21, 1e-12);            // (241 - 220) g / 100 cm3
  EXPECT_NEAR(series[0].points[2].suction_cm, 1019.7162129779283, 1e-9);  // 100 kPa
  EXPECT_NEAR(series[1].points[0].water_content, 0.392, 1e-12);           // (276.1 - 236.9) / 100
  EXPECT_EQ(series[1].lines[1], 7);
}

TEST(LabCsv, CoreErrors) {
  auto parse = [](const std::string& text) {
    std::istringstream in(text);
    return ws::parse_core_samples_csv(in, "cores.csv");
  };
  const std::string header = "sample,ring_volume_cm3,tare_mass_g,wet_mass_g,oven_dry_mass_g\n";
  auto e = input_error_of([&] { parse(header + "A,100,80,250,260\n"); });  // dry above wet
  EXPECT_EQ(e.line(), 2u);
  EXPECT_NE(std::string(e.what()).find("'A'"), std::string::npos) << e.what();
  e = input_error_of([&] { parse(header + "A,100,80,250,220\nA,100,80,250,220\n"); });
  EXPECT_EQ(e.line(), 3u);
  EXPECT_NE(std::string(e.what()).find("already appears on line 2"), std::string::npos) << e.what();
  e = input_error_of([&] { parse(header + "A,100 cm3,80,250,220\n"); });
  EXPECT_EQ(e.column(), "ring_volume_cm3");
  e = input_error_of([&] { parse("sample,ring_volume_cm3,wet_mass_g,oven_dry_mass_g\nA,100,250,220\n"); });
  EXPECT_EQ(e.column(), "tare_mass_g");

  std::istringstream steps_in("sample,suction_cm,wet_mass_g\nB,0,250\n");
  const auto steps = ws::parse_suction_steps_csv(steps_in, "steps.csv");
  const auto cores = parse(header + "A,100,80,250,220\n");
  EXPECT_THROW(ws::retention_from_cores(cores, steps), wetfront::base::InputError);
}

TEST(LabCsv, MissingFileIsReported) {
  EXPECT_THROW(ws::read_retention_csv("/nonexistent/points.csv"), std::runtime_error);
}
