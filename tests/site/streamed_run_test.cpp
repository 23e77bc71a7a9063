// A season run with its profiles written to the run file as the run goes (run_season_streamed)
// keeps no profiles, and gives the same run file, field checks and report numbers as a run that
// keeps every profile and writes the file at the end.
#include <gtest/gtest.h>

#include <random>

#include "hdf5_content.hpp"
#include "site_test_helpers.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/run_file_stream.hpp"
#include "wetfront/site/run_season.hpp"
#include "wetfront/site/site_file.hpp"

namespace wetfront::site {
namespace {

using testing::ScratchSite;

TEST(StreamedRun, KeepsNoProfilesAndWritesTheFileOfARunThatKeepsThem) {
  ScratchSite site("streamed");
  // Eight weeks of the demo: visits, tensiometers, probes, core samples and the well.
  const SiteSetup setup = load_site_file(site.site_file(), {"", "2025-05-27"});
  const SeasonResult kept = run_season(setup, "test");
  ASSERT_TRUE(kept.complete);
  profiles::write_run(site.folder() / "kept.h5", kept.record);

  Season season = prepare_season(setup);
  profiles::RunFileStream stream(site.folder() / "streamed.h5", setup.run_start_text,
                                 season.problem.grid.cell_depths_cm(), season.problem.grid.face_depths_cm());
  const SeasonResult streamed = run_season_streamed(std::move(season), stream, "test");
  EXPECT_TRUE(streamed.record.run.profiles.empty());
  EXPECT_EQ(stream.profiles_appended(), kept.record.run.profiles.size());
  stream.finish(streamed.record);
  stream.commit();

  const auto expected = wetfront::testing::hdf5_content(site.folder() / "kept.h5");
  const auto actual = wetfront::testing::hdf5_content(site.folder() / "streamed.h5");
  ASSERT_EQ(expected.size(), actual.size());
  for (std::size_t i = 0; i < expected.size(); ++i) EXPECT_EQ(expected[i], actual[i]) << "line " << i;
  ASSERT_TRUE(kept.record.sensor_comparison && streamed.record.sensor_comparison);
  EXPECT_FALSE(streamed.record.sensor_comparison->pressure_head.empty());
  ASSERT_EQ(streamed.sensors.sensors.size(), kept.sensors.sensors.size());
  for (std::size_t i = 0; i < kept.sensors.sensors.size(); ++i)
    EXPECT_EQ(streamed.sensors.sensors[i].metrics.root_mean_square_error,
              kept.sensors.sensors[i].metrics.root_mean_square_error)
        << kept.sensors.sensors[i].name;
}

// The gathered cells give, at any depth asked for, exactly what every cell gives; other depths
// inside the column are not asked for.
TEST(StreamedRun, GatheredCellsGiveTheValuesOfEveryCellAtTheReadingDepths) {
  const std::vector<double> centres{0.25, 0.75, 1.5, 3.0, 5.5, 9.0, 14.0, 20.0, 27.5, 36.0};
  std::vector<double> depths{0.25, 0.3, 5.5, 13.9, 36.0, 40.0, -1.0};  // centres, between, outside
  std::mt19937_64 draw(7);
  solver::ColumnRun run;
  run.cell_depths_cm = centres;
  SensorProfileGatherer gatherer(centres, depths);
  for (int t = 0; t < 4; ++t) {
    solver::ProfileSnapshot snapshot;
    snapshot.time_days = t;
    for (std::size_t i = 0; i < centres.size(); ++i) {
      snapshot.head_cm.push_back(-static_cast<double>(draw() % 1000));
      snapshot.water_content.push_back(static_cast<double>(draw() % 1000) / 2000.0);
    }
    gatherer.add(snapshot);
    run.profiles.push_back(snapshot);
  }
  const SensorProfiles all = sensor_profiles(run);
  const SensorProfiles& gathered = gatherer.profiles();
  EXPECT_LT(gathered.heads.depths_cm.size(), centres.size());
  for (const double day : {0.0, 1.0, 2.5, 3.0}) {
    for (const double depth : depths) {
      EXPECT_EQ(observations::simulated_value_at(gathered.heads, day, depth),
                observations::simulated_value_at(all.heads, day, depth))
          << day << " d, " << depth << " cm";
      EXPECT_EQ(observations::simulated_value_at(gathered.water_contents, day, depth),
                observations::simulated_value_at(all.water_contents, day, depth))
          << day << " d, " << depth << " cm";
    }
  }
}

}  // namespace
}  // namespace wetfront::site
