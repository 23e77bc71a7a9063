// `run_network` and `wetfront network` on a scratch copy of the demo network (examples/network).
#include <gtest/gtest.h>

#include <fstream>
#include <random>
#include <sstream>

#include "site_test_helpers.hpp"
#include "wetfront/site/network.hpp"

namespace wetfront::site {
namespace {

namespace fs = std::filesystem;

std::string read_text(const fs::path& path) {
  std::ifstream in(path);
  std::stringstream buffer;
  buffer << in.rdbuf();
  return buffer.str();
}

void write_text(const fs::path& path, const std::string& text) { std::ofstream(path) << text; }

class ScratchNetwork {
 public:
  ScratchNetwork() {
    std::random_device seed;
    folder_ = fs::temp_directory_path() / ("wetfront-network-" + std::to_string(seed()));
    fs::create_directories(folder_);
    fs::copy(fs::path(WETFRONT_SOURCE_DIR) / "examples" / "network", folder_, fs::copy_options::recursive);
    // Outputs of an earlier run in the examples folder are not part of the network.
    for (const auto& entry : fs::directory_iterator(folder_)) {
      if (entry.path().extension() == ".h5") fs::remove(entry.path());
    }
  }
  ~ScratchNetwork() {
    std::error_code ignored;
    fs::remove_all(folder_, ignored);
  }
  ScratchNetwork(const ScratchNetwork&) = delete;
  ScratchNetwork& operator=(const ScratchNetwork&) = delete;
  const fs::path& folder() const { return folder_; }
  fs::path network_file() const { return folder_ / "network.toml"; }
  // `wetfront network` on the network file, in the folder.
  testing::ProgramResult run() const {
    return testing::run_program("network '" + network_file().string() + "'", folder_);
  }

