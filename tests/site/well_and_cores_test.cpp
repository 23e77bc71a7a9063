// Observation wells and core samples in `wetfront run`: the water-table-fluctuation estimate
// per visit interval in the report, the visit CSV and the run file (read back by `show`), core
// samples in the sensor comparison and the stored water, and bad files named by file and line.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <fstream>
#include <limits>
#include <numeric>
#include <sstream>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/sensor_check.hpp"
#include "wetfront/site/sensor_readings.hpp"
#include "wetfront/site/site_file.hpp"
#include "input_error_of.hpp"
#include "site_test_helpers.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/visit_balance.hpp"

namespace wetfront::site {
namespace {

using test_support::input_error_message;
using testing::run_program;
using testing::ScratchSite;

const std::vector<std::string> kVisits = {"2025-04-08", "2025-04-15", "2025-04-22", "2025-04-29", "2025-05-06"};

// A [[sensors]] block placed before [recharge] in the demo site file.
// The demo's own cores and well are removed first, so the tests set their own.
void add_sensor(const ScratchSite& site, const std::string& block) {
  testing::keep_tensiometers_and_probes(site);
  site.replace("site.toml", "[recharge]", block + "\n[recharge]");
}

std::string well_block(const std::string& extra = "") {
  return "[[sensors]]\nname = \"W1\"\nkind = \"observation well\"\nreadings = \"well.csv\"\nspecific_yield = 0.1\n" +
         extra;
}

// Depths to water (m) at 09:00 on each visit.
std::string well_file(const std::vector<double>& depths_m) {
  std::string text = "# invented well levels for a test\ntime,depth to water [m]\n";
  for (std::size_t k = 0; k < depths_m.size(); ++k) text += fmt::format("{}T09:00,{}\n", kVisits[k], depths_m[k]);
  return text;
}

// The demo's probes with P80 moved up to 20 cm (both read 0.30 at two visits), the 50 cm probe
// missing its second reading (0.22 at the first), and core samples "C" from cores.csv.
void add_cores_beside_probes(const ScratchSite& site) {
  testing::keep_tensiometers_and_probes(site);
  site.replace("site.toml", "[[sensors]]\nname = \"P80\"",
               "[[sensors]]\nname = \"C\"\nkind = \"core samples\"\n"
               "readings = \"cores.csv\"\n\n[[sensors]]\nname = \"P80\"");
  site.replace("site.toml", "name = \"P80\"\nkind = \"water content probe\"\ndepth = \"80 cm\"",
               "name = \"P80\"\nkind = \"water content probe\"\ndepth = \"20 cm\"");
  site.write("probe-20cm.csv", "time,water content [cm3/cm3]\n2025-04-08T09:00,0.30\n2025-04-15T09:00,0.30\n");
  site.write("probe-80cm.csv", "time,water content [cm3/cm3]\n2025-04-08T09:00,0.30\n2025-04-15T09:00,0.30\n");
  site.write("probe-50cm.csv", "time,water content [cm3/cm3]\n2025-04-08T09:00,0.22\n");
}

std::string line_with(const std::string& text, const std::string& start) {
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) {
    if (line.find(start) != std::string::npos) return line;
  }
  return {};
}

std::vector<std::string> csv_fields(const std::string& line) {
  std::vector<std::string> fields;
  std::string field;
  std::istringstream in(line);
  while (std::getline(in, field, ',')) fields.push_back(field);
  if (!line.empty() && line.back() == ',') fields.push_back("");
  return fields;
}

// Healy & Cook (2002): R = Sy x rise. By hand with Sy = 0.1: 3.00 -> 2.90 m is a 10 cm rise,
// 1.0 cm (10.0 mm) of recharge; 2.90 -> 2.95 m is a fall, none; 2.95 -> 2.80 m gives 1.5 cm.
TEST(WaterTableEstimate, ReportCsvAndRunFileCarryTheHandWorkedAmounts) {
  ScratchSite site("well-wiring");
  add_sensor(site, well_block("specific_yield_source = \"invented for the test\"\n"));
  site.write("well.csv", well_file({3.00, 2.90, 2.95, 2.80, 2.80}));
  const auto out = site.folder() / "w.h5";
  const auto run = run_site(site, out, "--to 2025-05-06");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_NE(run.out.find("Recharge from the water table"), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("with specific yield 0.1;"), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("Specific yield: invented for the test."), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("Intervals with an estimate: 4 of 5"), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("the water table gives 25.0 mm"), std::string::npos) << run.out;

  std::ifstream csv(site.folder() / "w-visits.csv");
  std::string header;
  std::getline(csv, header);
  const auto names = csv_fields(header);
  const auto column = std::find(names.begin(), names.end(), "water table W1 [mm]");
  ASSERT_NE(column, names.end()) << header;
  const std::size_t index = static_cast<std::size_t>(column - names.begin());
  ASSERT_LT(index + 1, names.size());
  EXPECT_EQ(names[index + 1], "model and water table");
  const std::vector<std::string> expected = {"", "10.0", "0.0", "15.0", "0.0"};
  for (std::size_t row = 0; row < expected.size(); ++row) {
    std::string line;
    ASSERT_TRUE(std::getline(csv, line));
    const auto fields = csv_fields(line);
    EXPECT_EQ(fields.at(index), expected[row]) << line;
    if (row == 0) {
      EXPECT_EQ(fields.at(index + 1), "no estimate") << line;
    }
  }

  const profiles::RunRecord record = profiles::read_run(out);
  ASSERT_TRUE(record.water_table_estimate.has_value());
  const auto& w = *record.water_table_estimate;
  EXPECT_EQ(w.well, "W1");
  EXPECT_EQ(w.specific_yield, 0.1);
  ASSERT_EQ(w.amount_cm.size(), record.visit_balance.size());
  EXPECT_TRUE(std::isnan(w.amount_cm[0]));
  EXPECT_NEAR(w.amount_cm[1], 1.0, 1e-12);
  EXPECT_EQ(w.amount_cm[2], 0.0);
  EXPECT_NEAR(w.amount_cm[3], 1.5, 1e-12);
  EXPECT_NEAR(w.start_depth_cm[1], 300.0, 1e-12);
  EXPECT_NEAR(w.end_depth_cm[1], 290.0, 1e-12);

  const auto show = run_program(
      fmt::format("show '{}' --sensors-csv '{}'", out.string(), (site.folder() / "again-sensors.csv").string()),
      site.folder());
  ASSERT_EQ(show.exit_code, 0) << show.err;
  // The fit metrics written by show from the run file are those run wrote.
  EXPECT_EQ(site.read("again-sensors.csv"), site.read("w-sensors.csv"));
  EXPECT_NE(site.read("w-sensors.csv").find("all tensiometers,,pressure head,cm,"), std::string::npos);
  const auto section = [](const std::string& text) {
    const auto from = text.find("Sensors against the model");
    return text.substr(from, text.find("Solver:") - from);
  };
  EXPECT_EQ(section(show.out), section(run.out));
}

// With an antecedent recession of 0.5 cm/d the table would have fallen 3.5 cm in a week: a
// measured fall of 2 cm is a 1.5 cm rise against it, 0.15 cm (1.5 mm) of recharge (Healy &
// Cook 2002, the rise measured from the extrapolated recession).
TEST(WaterTableEstimate, RecessionRateCountsARiseAgainstTheFall) {
  ScratchSite site("well-recession");
  add_sensor(site, well_block("recession_rate = \"0.5 cm/d\"\n"));
  site.write("well.csv", well_file({3.00, 3.02}));
  const auto [season, record] = simulate_until(site, "2025-04-16");
  const auto check = check_water_table(season, season.sensor_readings, record);
  ASSERT_TRUE(check.has_value());
  ASSERT_GE(check->intervals.size(), 2u);
  ASSERT_TRUE(check->intervals[1].estimate_cm.has_value());
  EXPECT_NEAR(*check->intervals[1].estimate_cm, 0.15, 1e-12);
}

// A single well reading (8 April): the interval before it lacks its start, the one after it
// its end, and the next one both ends; each says which.
TEST(WaterTableEstimate, MissingReadingsNameTheVisitsWithout) {
  ScratchSite site("well-missing");
  add_sensor(site, well_block());
  site.write("well.csv", well_file({3.00}));
  const auto [season, record] = simulate_until(site, "2025-04-23");
  const auto check = check_water_table(season, season.sensor_readings, record);
  ASSERT_TRUE(check.has_value());
  ASSERT_GE(check->intervals.size(), 3u);
  EXPECT_EQ(check->intervals[0].missing, "no reading of well W1 within 1 d of the start visit");
  EXPECT_EQ(check->intervals[1].missing, "no reading of well W1 within 1 d of the end visit");
  EXPECT_EQ(check->intervals[2].missing, "no reading of well W1 within 1 d of either visit");
  EXPECT_FALSE(check->intervals[2].start_depth_cm.has_value());
  ASSERT_TRUE(check->intervals[1].start_depth_cm.has_value());
  EXPECT_NEAR(*check->intervals[1].start_depth_cm, 300.0, 1e-12);
}

// The visit rows add up to the season in every balance term (water input, evaporation, runoff,
// infiltration, transpiration, bottom and plane fluxes, ponded, stored and error changes), and
// the water-table total of the report is the sum of its intervals.
TEST(WaterTableEstimate, PerVisitRowsSumToTheSeasonTotals) {
  ScratchSite site("well-sums");
  add_sensor(site, well_block());
  site.write("well.csv", well_file({3.00, 2.90, 2.95, 2.80, 2.78}));
  const auto out = site.folder() / "w.h5";
  const auto run = run_site(site, out, "--to 2025-05-20");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const profiles::RunRecord record = profiles::read_run(out);
  const auto total = profiles::season_total(record.run.balances);
  // Every term of the interval balance, summed over the visit rows.
  profiles::IntervalBalance sum;
  sum.plane_flux_cm.assign(total.plane_flux_cm.size(), 0.0);
  for (const auto& b : record.visit_balance) {
    sum.water_input_cm += b.water_input_cm;
    sum.potential_evaporation_cm += b.potential_evaporation_cm;
    sum.actual_evaporation_cm += b.actual_evaporation_cm;
    sum.runoff_cm += b.runoff_cm;
    sum.infiltration_cm += b.infiltration_cm;
    sum.transpiration_cm += b.transpiration_cm;
    sum.bottom_flux_cm += b.bottom_flux_cm;
    ASSERT_EQ(b.plane_flux_cm.size(), sum.plane_flux_cm.size());
    for (std::size_t k = 0; k < b.plane_flux_cm.size(); ++k) sum.plane_flux_cm[k] += b.plane_flux_cm[k];
    sum.ponded_change_cm += b.ponded_change_cm;
    sum.storage_change_cm += b.storage_change_cm;
    sum.balance_error_change_cm += b.balance_error_change_cm;
  }
  // Telescoping differences of the same cumulative numbers: equal up to the rounding of the
  // additions (a few units in the last place; common practice for floating-point sums).
  const double tolerance = 1e-13 * (std::abs(total.water_input_cm) + std::abs(total.potential_evaporation_cm) + 1.0);
  EXPECT_NEAR(sum.water_input_cm, total.water_input_cm, tolerance);
  EXPECT_NEAR(sum.potential_evaporation_cm, total.potential_evaporation_cm, tolerance);
  EXPECT_NEAR(sum.actual_evaporation_cm, total.actual_evaporation_cm, tolerance);
  EXPECT_NEAR(sum.runoff_cm, total.runoff_cm, tolerance);
  EXPECT_NEAR(sum.infiltration_cm, total.infiltration_cm, tolerance);
  EXPECT_NEAR(sum.transpiration_cm, total.transpiration_cm, tolerance);
  EXPECT_NEAR(sum.bottom_flux_cm, total.bottom_flux_cm, tolerance);
  for (std::size_t k = 0; k < total.plane_flux_cm.size(); ++k)
    EXPECT_NEAR(sum.plane_flux_cm[k], total.plane_flux_cm[k], tolerance);
  EXPECT_NEAR(sum.ponded_change_cm, total.ponded_change_cm, tolerance);
  EXPECT_NEAR(sum.storage_change_cm, total.storage_change_cm, tolerance);
  EXPECT_NEAR(sum.balance_error_change_cm, total.balance_error_change_cm, tolerance);
  ASSERT_TRUE(record.water_table_estimate.has_value());
  double estimate = 0, model = 0;
  for (std::size_t i = 0; i < record.visit_balance.size(); ++i) {
    if (std::isnan(record.water_table_estimate->amount_cm[i])) continue;
    estimate += record.water_table_estimate->amount_cm[i];
    model += record.visit_balance[i].plane_flux_cm.front();
  }
  EXPECT_NE(run.out.find(fmt::format("over them the model drained {:.1f} mm, the water table gives {:.1f} mm",
                                     model * 10, estimate * 10)),
            std::string::npos)
      << run.out;
}

// Cores at 20 and 50 cm on two visits, one of them given by oven-dried masses:
// theta = (wet - dry) / V = (165.0 - 135.0) g / 100 cm3 = 0.30 (soils::core_properties).
TEST(CoreSamples, EnterTheComparisonPerDepthAndPooledWithTheProbes) {
  ScratchSite site("cores");
  add_sensor(site, "[[sensors]]\nname = \"C\"\nkind = \"core samples\"\nreadings = \"cores.csv\"\n");
  site.write("cores.csv",
             "# invented cores for a test\n"
             "time,depth [cm],wet mass [g],dry mass [g],ring volume [cm3]\n"
             "2025-04-08T10:00,20,165.0,135.0,100\n"
             "2025-04-08T10:00,50,170.0,140.0,100\n"
             "2025-04-15T10:00,20,160.0,135.0,100\n"
             "2025-04-15T10:00,50,168.0,140.0,100\n");
  const auto out = site.folder() / "c.h5";
  const auto run = run_site(site, out, "--to 2025-04-20");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_NE(line_with(run.out, "  C at 20 cm ").find(" 2 "), std::string::npos) << run.out;
  EXPECT_NE(line_with(run.out, "  C at 50 cm ").find(" 2 "), std::string::npos) << run.out;
  EXPECT_FALSE(line_with(run.out, "  all probes and cores ").empty()) << run.out;
  const profiles::RunRecord record = profiles::read_run(out);
  ASSERT_TRUE(record.sensor_comparison.has_value());
  bool found = false;
  for (const auto& r : record.sensor_comparison->water_content) {
    if (r.sensor != "C at 20 cm" || std::abs(r.time_days - (7.0 + 10.0 / 24.0)) > 1e-9) continue;
    EXPECT_NEAR(r.observed, 0.30, 1e-12);
    EXPECT_EQ(r.depth_cm, 20.0);
    found = true;
  }
  EXPECT_TRUE(found);
  std::ifstream metrics(site.folder() / "c-sensors.csv");
  std::string header, text((std::istreambuf_iterator<char>(metrics)), std::istreambuf_iterator<char>());
  EXPECT_NE(text.find("C at 50 cm,50,water content,cm3/cm3,2,0,0,"), std::string::npos) << text;
}

// Probes at 20 and 50 cm, the 50 cm probe missing its reading at the second visit: the core
// taken there at 50 cm stands in. By hand: (0.30 + 0.20) / 2 x 30 cm = 7.5 cm.
TEST(CoreSamples, StandInForAMissingProbeReadingInTheStoredWater) {
  ScratchSite site("cores-storage");
  add_cores_beside_probes(site);
  site.write("cores.csv", "time,depth [cm],water content [%]\n2025-04-15T10:00,50,20\n");
  const auto [season, record] = simulate_until(site, "2025-04-20");
  const StorageCheck check = check_storage(season.sensor_readings, record);
  ASSERT_EQ(check.depths_cm, (std::vector<double>{20, 50}));
  EXPECT_EQ(check.probe_names.back(), "C");
  ASSERT_GE(check.visits.size(), 3u);
  ASSERT_TRUE(check.visits[1].observed_cm.has_value());
  EXPECT_NEAR(*check.visits[1].observed_cm, (0.30 + 0.22) / 2 * 30, 1e-12);
  ASSERT_TRUE(check.visits[2].observed_cm.has_value());
  EXPECT_NEAR(*check.visits[2].observed_cm, 7.5, 1e-12);
}

// A core depth in metres converted to cm carries binary rounding (0.55 x 100 =
// 55.00000000000001); read as 55 cm it stands in for the probe at 55 cm. By hand: (0.30 + 0.20)
// / 2 x 35 cm = 8.75 cm between 20 and 55 cm.
TEST(CoreSamples, DepthInMetresMatchesAProbeDepthInCentimetres) {
  ScratchSite site("cores-metres");
  add_cores_beside_probes(site);
  site.replace("site.toml", "name = \"P50\"\nkind = \"water content probe\"\ndepth = \"50 cm\"",
               "name = \"P50\"\nkind = \"water content probe\"\ndepth = \"55 cm\"");
  site.write("cores.csv", "time,depth [m],water content [%]\n2025-04-15T10:00,0.55,20\n");
  const auto [season, record] = simulate_until(site, "2025-04-20");
  const SensorRecord* cores = nullptr;
  for (const auto& r : season.sensor_readings) {
    if (r.name == "C") cores = &r;
  }
  ASSERT_NE(cores, nullptr);
  ASSERT_EQ(cores->series.observations.size(), 1u);
  EXPECT_EQ(cores->series.observations[0].depth_cm, 55.0);
  const StorageCheck check = check_storage(season.sensor_readings, record);
  ASSERT_EQ(check.depths_cm.size(), 2u);
  EXPECT_EQ(check.depths_cm[0], 20.0);
  EXPECT_NEAR(check.depths_cm[1], 55.0, kCoreDepthStepCm);
  EXPECT_EQ(check.probe_names.back(), "C");
  ASSERT_GE(check.visits.size(), 3u);
  ASSERT_TRUE(check.visits[2].observed_cm.has_value());
  EXPECT_NEAR(*check.visits[2].observed_cm, 8.75, 1e-9);
  // One series for the core depth, named with the depth as read.
  const SensorCheck sensors = check_sensors(season, season.sensor_readings, record);
  const bool named =
      std::any_of(sensors.sensors.begin(), sensors.sensors.end(), [](const auto& r) { return r.name == "C at 55 cm"; });
  EXPECT_TRUE(named);
}

struct BadCase {
  const char* label;
  const char* file;  // the file written
  const char* text;
  const char* sensor;    // the [[sensors]] block
  const char* expected;  // part of the message: file:line and what was expected
};

class BadWellOrCoreFile : public ::testing::TestWithParam<BadCase> {};

TEST_P(BadWellOrCoreFile, NamesFileAndLineAndExitsWithOne) {
  const BadCase& c = GetParam();
  ScratchSite site(std::string("bad-") + c.label);
  add_sensor(site, c.sensor);
  site.write(c.file, c.text);
  const auto out = site.folder() / "bad.h5";
  const auto run = run_site(site, out);
  EXPECT_EQ(run.exit_code, 1) << run.out;
  EXPECT_NE(run.err.find(c.expected), std::string::npos) << run.err;
  EXPECT_FALSE(std::filesystem::exists(out));
  EXPECT_FALSE(std::filesystem::exists(site.folder() / "bad-visits.csv"));
}

const char* const kWell =
    "[[sensors]]\nname = \"W1\"\nkind = \"observation well\"\nreadings = \"well.csv\"\nspecific_yield = 0.1\n";
const char* const kCores = "[[sensors]]\nname = \"C\"\nkind = \"core samples\"\nreadings = \"cores.csv\"\n";

INSTANTIATE_TEST_SUITE_P(
    Cases, BadWellOrCoreFile,
    ::testing::Values(
        BadCase{"well-no-unit", "well.csv", "time,depth to water\n2025-04-08,3.0\n", kWell,
                "well.csv:1: column 'depth to water': the column needs a unit in the header, one of mm, cm or m"},
        BadCase{"well-not-number", "well.csv", "time,depth to water [m]\n2025-04-08,3.0\n2025-04-15,deep\n", kWell,
                "well.csv:3: column 'depth to water': expected a number, got 'deep'"},
        BadCase{"well-times-back", "well.csv", "time,depth to water [m]\n2025-04-15,3.0\n2025-04-08,3.1\n", kWell,
                "well.csv:3: column 'time': times must increase down the file"},
        BadCase{"core-dry-above-wet", "cores.csv",
                "time,depth [cm],wet mass [g],dry mass [g],ring volume "
                "[cm3]\n2025-04-08,20,150,135,100\n2025-04-08,50,130,140,100\n",
                kCores, "cores.csv:3: column 'wet mass': the masses and volume give no water content"},
        BadCase{"core-no-route", "cores.csv", "time,depth [cm],tension [kPa]\n2025-04-08,20,10\n", kCores,
                "cores.csv:1: a core-samples file needs either a 'water content' column or the columns 'wet mass'"},
        BadCase{"core-depth-zero", "cores.csv", "time,depth [cm],water content [%]\n2025-04-08,0,20\n", kCores,
                "cores.csv:2: column 'depth': a core depth below the surface is greater than zero"},
        BadCase{"core-below-column", "cores.csv",
                "time,depth [cm],water content [%]\n2025-04-08,20,20\n2025-04-08,300,20\n", kCores,
                "cores.csv:3: column 'depth': a core depth must lie within the soil column (0 to 250 cm), got 300 cm"},
        BadCase{"core-ring-zero", "cores.csv",
                "time,depth [cm],wet mass [g],dry mass [g],ring volume [cm3]\n2025-04-08,20,165,135,0\n", kCores,
                "cores.csv:2: column 'ring volume': a ring volume is greater than zero, got 0 cm3"},
        BadCase{"core-tare-above-dry", "cores.csv",
                "time,depth [cm],wet mass [g],dry mass [g],ring volume [cm3],tare mass "
                "[g]\n2025-04-08,20,165,135,100,140\n",
                kCores, "cores.csv:2: column 'dry mass': the dry mass (135 g) must exceed the tare mass (140 g)"},
        BadCase{"core-mass-unit", "cores.csv",
                "time,depth [cm],wet mass [lb],dry mass [g],ring volume [cm3]\n2025-04-08,20,150,135,100\n", kCores,
                "cores.csv:1: column 'wet mass': the column needs a unit in the header, one of g or kg"}),
    [](const auto& test) {
      std::string name = test.param.label;
      for (char& ch : name) {
        if (ch == '-') ch = '_';
      }
      return name;
    });

TEST(WellSiteKeys, DepthAndMissingSpecificYieldAreErrorsWithTheLine) {
  ScratchSite site("well-keys");
  add_sensor(site,
             "[[sensors]]\nname = \"W1\"\nkind = \"observation well\"\ndepth = \"300 cm\"\nreadings = \"well.csv\"\n"
             "specific_yield = 0.1\n");
  site.write("well.csv", well_file({3.0}));
  const std::string message = input_error_message([&] { (void)load_site_file(site.site_file()); });
  const std::string text = site.read("site.toml");
  const auto line =
      1 + std::count(text.begin(), text.begin() + static_cast<long>(text.find("depth = \"300 cm\"\nreadings")), '\n');
  EXPECT_NE(message.find(fmt::format("site.toml:{}: key 'sensors[8].depth'", line)), std::string::npos) << message;
  EXPECT_NE(message.find("its readings give the depth to water"), std::string::npos) << message;
  ScratchSite second("well-keys-yield");
  add_sensor(
      second,
      "[[sensors]]\nname = \"W1\"\nkind = \"observation well\"\nreadings = \"well.csv\"\nspecific_yield = 1.2\n");
  second.write("well.csv", well_file({3.0}));
  const std::string message_12 = input_error_message([&] { (void)load_site_file(second.site_file()); });
  EXPECT_NE(message_12.find("1.2 is not a fraction between 0 and 1"), std::string::npos) << message_12;
}

}  // namespace
}  // namespace wetfront::site
