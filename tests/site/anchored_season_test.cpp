// The anchored season (site/anchored_season.hpp) on scratch copies of the demo with a coarser
// grid and a short season: water balance per member, independence of the thread count, a site
// without readings, members whose soils differ, and the head update that keeps members physical.
#include <gtest/gtest.h>

#include <cmath>
#include <filesystem>
#include <string>

#include <fmt/format.h>

#include "member_state.hpp"
#include "site_test_helpers.hpp"
#include "wetfront/site/anchored_season.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {
namespace {

using testing::ScratchSite;

const std::string kEnd = "2025-05-13";  // six visit intervals, five visits with readings

AnchoredSeason anchored(const ScratchSite& site, const AnchorSettings& settings) {
  const SiteSetup setup = load_site_file(site.site_file(), {"", kEnd});
  return run_anchored_season(setup, load_parameter_study(setup), settings, "test");
}

TEST(AnchoredSeason, EveryMemberBalanceClosesWithTheUpdateAsItsOwnTerm) {
  ScratchSite site("anchored-balance");
  const AnchoredSeason season = anchored(site, {.members = 6, .seed = 3, .threads = 2});
  ASSERT_EQ(season.visits.size(), 5u);  // 2025-04-08 ... 2025-05-06 inside the run
  ASSERT_EQ(season.interval_end_days.size(), 6u);
  double largest_update = 0;
  for (std::size_t j = 0; j < season.members.size(); ++j) {
    ASSERT_TRUE(season.member_complete[j]) << season.member_failures[j];
    const auto& intervals = season.members[j];
    EXPECT_EQ(intervals.front().update_cm, 0.0);  // no visit at the run start
    for (std::size_t i = 0; i < intervals.size(); ++i) {
      const MemberInterval& m = intervals[i];
      // Storage change = net inflow + update, to round-off (the solver's balance is exact by
      // construction, DEVELOPERS.md); the update is the only other term.
      EXPECT_LT(std::abs(m.storage_end_cm - m.storage_start_cm - m.net_inflow_cm - m.update_cm), 1e-9)
          << "member " << j << " interval " << i;
      EXPECT_EQ(m.balance_error_cm, m.storage_end_cm - m.storage_start_cm - m.net_inflow_cm - m.update_cm);
      // No water appears between intervals: each starts (before its update) where the last ended.
      if (i > 0) {
        EXPECT_EQ(m.storage_start_cm, intervals[i - 1].storage_end_cm);
      }
      largest_update = std::max(largest_update, std::abs(m.update_cm));
    }
    // The stored water each visit's update added is the update term of the interval after it.
    for (std::size_t v = 0; v < season.visits.size(); ++v)
      EXPECT_EQ(season.visits[v].stored_water_increment_cm[j], intervals[v + 1].update_cm);
  }
  EXPECT_GT(largest_update, 0.01);  // the readings did move the members
  // ... towards the readings: the analysed members' mean lies nearer most readings than the
  // forecast mean did, or within the reading's uncertainty (the perturbed readings of six
  // members have a mean off by about 0.4 sd, and the update is linear where the model is not).
  std::size_t readings = 0, nearer = 0;
  for (const auto& visit : season.visits) {
    for (const auto& r : visit.readings) {
      ++readings;
      if (std::abs(r.analysis_mean - r.value) < std::max(std::abs(r.forecast_mean - r.value), r.uncertainty)) ++nearer;
    }
  }
  EXPECT_GE(4 * nearer, 3 * readings) << nearer << " of " << readings;
}

TEST(AnchoredSeason, OneAndTwoThreadsGiveIdenticalMembers) {
  ScratchSite site("anchored-threads");
  const AnchoredSeason one = anchored(site, {.members = 4, .seed = 9, .threads = 1});
  const AnchoredSeason two = anchored(site, {.members = 4, .seed = 9, .threads = 2});
  ASSERT_EQ(one.members.size(), two.members.size());
  for (std::size_t j = 0; j < one.members.size(); ++j) {
    for (std::size_t i = 0; i < one.members[j].size(); ++i) {
      EXPECT_EQ(one.members[j][i].drainage_cm, two.members[j][i].drainage_cm);
      EXPECT_EQ(one.members[j][i].update_cm, two.members[j][i].update_cm);
    }
  }
  ASSERT_EQ(one.visits.size(), two.visits.size());
  for (std::size_t v = 0; v < one.visits.size(); ++v)
    for (std::size_t r = 0; r < one.visits[v].readings.size(); ++r)
      EXPECT_EQ(one.visits[v].readings[r].analysis_mean, two.visits[v].readings[r].analysis_mean);
}

TEST(AnchoredSeason, WithoutReadingsEveryMemberRunsFreely) {
  ScratchSite site("anchored-no-readings");
  std::string text = site.read("site.toml");  // every [[sensors]] entry goes
  const auto from = text.find("[[sensors]]");
  const auto to = text.find("[recharge]");
  ASSERT_TRUE(from != std::string::npos && to != std::string::npos && from < to);
  site.write("site.toml", text.erase(from, to - from));
  const AnchorSettings settings{.members = 3, .seed = 4, .threads = 2};
  const AnchoredSeason season = anchored(site, settings);
  EXPECT_TRUE(season.visits.empty());
  EXPECT_TRUE(season.warnings.empty());
  // Each member is the run of its own values from start to end, as a free run gives it.
  const SiteSetup setup = load_site_file(site.site_file(), {"", kEnd});
  const ParameterStudy study = load_parameter_study(setup);
  const FieldRecords records = read_field_records(setup);
  for (std::size_t j = 0; j < season.members.size(); ++j) {
    ASSERT_TRUE(season.member_complete[j]);
    EXPECT_EQ(season.final_parameters[j], season.drawn_parameters[j]);
    const Season free = build_season(with_parameters(setup, study, season.drawn_parameters[j]), records);
    const profiles::RunRecord record = make_record(free, solver::simulate(free.problem), "test");
    ASSERT_EQ(record.visit_balance.size(), season.members[j].size());
    for (std::size_t i = 0; i < record.visit_balance.size(); ++i) {
      EXPECT_EQ(season.members[j][i].update_cm, 0.0);
      // Output times do not change the integrator's steps (DEVELOPERS.md), so only the rounding
      // of the differences separates the two.
      EXPECT_NEAR(season.members[j][i].drainage_cm, record.visit_balance[i].plane_flux_cm.at(0), 1e-9);
    }
  }
}

// The demo's readings are a twin: made by the model with the loam's Ks 12 cm/d and n 1.4
// (examples/demo/make_demo_data.py) plus noise. Members that share Ks 12 cm/d and differ in n
// (1.25 to 1.8) hold different water contents at the same heads. Updating their water contents
// (as the filter once did) left the members with n above 1.4 far wetter in head than the
// readings; they drained the added water before the next visit and were given it again there:
// 34 mm drained to 3 June where the truth drains 8 mm. With heads as the update variable the
// anchored mean stays near the truth, with or without parameter updates.
TEST(AnchoredSeason, UpdatesDoNotPumpWaterThroughMembersWhoseSoilsHoldItDifferently) {
  ScratchSite site("anchored-retention");
  site.replace("site.toml", "saturated_conductivity = \"20 cm/d\"", "saturated_conductivity = \"12 cm/d\"");
  site.replace("site.toml", "range = [\"5 cm/d\", \"80 cm/d\"]", "range = [\"11.9 cm/d\", \"12.1 cm/d\"]");
  const std::string end = "2025-06-03";
  const SiteSetup setup = load_site_file(site.site_file(), {"", end});
  const ParameterStudy study = load_parameter_study(setup);
  const FieldRecords records = read_field_records(setup);
  const Season truth = build_season(with_parameters(setup, study, {12.0, 1.4}), records);
  const profiles::RunRecord record = make_record(truth, solver::simulate(truth.problem), "test");
  double true_drainage_cm = 0;
  for (const auto& interval : record.visit_balance) true_drainage_cm += interval.plane_flux_cm.at(0);
  ASSERT_GT(true_drainage_cm, 0.5);

  for (const bool update_parameters : {false, true}) {
    const AnchorSettings settings{.members = 16, .seed = 1, .update_parameters = update_parameters, .threads = 2};
    const AnchoredSeason season = run_anchored_season(setup, study, settings, "test");
    double drainage_cm = 0, update_cm = 0, soil_change_cm = 0;
    for (std::size_t i = 0; i < season.interval_end_days.size(); ++i) {
      drainage_cm += drainage_band(season, i).mean;
      update_cm += update_band(season, i).mean;
      soil_change_cm += soil_change_band(season, i).mean;
    }
    EXPECT_NEAR(drainage_cm, true_drainage_cm, 0.25 * true_drainage_cm) << "update parameters: " << update_parameters;
    // With parameter updates nearly all of the update term is the new soils holding other water
    // at the same heads; what the soil water itself gained stays small.
    if (update_parameters) {
      EXPECT_GT(std::abs(soil_change_cm), true_drainage_cm);
      EXPECT_LT(std::abs(update_cm - soil_change_cm), 0.25 * true_drainage_cm);
    } else {
      EXPECT_EQ(soil_change_cm, 0.0);
    }
  }
}

TEST(AnchoredSeason, RefusesASiteWithoutAdjustableParameters) {
  ScratchSite site("anchored-no-study");
  std::string text = site.read("site.toml");
  site.write("site.toml", text.erase(text.find("\n[[adjustable]]")));
  const SiteSetup setup = load_site_file(site.site_file(), {"", kEnd});
  try {
    run_anchored_season(setup, load_parameter_study(setup), {.members = 2}, "test");
    FAIL() << "expected an input error";
  } catch (const base::InputError& error) {
    EXPECT_NE(std::string(error.what()).find("[[adjustable]]"), std::string::npos) << error.what();
  }
}

TEST(AnchorCommand, WritesItsThreeFilesAndNeverReplacesAForeignOne) {
  ScratchSite site("anchor-command");
  const std::string command =
      fmt::format("anchor '{}' --members 3 --threads 2 --to {}", site.site_file().string(), kEnd);
  const auto run = testing::run_program(command, site.folder());
  ASSERT_EQ(run.exit_code, 0) << run.out << run.err;
  EXPECT_NE(run.out.find("updated: the soil water of every cell; the parameters keep their drawn values"),
            std::string::npos);
  const std::string intervals = site.read("site-anchored-intervals.csv");
  EXPECT_EQ(intervals.rfind("from,to,free run [mm],anchored mean [mm],anchored 5 % [mm]", 0), 0u) << intervals;
  EXPECT_NE(site.read("site-anchored-visits.csv").find("run id"), std::string::npos);
  EXPECT_TRUE(std::filesystem::exists(site.folder() / "site-anchored.h5"));
  // Its own files it replaces; a file of someone else's it leaves alone, and writes nothing.
  EXPECT_EQ(testing::run_program(command + " --update-parameters", site.folder()).exit_code, 0);
  site.write("site-anchored-visits.csv", "my notes\n");
  const auto refused = testing::run_program(command, site.folder());
  EXPECT_EQ(refused.exit_code, 1) << refused.out << refused.err;
  EXPECT_EQ(site.read("site-anchored-visits.csv"), "my notes\n");
  // A calibration file that is not there is bad input naming it.
  const auto no_calibration = testing::run_program(command + " --force --calibration missing.h5", site.folder());
  EXPECT_EQ(no_calibration.exit_code, 1) << no_calibration.out << no_calibration.err;
  EXPECT_NE(no_calibration.err.find("missing.h5"), std::string::npos) << no_calibration.err;
}

// The head update of one member on a van Genuchten loam (theta_r 0.08, theta_s 0.42).
TEST(HeadsFromLogSuction, AnalysedValuesGiveFiniteHeadsWithWaterContentsInsideTheRange) {
  const soils::HydraulicModel loam = soils::VanGenuchtenMualem{.residual_water_content = 0.08,
                                                               .saturated_water_content = 0.42,
                                                               .alpha_per_cm = 0.03,
                                                               .n = 1.5,
                                                               .saturated_conductivity_cm_per_d = 20,
                                                               .pore_connectivity = 0.5};
  const soils::LayeredProfile soil({{"loam", 0, 100, loam}});
  const std::vector<double> depths{10, 30, 50, 70, 90, 95};
  const std::vector<double> heads{-100, -100, -100, 5, -100, -100};
  // Wetter than saturation, drier than the tables resolve, unchanged, saturated and left there,
  // ordinary (suction 100 cm -> 50 cm), and pushed to saturation from unsaturated.
  const std::vector<double> analysed{-0.5, 9.0, detail::log_suction(heads[2]), -0.2, std::log10(51.0), -0.1};
  const std::vector<double> result = detail::heads_from_log_suction(soil, depths, heads, analysed);
  for (double h : result) EXPECT_TRUE(std::isfinite(h));
  for (std::size_t i : {0u, 1u, 4u, 5u}) {
    const double theta = soils::water_content(loam, result[i]);
    EXPECT_GT(theta, 0.08) << i;
    EXPECT_LT(theta, 0.42) << i;
  }
  EXPECT_EQ(result[2], heads[2]);  // the update left this cell alone
  EXPECT_EQ(result[3], heads[3]);  // saturated below a water table: its head stays
  EXPECT_NEAR(result[4], -50.0, 1e-9);
  EXPECT_GE(result[1], detail::kDriestHeadCm);
  EXPECT_EQ(detail::log_suction(5.0), 0.0);
  EXPECT_NEAR(detail::log_suction(-99.0), 2.0, 1e-15);
}

}  // namespace
}  // namespace wetfront::site
