// Sensor readings against the model in `wetfront run`: reading the files, the metrics per
// sensor and pooled, the Darcy estimate in the visit table, and bad files named by line.
#include <gtest/gtest.h>

#include <cmath>
#include <fstream>
#include <sstream>

#include <fmt/format.h>

#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/sensor_check.hpp"
#include "wetfront/site/sensor_readings.hpp"
#include "wetfront/site/site_file.hpp"
#include "site_test_helpers.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {
namespace {

using testing::at_depth;
using testing::keep_tensiometers_and_probes;
using testing::run_program;
using testing::ScratchSite;

std::string first_line(const std::filesystem::path& csv) {
  std::ifstream in(csv);
  std::string line;
  std::getline(in, line);
  return line;
}

// The report line of one sensor, starting with its name.
std::string report_row(const std::string& report, const std::string& name) {
  std::istringstream in(report.substr(report.find("Sensors against the model")));
  for (std::string line; std::getline(in, line);) {
    if (line.rfind("  " + name + " ", 0) == 0) return line;
  }
  return {};
}

TEST(SensorsAgainstModel, DemoRunReportsEverySensorTheDarcyColumnAndStoredWater) {
  ScratchSite site("sensors-demo");
  const auto out = site.folder() / "season.h5";
  const auto run = run_site(site, out);
  ASSERT_EQ(run.exit_code, 0) << run.err;
  ASSERT_NE(run.out.find("Sensors against the model"), std::string::npos);
  // 28 readings per deep tensiometer and per probe at every visit inside the run (the demo's
  // readings, made from a model run with noise); the 50 cm probe misses three; the shallow
  // tensiometers read beyond the working limit in summer; seven core visits at five depths.
  for (const std::string name : {"T90", "T120", "P20", "P80"}) {
    const std::string row = report_row(run.out, name);
    ASSERT_FALSE(row.empty()) << name;
    EXPECT_NE(row.find(" 28 "), std::string::npos) << row;
  }
  EXPECT_NE(report_row(run.out, "P50").find(" 25 "), std::string::npos);
  for (const std::string name : {"cores at 20 cm", "cores at 140 cm"}) {
    EXPECT_NE(report_row(run.out, name).find(" 7 "), std::string::npos) << name;
  }
  int used = 0, left_out = 0;
  for (const std::string name : {"T30", "T60", "T90", "T120"}) {
    std::istringstream row(report_row(run.out, name).substr(report_row(run.out, name).find("[cm]") + 4));
    int u = 0, l = 0;
    row >> u >> l;
    EXPECT_EQ(u + l, 28) << name;
    used += u;
    left_out += l;
  }
  EXPECT_GT(left_out, 0);
  EXPECT_NE(report_row(run.out, "all tensiometers").find(fmt::format(" {} ", used)), std::string::npos);
  EXPECT_NE(report_row(run.out, "all probes and cores").find(" 116 "), std::string::npos);
  EXPECT_NE(run.out.find("beyond the working limit"), std::string::npos);
  EXPECT_NE(run.out.find("by Darcy's law"), std::string::npos);
  // The averaging of the Darcy estimate is stated, in the report and in the run file.
  const std::string averaging =
      "at the arithmetic mean head of the pair at each visit; an interval's estimate is the mean "
      "of the fluxes at its two visits times its length";
  std::string flat;  // the report with its line breaks and indents as single spaces
  for (std::size_t k = 0; k < run.out.size(); ++k) {
    if (run.out.compare(k, 3, "\n  ") == 0) {
      flat += ' ';
      k += 2;
    } else {
      flat += run.out[k];
    }
  }
  EXPECT_NE(flat.find(averaging), std::string::npos) << run.out;
  // The run file holds readings beside simulated values and the metrics; show prints them.
  const profiles::RunRecord record = profiles::read_run(out);
  ASSERT_TRUE(record.sensor_comparison.has_value());
  EXPECT_EQ(record.sensor_comparison->pressure_head.size(), 4u * 28u);
  EXPECT_EQ(record.sensor_comparison->water_content.size(), 3u * 28u - 3u + 7u * 5u);
  EXPECT_EQ(record.sensor_comparison->metrics.size(), 7u + 5u + 2u);
  ASSERT_TRUE(record.darcy_estimate.has_value());
  EXPECT_NE(record.darcy_estimate->conductivity_note.find(averaging), std::string::npos)
      << record.darcy_estimate->conductivity_note;
  const auto show = run_program(fmt::format("show '{}'", out.string()), site.folder());
  ASSERT_EQ(show.exit_code, 0) << show.err;
  for (const std::string name : {"T30", "T60", "T90", "T120", "P20", "P50", "P80", "cores at 50 cm", "all tensiometers",
                                 "all probes and cores"}) {
    EXPECT_EQ(report_row(show.out, name), report_row(run.out, name)) << name;
  }
  const std::string header = first_line(site.folder() / "season-visits.csv");
  EXPECT_NE(header.find("Darcy T90-T120 [mm]"), std::string::npos) << header;
  EXPECT_NE(header.find("model and Darcy"), std::string::npos) << header;
  // Stored water between the probes at 20 and 80 cm: a report section and two CSV columns,
  // empty for the first interval (no readings at the run start), filled for the second.
  const auto section = run.out.find("Stored water over the probe depths");
  ASSERT_NE(section, std::string::npos);
  EXPECT_NE(run.out.find("between 20 and 80 cm (probes P20, P50, P80, cores", section), std::string::npos)
      << run.out.substr(section);
  // Two visits without the 50 cm probe lack a depth (the third has cores); the run start and
  // end have no readings.
  EXPECT_NE(run.out.find("with a reading at every depth: 26 of 30", section), std::string::npos)
      << run.out.substr(section);
  EXPECT_NE(header.find(",observed storage change 20-80 cm [mm],simulated storage change 20-80 cm [mm]"),
            std::string::npos)
      << header;
  std::ifstream csv(site.folder() / "season-visits.csv");
  std::string line;
  std::getline(csv, line);
  std::getline(csv, line);
  line.erase(line.rfind(','));  // the last column is the run id
  EXPECT_EQ(line.substr(line.size() - 2), ",,") << line;
  std::getline(csv, line);
  line.erase(line.rfind(','));
  const std::string last = line.substr(line.rfind(',') + 1);
  EXPECT_FALSE(last.empty()) << line;
  // The run file keeps the stored water and the Darcy estimates: show prints the same sections.
  const auto shown = show.out.find("Sensors against the model");
  ASSERT_NE(shown, std::string::npos);
  EXPECT_EQ(show.out.substr(shown, show.out.find("Solver:") - shown),
            run.out.substr(run.out.find("Sensors against the model"),
                           run.out.find("Solver:") - run.out.find("Sensors against the model")));
}

// The first two readings of a file replaced by these tensions in kPa.
void set_first_tensions(const ScratchSite& site, const std::string& file,
                        const std::vector<std::string>& dates_and_values) {
  std::istringstream in(site.read(file));
  std::string text;
  std::size_t replaced = 0;
  for (std::string line; std::getline(in, line);) {
    if (!line.empty() && line[0] != '#' && line.rfind("time", 0) != 0 && replaced < dates_and_values.size()) {
      line = dates_and_values[replaced++];
    }
    text += line + "\n";
  }
  site.write(file, text);
}

TEST(SensorsAgainstModel, ReadingsAtTheWorkingLimitAreLeftOutAndCounted) {
  ScratchSite site("sensors-limit");
  // Until 20 May every demo tensiometer reads inside the working limit (a wet spring); the
  // first two T30 readings are made drier than the default 80 kPa.
  set_first_tensions(site, "tensiometer-30cm.csv", {"2025-04-08T09:00,85.0", "2025-04-15T09:00,92.5"});
  const Season season = prepare_season(load_site_file(site.site_file(), {"", "2025-05-20"}));
  ASSERT_EQ(season.sensor_readings.front().name, "T30");
  int in_april = 0;
  for (const auto& o : season.sensor_readings.front().series.observations)
    in_april += o.day < 15 && !o.reliable ? 1 : 0;
  EXPECT_EQ(in_april, 2);
  // By hand from the demo files: up to 2025-05-20 the demo tensiometers read at most 21.3 kPa
  // (T90 on 2025-04-08), so within the shortened run only the two T30 readings set above 80 kPa
  // are beyond the limit. Summer readings beyond it fall after the run's end and count as
  // outside the run, not here.
  const int beyond = 2;
  const auto run = run_site(site, site.folder() / "s.h5", "--to 2025-05-20");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_NE(run.out.find(fmt::format("Left out: {} tensiometer reading(s) beyond the working limit", beyond)),
            std::string::npos)
      << run.out;
}

// Readings made from the model's own output must give bias ~0 and NSE ~1: the comparison
// takes the state at the reading times themselves (they are output times) and converts the
// tension (with a gauge height for one tensiometer) and the water content back correctly.
TEST(SensorsAgainstModel, ReadingsMadeFromTheModelFitItExactly) {
  ScratchSite site("sensors-synthetic");
  keep_tensiometers_and_probes(site);
  site.replace("site.toml", "depth = \"60 cm\"\n", "depth = \"60 cm\"\ngauge_height = \"30 cm\"\n");
  const PeriodOverride period{"", "2025-05-27"};
  const Season first = prepare_season(load_site_file(site.site_file(), period));
  const solver::ColumnRun run = solver::simulate(first.problem);
  ASSERT_TRUE(run.complete);

  for (const auto& sensor : first.sensor_readings) {
    std::ifstream original(site.folder() / std::filesystem::path(sensor.file).filename());
    std::string text, line;
    std::size_t reading = 0;
    while (std::getline(original, line)) {
      if (line.rfind("time", 0) == 0) {
        text += sensor.kind == "tensiometer" ? "time,tension [cm]\n" : "time,water content [cm3/cm3]\n";
        continue;
      }
      if (line.empty() || line[0] == '#') {
        text += line + "\n";
        continue;
      }
      const auto& o = sensor.series.observations.at(reading++);
      if (o.day > run.profiles.back().time_days) continue;  // after the shortened run
      // The reading time is one of the output times.
      const auto snapshot = std::find_if(run.profiles.begin(), run.profiles.end(),
                                         [&](const auto& p) { return std::abs(p.time_days - o.day) < 1e-6; });
      ASSERT_NE(snapshot, run.profiles.end()) << sensor.name << " day " << o.day;
      const std::string time = line.substr(0, line.find(','));
      if (sensor.kind == "tensiometer") {
        const double head = at_depth(run.cell_depths_cm, snapshot->head_cm, sensor.depth_cm);
        // h_cup = -tension + (gauge height + cup depth) at a gauge above ground.
        const double gauge = sensor.name == "T60" ? 30.0 + 60.0 : 0.0;
        text += fmt::format("{},{:.9g}\n", time, -head + gauge);
      } else {
        text +=
            fmt::format("{},{:.9g}\n", time, at_depth(run.cell_depths_cm, snapshot->water_content, sensor.depth_cm));
      }
    }
    site.write(std::filesystem::path(sensor.file).filename().string(), text);
  }

  const Season second = prepare_season(load_site_file(site.site_file(), period));
  profiles::RunRecord record = make_record(second, solver::simulate(second.problem), "test");
  const SensorCheck check = check_sensors(second, second.sensor_readings, record);
  ASSERT_EQ(check.sensors.size(), 7u);
  for (const auto& row : check.sensors) {
    EXPECT_GE(row.metrics.count, 7) << row.name;
    const double tolerance = row.unit == "cm" ? 1e-3 : 1e-6;  // our own: print precision and solver repeatability
    EXPECT_NEAR(row.metrics.bias, 0.0, tolerance) << row.name;
    EXPECT_NEAR(row.metrics.root_mean_square_error, 0.0, tolerance) << row.name;
    EXPECT_GT(row.metrics.nash_sutcliffe, 0.9999) << row.name;
    EXPECT_GT(row.metrics.kling_gupta, 0.999) << row.name;
  }
  ASSERT_EQ(check.pooled.size(), 2u);
  EXPECT_GT(check.pooled[0].metrics.nash_sutcliffe, 0.9999);
  // Probe readings that are the model's values give the model's stored water at every visit.
  ASSERT_TRUE(check.storage && check.storage->usable());
  int compared = 0;
  for (const auto& v : check.storage->visits) {
    if (!v.observed_cm) continue;
    ASSERT_TRUE(v.simulated_cm.has_value());
    EXPECT_NEAR(*v.observed_cm, *v.simulated_cm, 1e-6) << "day " << v.day;  // our own: 60 cm x 1e-8 print precision
    ++compared;
  }
  EXPECT_GE(compared, 7);
}

TEST(SensorsAgainstModel, TensiometerPairKeyIsChecked) {
  ScratchSite site("sensors-pair");
  const std::size_t line = site.replace("site.toml", "plane_depth = \"150 cm\"\n",
                                        "plane_depth = \"150 cm\"\ntensiometer_pair = [\"T120\", \"T60\"]\n") +
                           1;
  const auto check = run_program(fmt::format("check '{}'", site.site_file().string()), site.folder());
  EXPECT_EQ(check.exit_code, 1);
  EXPECT_NE(check.err.find(fmt::format("site.toml:{}", line)), std::string::npos) << check.err;
  EXPECT_NE(check.err.find("shallower"), std::string::npos) << check.err;

  site.replace("site.toml", "[\"T120\", \"T60\"]", "[\"T60\", \"P20\"]");
  const auto probe = run_program(fmt::format("check '{}'", site.site_file().string()), site.folder());
  EXPECT_EQ(probe.exit_code, 1);
  EXPECT_NE(probe.err.find("'P20' is not a tensiometer"), std::string::npos) << probe.err;

  site.replace("site.toml", "[\"T60\", \"P20\"]", "[\"T30\", \"T60\"]");
  const SiteSetup setup = load_site_file(site.site_file());
  EXPECT_EQ(setup.darcy_pair, (std::vector<std::string>{"T30", "T60"}));
}

struct BadReadings {
  std::string file;
  std::string from;
  std::string to;
  std::string says;
};

std::string case_name(const ::testing::TestParamInfo<BadReadings>& case_info) {
  static const char* const names[] = {"TimeNotADate",       "ReadingNotANumber", "TimesGoBack",
                                      "TensionWithoutUnit", "NoTensionColumn",   "WaterContentAbove100Percent",
                                      "ExtraField"};
  return names[case_info.index];
}

class BadReadingsFile : public ::testing::TestWithParam<BadReadings> {};

TEST_P(BadReadingsFile, NamesFileAndLineAndExitsWithOne) {
  const BadReadings& bad = GetParam();
  ScratchSite site("sensors-bad");
  const std::size_t line = site.replace(bad.file, bad.from, bad.to);
  const auto run = run_site(site, site.folder() / "s.h5");
  EXPECT_EQ(run.exit_code, 1);
  EXPECT_NE(run.err.find(fmt::format("{}:{}", bad.file, line)), std::string::npos) << run.err;
  EXPECT_NE(run.err.find(bad.says), std::string::npos) << run.err;
  EXPECT_FALSE(std::filesystem::exists(site.folder() / "s.h5"));
}

INSTANTIATE_TEST_SUITE_P(
    Cases, BadReadingsFile,
    ::testing::Values(
        BadReadings{"tensiometer-60cm.csv", "2025-04-15T09:00,", "2025-04-15 nine,", "ISO 8601"},
        BadReadings{"tensiometer-60cm.csv", "2025-04-15T09:00,7.0", "2025-04-15T09:00,dry", "expected a number"},
        BadReadings{"tensiometer-90cm.csv", "2025-04-15T09:00,", "2025-04-01T09:00,", "times must increase"},
        BadReadings{"tensiometer-90cm.csv", "time,tension_kPa", "time,tension", "unit"},
        BadReadings{"tensiometer-120cm.csv", "time,tension_kPa", "time,suction_kPa", "tension"},
        BadReadings{"probe-20cm.csv", "2025-04-15T09:00,19.9", "2025-04-15T09:00,119.9", "between 0 and 100 %"},
        BadReadings{"probe-20cm.csv", "2025-04-15T09:00,19.9", "2025-04-15T09:00,19.9,1", "fields"}),
    case_name);

}  // namespace
}  // namespace wetfront::site