 private:
  fs::path folder_;
};

// A network run in which one site failed: exit code 4, and the message names `file`.
void expect_one_site_failed(const testing::ProgramResult& result, const std::string& file) {
  EXPECT_EQ(result.exit_code, 4) << result.err;
  EXPECT_NE(result.err.find(file), std::string::npos) << result.err;
}

TEST(Network, DemoNetworkRunsThreeSites) {
  const ScratchNetwork network;
  const NetworkPlan plan = load_network_file(network.network_file());
  ASSERT_EQ(plan.site_files.size(), 3u);
  const auto sites = run_network(plan, 2, "test");
  ASSERT_EQ(sites.size(), 3u);
  for (const auto& s : sites) {
    EXPECT_EQ(s.status, SiteStatus::done) << s.reason;
    EXPECT_FALSE(s.intervals.empty());
  }
  EXPECT_EQ(sites[0].name, "Network plot A (invented)");
  // Plot A has a tensiometer pair and the well; plot C has neither.
  EXPECT_TRUE(sites[0].head_rmse_cm.has_value());
  EXPECT_FALSE(sites[2].head_rmse_cm.has_value());
  EXPECT_FALSE(sites[2].darcy_cm.has_value());
  EXPECT_FALSE(sites[2].water_table_cm.has_value());
  // Different soils under the same weather drain differently.
  EXPECT_NE(sites[1].drainage_cm, sites[2].drainage_cm);
}

TEST(Network, BrokenSiteIsReportedAndTheOthersFinish) {
  const ScratchNetwork network;
  write_text(network.folder() / "plot-b.toml", "[site\nname = broken\n");
  expect_one_site_failed(network.run(), "plot-b.toml");
  EXPECT_TRUE(fs::exists(network.folder() / "plot-a.h5"));
  EXPECT_TRUE(fs::exists(network.folder() / "plot-c.h5"));
  EXPECT_FALSE(fs::exists(network.folder() / "plot-b.h5"));
  ASSERT_TRUE(fs::exists(network.folder() / "network.h5"));
  const std::string sites_csv = read_text(network.folder() / "network-sites.csv");
  EXPECT_NE(sites_csv.find("bad input"), std::string::npos) << sites_csv;
  EXPECT_NE(sites_csv.find("Network plot A (invented),done"), std::string::npos) << sites_csv;
  EXPECT_NE(sites_csv.find("Network plot C (invented),done"), std::string::npos) << sites_csv;
}

TEST(Network, ResultsDoNotDependOnTheThreadCount) {
  const ScratchNetwork network;
  const NetworkPlan plan = load_network_file(network.network_file());
  const auto one = run_network(plan, 1, "test");
  const auto two = run_network(plan, 2, "test");
  ASSERT_EQ(one.size(), two.size());
  for (std::size_t k = 0; k < one.size(); ++k) {
    EXPECT_EQ(one[k].name, two[k].name);
    EXPECT_EQ(one[k].status, SiteStatus::done) << one[k].reason;
    EXPECT_EQ(two[k].status, SiteStatus::done) << two[k].reason;
    EXPECT_EQ(one[k].drainage_cm, two[k].drainage_cm);
    EXPECT_EQ(one[k].evaporation_cm, two[k].evaporation_cm);
    EXPECT_EQ(one[k].head_rmse_cm, two[k].head_rmse_cm);
    EXPECT_EQ(one[k].water_table_cm, two[k].water_table_cm);
    ASSERT_EQ(one[k].intervals.size(), two[k].intervals.size());
    for (std::size_t i = 0; i < one[k].intervals.size(); ++i) {
      EXPECT_EQ(one[k].intervals[i].drainage_cm, two[k].intervals[i].drainage_cm);
      EXPECT_EQ(one[k].intervals[i].darcy_cm, two[k].intervals[i].darcy_cm);
    }
  }
}

TEST(Network, SitesOnTheCommandLineWithOneMissing) {
  const ScratchNetwork network;
  const fs::path& f = network.folder();
  const auto result = testing::run_program("network --sites '" + (f / "plot-c.toml").string() + "' '" +
                                               (f / "no-such-plot.toml").string() + "' --summary '" +
                                               (f / "two").string() + "' --threads 1",
                                           f);
  EXPECT_EQ(result.exit_code, 4) << result.err;
  EXPECT_NE(result.err.find("no-such-plot.toml"), std::string::npos) << result.err;
  EXPECT_TRUE(fs::exists(network.folder() / "plot-c.h5"));
  EXPECT_TRUE(fs::exists(network.folder() / "two.h5"));
  EXPECT_TRUE(fs::exists(network.folder() / "two-intervals.csv"));
  const std::string sites_csv = read_text(network.folder() / "two-sites.csv");
  EXPECT_NE(sites_csv.find("no-such-plot,bad input"), std::string::npos) << sites_csv;
}

TEST(Network, SummaryInAMissingFolderIsBadInputAndRunsNothing) {
  const ScratchNetwork network;
  const fs::path& f = network.folder();
  const auto result = testing::run_program("network --sites '" + (f / "plot-c.toml").string() + "' --summary '" +
                                               (f / "no-such-folder" / "out").string() + "'",
                                           f);
  EXPECT_EQ(result.exit_code, 1) << result.err;
  EXPECT_NE(result.err.find("no-such-folder"), std::string::npos) << result.err;
  EXPECT_FALSE(fs::exists(network.folder() / "plot-c.h5"));
}

TEST(Network, SolverFailureIsReportedAndTheOthersFinish) {
  const ScratchNetwork network;
  // Plot C over three weeks with a largest time step so short that the solver's work limit stops it.
  std::string text = read_text(network.folder() / "plot-c.toml");
  const auto visits = text.find("visits = [");
  const auto visits_end = text.find(']', visits);
  ASSERT_NE(visits, std::string::npos);
  text.replace(visits, visits_end + 1 - visits, "visits = [\"2025-04-08\"]");
  for (const auto& [from, to] : {std::pair<std::string, std::string>{"end = \"2025-10-18\"", "end = \"2025-04-20\""},
                                 {"max_step = \"1 d\"", "max_step = \"0.00001 d\""}}) {
    const auto at = text.find(from);
    ASSERT_NE(at, std::string::npos) << from;
    text.replace(at, from.size(), to);
  }
  write_text(network.folder() / "plot-c.toml", text);
  const auto sites = run_network(load_network_file(network.network_file()), 2, "test");
  ASSERT_EQ(sites.size(), 3u);
  EXPECT_EQ(sites[0].status, SiteStatus::done) << sites[0].reason;
  EXPECT_EQ(sites[1].status, SiteStatus::done) << sites[1].reason;
  EXPECT_EQ(sites[2].status, SiteStatus::solver_failure);
  EXPECT_NE(sites[2].reason.find("time steps"), std::string::npos) << sites[2].reason;
  EXPECT_LT(sites[2].run_end, "2025-04-20");
}

TEST(Network, FileOfAnotherProgramIsNotReplaced) {
  const ScratchNetwork network;
  write_text(network.folder() / "plot-b-visits.csv", "kept as it is\n");
  expect_one_site_failed(network.run(), "plot-b-visits.csv");
  EXPECT_EQ(read_text(network.folder() / "plot-b-visits.csv"), "kept as it is\n");
  EXPECT_FALSE(fs::exists(network.folder() / "plot-b.h5"));
  EXPECT_TRUE(fs::exists(network.folder() / "plot-a.h5"));
}

TEST(Network, SiteListedTwiceIsBadInput) {
  const ScratchNetwork network;
  write_text(network.network_file(), "sites = [\"plot-a.toml\", \"plot-b.toml\", \"plot-a.toml\"]\n");
  EXPECT_THROW(load_network_file(network.network_file()), base::InputError);
}

}  // namespace
}  // namespace wetfront::site
