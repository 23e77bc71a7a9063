// `wetfront run` on the demo writes an HDF5 run file and a per-visit CSV; `wetfront show`
// reads the file back; `check` and `--help` work; a solver failure exits with code 2.
#include <gtest/gtest.h>

#include <cmath>
#include <fstream>

#include <fmt/format.h>

#include "site_test_helpers.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/visit_balance.hpp"

namespace wetfront::site {
namespace {

using testing::run_program;
using testing::ScratchSite;

std::size_t data_rows(const std::filesystem::path& csv) {
  std::ifstream in(csv);
  std::size_t rows = 0;
  for (std::string line; std::getline(in, line);) rows += line.empty() ? 0 : 1;
  return rows == 0 ? 0 : rows - 1;
}

TEST(RunAndShow, DemoRunWritesAFileThatShowReadsBack) {
  ScratchSite site("run");
  const auto out = site.folder() / "season.h5";
  const auto run = run_site(site, out);
  ASSERT_EQ(run.exit_code, 0) << run.err;
  ASSERT_TRUE(std::filesystem::exists(out));
  EXPECT_EQ(data_rows(site.folder() / "season-visits.csv"), 29u);  // 28 visits split the season in 29
  for (const std::string text :
       {"Season water balance", "Demo plot 7 (invented)", "positive downward", "drainage at 150 cm", "balance error",
        "Solver:", "Cautions", "preferential flow", "hysteresis", "freezing", "licensed professionals"}) {
    EXPECT_NE(run.out.find(text), std::string::npos) << text;
  }

  const profiles::RunRecord record = profiles::read_run(out);
  EXPECT_TRUE(record.run.complete);
  EXPECT_EQ(record.site_name, "Demo plot 7 (invented)");
  EXPECT_EQ(record.run_start_date, "2025-04-01");
  EXPECT_EQ(record.visit_days.size(), 28u);
  EXPECT_EQ(record.visit_balance.size(), 29u);
  EXPECT_EQ(record.sensors.size(), 9u);  // four tensiometers, three probes, core samples, a well
  ASSERT_EQ(record.flux_plane_depths_cm, std::vector<double>{150.0});
  const auto total = profiles::season_total(record.run.balances);
  // Every term present and the balance closed to a small fraction of the water moved
  // (our own acceptance limit, 1e-4).
  EXPECT_GT(total.water_input_cm, 0);
  EXPECT_GT(total.actual_evaporation_cm, 0);
  EXPECT_GT(total.transpiration_cm, 0);
  const double moved =
      total.water_input_cm + total.actual_evaporation_cm + total.transpiration_cm + std::abs(total.bottom_flux_cm);
  EXPECT_LT(std::abs(total.balance_error_change_cm), 1e-4 * moved);
  // Transpiration never exceeds the potential transpiration of the forcing.
  double potential_transpiration_cm = 0;
  for (const auto& f : record.forcing)
    potential_transpiration_cm += f.potential_transpiration_cm_per_d * (f.end_day - f.start_day);
  EXPECT_LE(total.transpiration_cm, potential_transpiration_cm * (1 + 1e-9));

  const auto show = run_program(fmt::format("show '{}'", out.string()), site.folder());
  ASSERT_EQ(show.exit_code, 0) << show.err;
  // The season table printed again from the file is the one printed after the run. (The
  // run's visit table also has the Darcy columns from the sensor readings, which the run file
  // does not hold, so the comparison stops before the visit table.)
  const auto season_table = [](const std::string& text) {
    const auto from = text.find("Season water balance");
    return text.substr(from, text.find("Water balance per visit interval", from) - from);
  };
  EXPECT_NE(show.out.find("Water balance per visit interval"), std::string::npos);
  EXPECT_EQ(season_table(show.out), season_table(run.out));
}

TEST(RunAndShow, DefaultOutputSitsNextToTheSiteFile) {
  ScratchSite site("default");
  const auto run = run_program(
      fmt::format("run '{}' --quiet --from 2025-05-01 --to 2025-05-15", site.site_file().string()), site.folder());
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_TRUE(run.out.empty()) << run.out;
  EXPECT_TRUE(std::filesystem::exists(site.folder() / "site.h5"));
  EXPECT_EQ(data_rows(site.folder() / "site-visits.csv"), 3u);  // visits 05-06 and 05-13 inside
  const auto record = profiles::read_run(site.folder() / "site.h5");
  EXPECT_EQ(record.run_start_date, "2025-05-01");
  EXPECT_NEAR(record.run.balances.back().time_days, 14.0, 1e-9);
}

// A step limit far too small for the integrator's step budget makes the solver give up within
// the first day: exit code 2, and the partial run is written and marked incomplete.
TEST(RunAndShow, SolverFailureExitsWithTwoAndKeepsThePartialRun) {
  ScratchSite site("failure");
  site.replace("site.toml", "max_step = \"1 d\"", "max_step = \"1e-7 d\"");
  const auto out = site.folder() / "failed.h5";
  const auto run = run_site(site, out, "--quiet --to 2025-04-03");
  EXPECT_EQ(run.exit_code, 2) << run.err;
  EXPECT_NE(run.err.find("solver failed"), std::string::npos) << run.err;
  ASSERT_TRUE(std::filesystem::exists(out));
  const auto record = profiles::read_run(out);
  EXPECT_FALSE(record.run.complete);
  ASSERT_TRUE(record.run.failure.has_value());
  EXPECT_LT(record.run.failure->time_days, 2.0);
  const auto show = run_program(fmt::format("show '{}'", out.string()), site.folder());
  EXPECT_EQ(show.exit_code, 0);
  EXPECT_NE(show.out.find("RUN INCOMPLETE"), std::string::npos);
}

TEST(RunAndShow, CheckPrintsTheResolvedSetup) {
  ScratchSite site("check");
  const auto check = run_program(fmt::format("check '{}'", site.site_file().string()), site.folder());
  ASSERT_EQ(check.exit_code, 0) << check.err;
  for (const std::string text : {"Site file is usable", "sandy loam topsoil", "fixed pressure head -50 cm",
                                 "Recharge plane: 150 cm", "T120 (tensiometer) at 120 cm"}) {
    EXPECT_NE(check.out.find(text), std::string::npos) << text << "\n" << check.out;
  }
  EXPECT_FALSE(std::filesystem::exists(site.folder() / "site.h5"));
}

TEST(RunAndShow, ShowRefusesAFileThatIsNotARun) {
  ScratchSite site("notrun");
  const auto show = run_program(fmt::format("show '{}'", (site.folder() / "rain.csv").string()), site.folder());
  EXPECT_EQ(show.exit_code, 1);
  EXPECT_NE(show.err.find("rain.csv"), std::string::npos) << show.err;
}

// The [[layers]] block printed by `wetfront soil layer` pastes into a site file unchanged.
TEST(RunAndShow, SoilLayerBlockLoadsAsASiteLayer) {
  ScratchSite site("layerblock");
  const auto layer =
      run_program(fmt::format("soil layer --name 'loam subsoil' --top '40 cm' --bottom '250 cm' --texture loam "
                              "--permeameter '{0}/examples/soil-data/well-permeameter.csv' --well-radius '3 cm' "
                              "--reservoir-area '35.4 cm2'",
                              WETFRONT_SOURCE_DIR),
                  site.folder());
  ASSERT_EQ(layer.exit_code, 0) << layer.err;
  const auto block_start = layer.out.find("[[layers]]");
  ASSERT_NE(block_start, std::string::npos) << layer.out;
  const std::string block = layer.out.substr(block_start);
  std::string text = site.read("site.toml");
  const auto from = text.find("[[layers]]\nname = \"loam subsoil\"");
  const auto to = text.find("[grid]");
  ASSERT_NE(from, std::string::npos);
  text.replace(from, to - from, block + "\n");
  site.write("site.toml", text);
  const auto check = run_program(fmt::format("check '{}'", site.site_file().string()), site.folder());
  EXPECT_EQ(check.exit_code, 0) << check.err;
  EXPECT_NE(check.out.find("loam subsoil: van Genuchten-Mualem"), std::string::npos) << check.out;
}

TEST(RunAndShow, HelpGivesAnExample) {
  ScratchSite site("help");
  for (const std::string command : {"run", "check", "show"}) {
    const auto help = run_program(command + " --help", site.folder());
    EXPECT_EQ(help.exit_code, 0) << command;
    EXPECT_NE(help.out.find("Example"), std::string::npos) << command;
    EXPECT_NE(help.out.find("wetfront " + command), std::string::npos) << command;
  }
}

}  // namespace
}  // namespace wetfront::site
