#include <gtest/gtest.h>

#include <array>
#include <filesystem>
#include <fstream>

#include "wetfront/forcing/csv_readers.hpp"
#include "input_error_of.hpp"
#include "wetfront/base/input_error.hpp"

namespace wf = wetfront::forcing;
namespace fs = std::filesystem;

using wetfront::test_support::input_error_of;

namespace {

fs::path data(const char* name) { return fs::path(WETFRONT_SOURCE_DIR) / "tests/forcing/data" / name; }

const wetfront::base::TimePoint may1 = *wetfront::base::parse_timestamp("2024-05-01");

// Writes `text` to a fresh file in the temporary directory and returns its path.
fs::path scratch(const std::string& name, const std::string& text) {
  const fs::path dir = fs::temp_directory_path() / "wetfront_forcing_tests";
  fs::create_directories(dir);
  const fs::path p = dir / name;
  std::ofstream(p) << text;
  return p;
}

}  // namespace

TEST(CsvReaders, DailyRainWithAMissingDay) {
  const auto s = wf::read_depth_series_csv(data("rain_daily.csv"), "rain", may1);
  ASSERT_EQ(s.intervals.size(), 5u);
  EXPECT_DOUBLE_EQ(s.intervals[1].start_day, 1.0);
  EXPECT_DOUBLE_EQ(s.intervals[1].end_day, 2.0);
  EXPECT_DOUBLE_EQ(*s.intervals[1].depth_cm, 1.24);
  EXPECT_FALSE(s.intervals[3].depth_cm);
  EXPECT_EQ(s.intervals[3].source_line, 6);
  // The blocked gauge is a gap: an error that names the file and line unless a fill is chosen.
  const auto e = input_error_of([&] { wf::depth_series_to_rate(s, 5.0, wf::GapPolicy::error); });
  EXPECT_NE(std::string(e.what()).find("rain_daily.csv:6"), std::string::npos) << e.what();
  const auto zero = wf::depth_series_to_rate(s, 5.0, wf::GapPolicy::fill_with_zero);
  EXPECT_NEAR(zero.rate_cm_per_day.series.integral(0, 5), 1.55, 1e-12);
}

TEST(CsvReaders, IrrigationIntervalsInCm) {
  const auto s = wf::read_depth_series_csv(data("irrigation_intervals.csv"), "irrigation", may1);
  ASSERT_EQ(s.intervals.size(), 3u);
  EXPECT_DOUBLE_EQ(s.intervals[1].start_day, 2.25);
  EXPECT_DOUBLE_EQ(s.intervals[1].end_day, 2.375);
  const auto r = wf::depth_series_to_rate(s, 5.0, wf::GapPolicy::error);
  EXPECT_DOUBLE_EQ(r.rate_cm_per_day.series.at(2.3), 20.0);  // 2.5 cm in 3 hours
}

TEST(CsvReaders, PanReadingsFile) {
  const auto start = *wetfront::base::parse_timestamp("2024-05-01T08:00");
  const auto readings = wf::read_pan_readings_csv(data("pan_readings.csv"), start);
  ASSERT_EQ(readings.size(), 7u);
  EXPECT_EQ(readings[3].kind, wf::PanReadingKind::before_refill);
  EXPECT_EQ(readings[4].kind, wf::PanReadingKind::after_refill);
  EXPECT_EQ(readings[4].source_line, 7);
  const auto iv = wf::pan_intervals_from_readings(readings, wf::PanGeometry{});
  double total = 0;
  for (const auto& i : iv) total += i.evaporation_mm;
  EXPECT_NEAR(total, 37.0, 1e-9);  // hand-worked in test_pan_gauge.cpp
}

TEST(CsvReaders, DatedTable) {
  const std::array<wf::ValueColumn, 1> cols{{{"leaf_area_index", 1.0}}};
  const auto t = wf::read_dated_table_csv(data("leaf_area.csv"), "leaf area index", cols, may1);
  ASSERT_EQ(t.days.size(), 3u);
  EXPECT_DOUBLE_EQ(t.days[0], 9.0);
  EXPECT_DOUBLE_EQ(t.values[1], 3.2);
  const std::array<wf::ValueColumn, 2> root_cols{{{"root_depth_cm", 1.0}, {"root_depth_mm", 0.1}}};
  const auto p = scratch("roots.csv", "date,root_depth_mm\n2024-05-10,50\n2024-06-10,400\n");
  const auto roots = wf::read_dated_table_csv(p, "root depth", root_cols, may1);
  EXPECT_DOUBLE_EQ(roots.values[1], 40.0);
}

