// libFuzzer target: every CSV reader on the same bytes - the base table, rain/irrigation depths,
// pan readings, dated crop tables, the lab files (retention points, core samples, suction
// steps), the field permeameter and infiltrometer files, and the site's sensor files
// (tensiometer, probe, well, cores; through the demo site with the readings file replaced).
// Bad input must end in base::InputError; anything else is a finding.
#include <cstddef>
#include <cstdint>
#include <fstream>
#include <functional>
#include <optional>
#include <sstream>

#include "fuzz_input_file.hpp"
#include "wetfront/base/csv_table.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/time_point.hpp"
#include "wetfront/forcing/csv_readers.hpp"
#include "wetfront/site/field_analysis.hpp"
#include "wetfront/site/lab_analysis.hpp"
#include "wetfront/site/sensor_readings.hpp"
#include "wetfront/site/site_file.hpp"
#include "wetfront/soils/lab_csv.hpp"

namespace {

namespace wf = wetfront;

const wf::site::SiteSetup& demo_site() {
  static const wf::site::SiteSetup site =
      wf::site::load_site_file(std::filesystem::path(WETFRONT_DEMO_DIR) / "site.toml");
  return site;
}

void expect_input_errors_only(const std::function<void()>& read) {
  try {
    read();
  } catch (const wf::base::InputError&) {
  }
}

}  // namespace

extern "C" int LLVMFuzzerInitialize(int*, char***) {
  (void)demo_site();
  return 0;
}

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const auto path = wf::fuzz::input_file("input.csv", data, size);
  const wf::base::TimePoint start = *wf::base::parse_timestamp("2025-04-01");
  expect_input_errors_only([&] {
    std::istringstream in(std::string(reinterpret_cast<const char*>(data), size));
    (void)wf::base::CsvTable::parse(in, "input.csv");
  });
  expect_input_errors_only([&] { (void)wf::forcing::read_depth_series_csv(path, "rain", start); });
  expect_input_errors_only([&] { (void)wf::forcing::read_pan_readings_csv(path, start); });
  expect_input_errors_only([&] {
    const wf::forcing::ValueColumn columns[] = {{"values", 1.0}, {"depth_cm", 1.0}, {"depth_mm", 0.1}};
    (void)wf::forcing::read_dated_table_csv(path, "root depth", columns, start);
  });
  expect_input_errors_only([&] { (void)wf::soils::read_retention_csv(path); });
  expect_input_errors_only([&] { (void)wf::soils::read_core_samples_csv(path); });
  expect_input_errors_only([&] { (void)wf::soils::read_suction_steps_csv(path); });
  expect_input_errors_only([&] {
    (void)wf::site::analyse_permeameter({.file = path.string(), .well_radius = "3 cm", .reservoir_area = "35.4 cm2"});
  });
  expect_input_errors_only([&] {
    (void)wf::site::analyse_infiltrometer({.file = path.string(), .disc_radius = "10 cm", .tower_area = "19.6 cm2"});
  });
  expect_input_errors_only([&] { (void)wf::site::analyse_retention({.points_file = path.string()}); });
  for (const auto& sensor : demo_site().sensors) {
    expect_input_errors_only([&] {
      wf::site::SiteSetup site = demo_site();
      site.sensors = {sensor};
      site.sensors.front().readings = path;
      (void)wf::site::read_sensor_readings(site);
    });
  }
  return 0;
}
