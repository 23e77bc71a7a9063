// Stored water over the probe depths in `wetfront run`: the trapezoid of the probe readings
// and of the model at the same depths and times, per visit and per visit interval, and the note
// when the site has probes at fewer than two depths.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <fstream>

#include <fmt/format.h>

#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/sensor_check.hpp"
#include "wetfront/site/site_file.hpp"
#include "site_test_helpers.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {
namespace {

using testing::at_depth;
using testing::run_program;
using testing::ScratchSite;

// The weekly visit dates of the demo up to the end of May.
const std::vector<std::string> kVisitDates = {"2025-04-08", "2025-04-15", "2025-04-22", "2025-04-29",
                                              "2025-05-06", "2025-05-13", "2025-05-20", "2025-05-27"};

std::string probe_file(const std::vector<double>& water_content, int skip = -1) {
  std::string text = "time,water content [cm3/cm3]\n";
  for (std::size_t k = 0; k < kVisitDates.size(); ++k) {
    if (static_cast<int>(k) == skip) continue;
    text += fmt::format("{}T09:00,{}\n", kVisitDates[k], water_content[k]);
  }
  return text;
}

// Probes at 20, 50 and 80 cm reading 0.30, 0.20 + 0.01 k and 0.10 at visit k. By hand:
// S = (0.30 + theta50) / 2 * 30 + (theta50 + 0.10) / 2 * 30 = 6 + 30 theta50 cm,
// so 12.0 cm (120 mm) at the first visit and 0.3 cm (3 mm) more at each next one.
TEST(StoredWater, TrapezoidOverThreeProbesByHand) {
  ScratchSite site("storage-hand");
  std::vector<double> p20(8, 0.30), p50, p80(8, 0.10);
  for (int k = 0; k < 8; ++k) p50.push_back(0.20 + 0.01 * k);
  site.write("probe-20cm.csv", probe_file(p20));
  site.write("probe-50cm.csv", probe_file(p50, 4));  // no reading at the fifth visit (2025-05-06)
  site.write("probe-80cm.csv", probe_file(p80));
  const auto [season, record] = simulate_until(site, "2025-05-28");
  const solver::ColumnRun& run = record.run;
  ASSERT_TRUE(run.complete);
  const StorageCheck check = check_storage(season.sensor_readings, record);
  ASSERT_EQ(check.depths_cm, (std::vector<double>{20, 50, 80}));
  ASSERT_EQ(check.visits.size(), record.visit_balance.size() + 1);
  ASSERT_EQ(check.visits.size(), 10u);                    // run start, eight visits, run end
  EXPECT_FALSE(check.visits[0].observed_cm.has_value());  // no reading within 1 d of the run start
  for (int k = 0; k < 8; ++k) {
    const auto& v = check.visits[k + 1];
    if (k == 4) {
      EXPECT_FALSE(v.observed_cm.has_value());
      EXPECT_FALSE(v.simulated_cm.has_value());
      continue;
    }
    ASSERT_TRUE(v.observed_cm.has_value()) << k;
    EXPECT_NEAR(*v.observed_cm, 12.0 + 0.3 * k, 1e-12) << k;
    // The model's trapezoid, by hand from its profile at the reading time (09:00 on the visit day).
    const double day = 7.0 * (k + 1) + 9.0 / 24.0;
    const auto snapshot = std::find_if(run.profiles.begin(), run.profiles.end(),
                                       [&](const auto& p) { return std::abs(p.time_days - day) < 1e-6; });
    ASSERT_NE(snapshot, run.profiles.end()) << k;
    const double s20 = at_depth(run.cell_depths_cm, snapshot->water_content, 20);
    const double s50 = at_depth(run.cell_depths_cm, snapshot->water_content, 50);
    const double s80 = at_depth(run.cell_depths_cm, snapshot->water_content, 80);
    ASSERT_TRUE(v.simulated_cm.has_value()) << k;
    EXPECT_NEAR(*v.simulated_cm, (s20 + s50) / 2 * 30 + (s50 + s80) / 2 * 30, 1e-9) << k;
  }
  // Changes per interval: 3 mm between consecutive visits; none next to the missing reading.
  ASSERT_EQ(check.intervals.size(), 9u);
  EXPECT_FALSE(check.intervals[0].observed_change_cm.has_value());
  EXPECT_NEAR(*check.intervals[1].observed_change_cm, 0.3, 1e-12);
  EXPECT_FALSE(check.intervals[4].observed_change_cm.has_value());
  EXPECT_FALSE(check.intervals[5].observed_change_cm.has_value());
  EXPECT_NEAR(*check.intervals[6].observed_change_cm, 0.3, 1e-12);
  ASSERT_TRUE(check.intervals[1].simulated_change_cm.has_value());
  EXPECT_NEAR(*check.intervals[1].simulated_change_cm, *check.visits[2].simulated_cm - *check.visits[1].simulated_cm,
              1e-12);
  // The run end (midnight after the last visit) takes the last reading, 0.625 d before it.
  EXPECT_NEAR(*check.intervals[8].observed_change_cm, 0.0, 1e-12);

  const auto printed = run_site(site, site.folder() / "s.h5", "--to 2025-05-28");
  ASSERT_EQ(printed.exit_code, 0) << printed.err;
  EXPECT_NE(printed.out.find("Visits (with the run start and end) with a reading at every depth: 8 of 10."),
            std::string::npos)
      << printed.out;
  std::ifstream csv(site.folder() / "s-visits.csv");
  std::string line;
  for (int row = 0; row <= 2; ++row) std::getline(csv, line);  // header, first and second interval
  // The last two fields: observed change 04-08 to 04-15 in mm, then the simulated one.
  line.erase(line.rfind(','));  // the last column is the run id
  const std::string observed = line.substr(0, line.rfind(','));
  EXPECT_EQ(observed.substr(observed.rfind(',') + 1), "3.0") << line;
}

TEST(StoredWater, FewerThanTwoProbeDepthsGiveANote) {
  ScratchSite site("storage-one-depth");
  testing::keep_tensiometers_and_probes(site);  // cores at several depths would give a storage
  // All three probes at 20 cm: one depth, no layer to integrate over.
  site.replace("site.toml", "depth = \"50 cm\"\nreadings = \"probe-50cm.csv\"",
               "depth = \"20 cm\"\nreadings = \"probe-50cm.csv\"");
  site.replace("site.toml", "depth = \"80 cm\"\nreadings = \"probe-80cm.csv\"",
               "depth = \"20 cm\"\nreadings = \"probe-80cm.csv\"");
  const auto run = run_site(site, site.folder() / "s.h5", "--to 2025-04-20");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_NE(
      run.out.find("Stored water over the probe depths\n  The comparison needs water-content probes at two or more "
                   "depths; this site has them at one depth only (20 cm)."),
      std::string::npos)
      << run.out;
  std::ifstream csv(site.folder() / "s-visits.csv");
  std::string header;
  std::getline(csv, header);
  EXPECT_EQ(header.find("storage change 20"), std::string::npos) << header;
}

// Probes at one depth (20 cm) and cores at one other (50 cm): neither gives two depths, so run
// reports the probe depth alone; show, from the run file, must say the same (it takes the
// depths by the same rule, not from every water-content row).
TEST(StoredWater, RunAndShowTakeTheDepthsByOneRule) {
  ScratchSite site("storage-rule");
  testing::keep_tensiometers_and_probes(site);
  site.replace("site.toml", "depth = \"50 cm\"\nreadings = \"probe-50cm.csv\"",
               "depth = \"20 cm\"\nreadings = \"probe-50cm.csv\"");
  site.replace("site.toml", "depth = \"80 cm\"\nreadings = \"probe-80cm.csv\"",
               "depth = \"20 cm\"\nreadings = \"probe-80cm.csv\"");
  site.replace("site.toml", "[recharge]",
               "[[sensors]]\nname = \"C\"\nkind = \"core samples\"\nreadings = \"cores.csv\"\n\n[recharge]");
  site.write("cores.csv", "time,depth [cm],water content [%]\n2025-04-08T10:00,50,25\n2025-04-15T10:00,50,24\n");
  const auto out = site.folder() / "s.h5";
  const auto run = run_site(site, out, "--to 2025-04-20");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const std::string note = "this site has them at one depth only (20 cm).";
  EXPECT_NE(run.out.find(note), std::string::npos) << run.out;
  const auto show = run_program(fmt::format("show '{}'", out.string()), site.folder());
  ASSERT_EQ(show.exit_code, 0) << show.err;
  EXPECT_NE(show.out.find(note), std::string::npos) << show.out;
}

// Probes at 20 and 50 cm and cores at 20 and 110 cm: the depths are the probes'; the cores are
// a source because of their 20 cm samples. A core-samples entry with samples only at depths
// between the probes is not a source.
TEST(StoredWater, SourcesAreTheSensorsAtTheStorageDepths) {
  StorageCheck check;
  choose_storage_depths({{"P20", false, 20}, {"P50", false, 50}, {"A", true, 20}, {"A", true, 110}, {"B", true, 35}},
                        check);
  EXPECT_EQ(check.depths_cm, (std::vector<double>{20, 50}));
  EXPECT_EQ(check.probe_names, (std::vector<std::string>{"P20", "P50", "A"}));
  // One probe depth: the two core depths are used, and the probe at neither is no source.
  choose_storage_depths({{"P35", false, 35}, {"A", true, 20}, {"A", true, 110}}, check);
  EXPECT_EQ(check.depths_cm, (std::vector<double>{20, 110}));
  EXPECT_EQ(check.probe_names, (std::vector<std::string>{"A"}));
}

TEST(StoredWater, NoProbesGiveANote) {
  ScratchSite site("storage-none");
  testing::keep_tensiometers_and_probes(site);
  for (const std::string depth : {"20", "50", "80"}) {
    site.replace("site.toml",
                 fmt::format("[[sensors]]\nname = \"P{0}\"\nkind = \"water content probe\"\ndepth = \"{0} cm\"\n"
                             "readings = \"probe-{0}cm.csv\"\n",
                             depth),
                 "");
  }
  const auto run = run_site(site, site.folder() / "s.h5", "--to 2025-04-20");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_NE(run.out.find("needs water-content probes at two or more depths; this site has none."), std::string::npos)
      << run.out;
}

}  // namespace
}  // namespace wetfront::site
