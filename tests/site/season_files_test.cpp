// The files of a season (site/season_files.hpp) and the layer block of `wetfront soil layer`
// (site/layer_block.hpp), without the command line.
#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <random>
#include <string>

#include "wetfront/base/input_error.hpp"
#include "wetfront/site/layer_block.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/site/season_files.hpp"

namespace wetfront::site {
namespace {

namespace fs = std::filesystem;

TEST(SeasonFiles, TablesLieBesideTheRunFile) {
  const SeasonFiles files = season_files("plots/a/season.h5");
  EXPECT_EQ(files.visits_csv, fs::path("plots/a/season-visits.csv"));
  EXPECT_EQ(files.sensors_csv, fs::path("plots/a/season-sensors.csv"));
  const SeasonFiles by_default = default_season_files("plots/a/site.toml");
  EXPECT_EQ(by_default.run_file, fs::path("plots/a/site.h5"));
  EXPECT_EQ(by_default.visits_csv, fs::path("plots/a/site-visits.csv"));
}

TEST(SeasonFiles, TablesOfAnotherRunAreNamed) {
  const fs::path folder =
      fs::temp_directory_path() / ("wetfront-season-files-" + std::to_string(std::random_device()()));
  fs::create_directories(folder);
  const SeasonFiles files = season_files(folder / "season.h5");
  std::ofstream(files.visits_csv) << "from,to,run id\n2025-04-01,2025-04-08,run-b\n";
  std::ofstream(files.sensors_csv) << "sensor,run id\nT30,run-a\n";
  profiles::RunRecord record;
  record.run_id = "run-a";
  const auto foreign = foreign_tables(files, record);
  ASSERT_EQ(foreign.size(), 1u);
  EXPECT_EQ(foreign[0].csv, files.visits_csv);
  EXPECT_EQ(foreign[0].run_id, "run-b");
  record.run_id.clear();  // a run file from before run ids: nothing to compare
  EXPECT_TRUE(foreign_tables(files, record).empty());
  fs::remove_all(folder);
}

TEST(SeasonFiles, MetricsOfARunWithoutSensorsAreRefused) {
  const StoredRun stored{.run_file = "plot.h5", .record = {}, .sensors = {}};
  EXPECT_NO_THROW(check_stored_tables(stored, ""));
  EXPECT_THROW(check_stored_tables(stored, "metrics.csv"), base::InputError);
}

LayerInputs loam_layer() {
  LayerInputs inputs;
  inputs.name = "subsoil";
  inputs.top = "30 cm";
  inputs.bottom = "0.6 m";
  inputs.texture = "loam";
  inputs.saturated_conductivity = "2 cm/h";
  return inputs;
}

// Loam class averages of Carsel & Parrish (1988) as soils/texture_classes.cpp holds them; 2 cm/h is
// 48 cm/d (hand arithmetic).
TEST(LayerBlock, TextureClassAndGivenConductivity) {
  const LayerBlock block = layer_block(loam_layer());
  EXPECT_EQ(block.text.rfind(kLayerBlockMark, 0), 0u) << block.text;
  EXPECT_NE(block.text.find("bottom = \"60 cm\""), std::string::npos) << block.text;
  EXPECT_NE(block.text.find("residual_water_content = 0.078"), std::string::npos) << block.text;
  EXPECT_NE(block.text.find("saturated_conductivity = \"48 cm/d\""), std::string::npos) << block.text;
  ASSERT_EQ(block.tables.size(), 1u);
  EXPECT_EQ(block.tables[0].rows.size(), 6u);
}

TEST(LayerBlock, RetentionAndConductivityMustEachHaveOneSource) {
  LayerInputs no_retention = loam_layer();
  no_retention.texture.clear();
  EXPECT_THROW(layer_block(no_retention), base::InputError);
  LayerInputs no_conductivity = loam_layer();
  no_conductivity.saturated_conductivity.clear();
  EXPECT_THROW(layer_block(no_conductivity), base::InputError);
  LayerInputs upside_down = loam_layer();
  upside_down.bottom = "10 cm";
  EXPECT_THROW(layer_block(upside_down), base::InputError);
}

}  // namespace
}  // namespace wetfront::site