TEST(CsvReaders, ErrorsNameFileLineAndColumn) {
  auto bad_number = input_error_of([] {
    wf::read_depth_series_csv(scratch("rain_text.csv", "date,rain_mm\n2024-05-01,0\n2024-05-02,lots\n"), "rain", may1);
  });
  EXPECT_EQ(bad_number.line(), 3u);
  EXPECT_EQ(bad_number.column(), "rain_mm");
  EXPECT_NE(std::string(bad_number.what()).find("rain_text.csv:3: column 'rain_mm'"), std::string::npos)
      << bad_number.what();

  auto bad_date = input_error_of([] {
    wf::read_depth_series_csv(scratch("rain_date.csv", "date,rain_mm\n2024-05-01,0\n05/02/2024,1\n"), "rain", may1);
  });
  EXPECT_EQ(bad_date.line(), 3u);
  EXPECT_EQ(bad_date.column(), "date");
  EXPECT_NE(bad_date.problem().find("YYYY-MM-DD"), std::string::npos);

  auto negative = input_error_of(
      [] { wf::read_depth_series_csv(scratch("rain_negative.csv", "date,rain_cm\n2024-05-01,-0.2\n"), "rain", may1); });
  EXPECT_EQ(negative.line(), 2u);
  EXPECT_EQ(negative.column(), "rain_cm");

  auto no_unit = input_error_of(
      [] { wf::read_depth_series_csv(scratch("rain_unit.csv", "date,rain\n2024-05-01,2\n"), "rain", may1); });
  EXPECT_EQ(no_unit.line(), 1u);
  EXPECT_NE(no_unit.problem().find("'rain_mm' or 'rain_cm'"), std::string::npos) << no_unit.what();

  auto short_row = input_error_of([] {
    wf::read_depth_series_csv(scratch("rain_short.csv", "# comment\ndate,rain_mm\n2024-05-01\n"), "rain", may1);
  });
  EXPECT_EQ(short_row.line(), 3u);

  auto with_time = input_error_of(
      [] { wf::read_depth_series_csv(scratch("rain_time.csv", "date,rain_mm\n2024-05-01T09:00,2\n"), "rain", may1); });
  EXPECT_EQ(with_time.column(), "date");

  auto backwards = input_error_of([] {
    wf::read_depth_series_csv(scratch("rain_order.csv", "date,rain_mm\n2024-05-02,0\n2024-05-01,1\n"), "rain", may1);
  });
  EXPECT_EQ(backwards.line(), 3u);

  auto bad_event = input_error_of([] {
    wf::read_pan_readings_csv(
        scratch("pan_event.csv", "time,level_mm,rain_mm,event\n2024-05-01,200,,\n2024-05-02,195,0,topped\n"), may1);
  });
  EXPECT_EQ(bad_event.line(), 3u);
  EXPECT_EQ(bad_event.column(), "event");

  auto no_rain = input_error_of([] {
    wf::read_pan_readings_csv(scratch("pan_rain.csv", "time,level_mm,rain_mm\n2024-05-01,200,\n2024-05-02,195,\n"),
                              may1);
  });
  EXPECT_EQ(no_rain.line(), 3u);
  EXPECT_EQ(no_rain.column(), "rain_mm");

  auto missing_file = input_error_of([] { wf::read_depth_series_csv("/nonexistent/rain.csv", "rain", may1); });
  EXPECT_NE(std::string(missing_file.what()).find("/nonexistent/rain.csv"), std::string::npos);
}

TEST(CsvReaders, DailyPanEvaporationToReferenceEt) {
  const auto s = wf::read_depth_series_csv(data("pan_daily.csv"), "pan_evaporation", may1);
  const auto r = wf::depth_series_to_rate(s, 3.0, wf::GapPolicy::error);
  EXPECT_NEAR(r.rate_cm_per_day.series.integral(0, 3), 1.86, 1e-12);
  EXPECT_NEAR(r.rate_cm_per_day.series.at(1.5), 0.70, 1e-12);
}
