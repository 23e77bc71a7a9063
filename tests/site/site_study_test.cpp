// Sweeps and calibrations of a whole site, on twin data made by the model from known values:
// the right answers are known by construction. Recovery within two standard errors and a
// residual variance near 1 for correctly stated noise are common practice for a twin experiment.
#include <gtest/gtest.h>

#include <cmath>
#include <fstream>
#include <sstream>
#include <string>

#include "wetfront/site/parameter_study.hpp"
#include "twin_site.hpp"

namespace wetfront::site {
namespace {

using testing::ScratchSite;

// The loam subsoil of the demo (site values Ks 20 cm/d, n 1.5) is what the studies adjust.
std::string loam_study() {
  std::ifstream in(WETFRONT_SOURCE_DIR "/tests/site/data/loam-study.toml");
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

// A calibration of at most `max_runs` model runs, `band_runs` more for the sampled band.
CalibrationSettings calibration(int max_runs, std::size_t band_runs, unsigned threads = 2) {
  CalibrationSettings settings;
  settings.options.max_runs = max_runs;
  settings.threads = threads;
  settings.band_runs = band_runs;
  return settings;
}

// About three and a half months keeps each run near a third of a second.
const std::string kEnd = "2025-07-15";

TEST(TwinExperiment, CalibrationRecoversTheTrueLoamValuesWithinTwoStandardErrors) {
  ScratchSite site("twin-calibration");
  testing::add_study(site, loam_study());
  // Truth: Ks 12 cm/d, n 1.4; noise of 5 cm on every head, as [fit] states. The calibration
  // starts from the site file's values, 20 cm/d and 1.5.
  const studies::ParameterSet truth{12.0, 1.4};
  ASSERT_GT(testing::write_twin_readings(site, kEnd, truth, 5.0, 11), 30u);
  const SeasonModel model = testing::load_model(site, kEnd);
  const CalibrationStudy study = run_calibration(model, calibration(60, 8));
  const auto& fit = study.fit;
  ASSERT_TRUE(fit.converged) << fit.stop_reason;
  ASSERT_EQ(fit.covariance.rows(), 2) << fit.covariance_note;
  EXPECT_LT(std::abs(fit.best_search[0] - std::log10(12.0)), 2 * fit.standard_errors[0])
      << "Ks " << fit.best[0] << " +- " << fit.standard_errors[0] << " (log10)";
  EXPECT_LT(std::abs(fit.best_search[1] - 1.4), 2 * fit.standard_errors[1])
      << "n " << fit.best[1] << " +- " << fit.standard_errors[1];
  // The data resolve both: standard errors well inside their ranges, so the check above is sharp.
  EXPECT_LT(fit.standard_errors[0], 0.1);
  EXPECT_LT(fit.standard_errors[1], 0.05);
  // Residual variance per reading near 1: the stated 5 cm is the noise that was added.
  const double s2 = study.after.objective / (fit.residual_count() - 2);
  EXPECT_GT(s2, 0.5);
  EXPECT_LT(s2, 1.8);
  EXPECT_LT(study.after.objective, study.before.objective);
  // The band: the season recharge of the true values lies inside the first-order 95 % interval
  // (a twin experiment: the truth is known), the interval has a width, and the sampled band is
  // ordered and overlaps it.
  ASSERT_FALSE(study.first_order.empty());
  ASSERT_FALSE(study.band.empty());
  EXPECT_EQ(study.first_order.size(), model.interval_end_days().size() + 1);
  const ScoredRun true_run = model.run(truth);
  ASSERT_TRUE(true_run.complete);
  EXPECT_GT(study.first_order[0].standard_deviation, 0.0);
  EXPECT_LE(study.first_order[0].lower, true_run.season_recharge_cm);
  EXPECT_GE(study.first_order[0].upper, true_run.season_recharge_cm);
  EXPECT_LT(study.band[0].low, study.band[0].median);
  EXPECT_LT(study.band[0].median, study.band[0].high);
  EXPECT_LT(study.band[0].low, study.first_order[0].upper);
  EXPECT_GT(study.band[0].high, study.first_order[0].lower);
}

TEST(TwinSweep, TheGridPointThatMadeTheReadingsRanksFirstWithZeroObjective) {
  ScratchSite site("twin-sweep");
  testing::add_study(site, loam_study());
  // The middle grid point: Ks 20 cm/d (log-midpoint of 5 and 80), n 1.525; no noise. The
  // readings are made with the grid point's own values as the sweep computes them (equal to
  // 20 and 1.525 to round-off): a round-off change of a parameter can change the integrator's
  // step sequence, and with it the heads by up to its time-stepping error.
  const studies::ParameterSet middle =
      run_sweep(testing::load_model(site, kEnd), {.full_grid = true, .threads = 2}).runs[4].values;
  EXPECT_NEAR(middle[0], 20.0, 1e-9);
  EXPECT_NEAR(middle[1], 1.525, 1e-12);
  testing::write_twin_readings(site, kEnd, middle, 0.0, 1);
  const SeasonModel model = testing::load_model(site, kEnd);
  const SweepResult sweep = run_sweep(model, {.full_grid = true, .threads = 2});
  ASSERT_EQ(sweep.runs.size(), 9u);
  const ScoredRun& best = sweep.runs[sweep.ranking[0]];
  EXPECT_EQ(sweep.ranking[0], 4u);  // set 5 of 9: the middle of the grid
  EXPECT_NEAR(best.values[0], 20.0, 1e-9);
  EXPECT_NEAR(best.values[1], 1.525, 1e-12);
  // Readings were written with 1e-3 cm rounding: the residuals are that small.
  EXPECT_LT(best.objective, 1e-6);
  EXPECT_GT(sweep.runs[sweep.ranking[1]].objective, 1.0);
}

TEST(SweepThreads, OneAndTwoThreadsGiveIdenticalResults) {
  ScratchSite site("threads");
  testing::add_study(site, loam_study());
  const SeasonModel model = testing::load_model(site, "2025-05-15");
  const SweepSettings one{.full_grid = false, .sample_size = 4, .seed = 5, .threads = 1};
  SweepSettings two = one;
  two.threads = 2;
  const SweepResult a = run_sweep(model, one);
  const SweepResult b = run_sweep(model, two);
  ASSERT_EQ(a.runs.size(), b.runs.size());
  EXPECT_EQ(a.ranking, b.ranking);
  for (std::size_t i = 0; i < a.runs.size(); ++i) {
    EXPECT_EQ(a.runs[i].values, b.runs[i].values);
    EXPECT_EQ(a.runs[i].objective, b.runs[i].objective);  // bit for bit
    EXPECT_EQ(a.runs[i].season_recharge_cm, b.runs[i].season_recharge_cm);
    EXPECT_EQ(a.runs[i].visit_recharge_cm, b.runs[i].visit_recharge_cm);
  }
}

TEST(CalibrationThreads, OneAndTwoThreadsGiveTheSameFitAndBand) {
  ScratchSite site("calibration-threads");
  testing::add_study(site, loam_study());
  testing::write_twin_readings(site, "2025-05-15", {12.0, 1.4}, 5.0, 11);
  const SeasonModel model = testing::load_model(site, "2025-05-15");
  const CalibrationStudy one = run_calibration(model, calibration(20, 4, 1));
  const CalibrationStudy two = run_calibration(model, calibration(20, 4, 2));
  EXPECT_EQ(one.fit.runs, two.fit.runs);
  EXPECT_EQ(one.fit.best, two.fit.best);  // bit for bit
  EXPECT_EQ(one.after.objective, two.after.objective);
  ASSERT_EQ(one.band.size(), two.band.size());
  for (std::size_t i = 0; i < one.band.size(); ++i) {
    EXPECT_EQ(one.band[i].low, two.band[i].low);
    EXPECT_EQ(one.band[i].high, two.band[i].high);
  }
}

TEST(Unresolvable, AParameterThatActsOnlyAfterTheLastReadingIsReported) {
  // The crop's late-season coefficient acts from late August; the run and its readings end in
  // mid-July, so it cannot change a single simulated reading.
  ScratchSite site("unresolvable");
  // The loam study's Ks entry with kc_end in place of n.
  std::string toml = loam_study();
  toml = toml.substr(0, toml.rfind("[[adjustable]]")) + "[[adjustable]]\nparameter = \"kc_end\"\nrange = [0.3, 0.8]\n";
  testing::add_study(site, toml);
  testing::write_twin_readings(site, kEnd, {12.0, 0.5}, 5.0, 3);
  const SeasonModel model = testing::load_model(site, kEnd);
  const CalibrationStudy study = run_calibration(model, calibration(40, 0));
  bool reported = false;
  for (const auto& w : study.fit.warnings)
    reported = reported || (w.find("kc_end") != std::string::npos && w.find("cannot resolve") != std::string::npos);
  EXPECT_TRUE(reported);
  EXPECT_EQ(study.fit.covariance.size(), 0);
  EXPECT_NE(study.band_note.find("no uncertainty band"), std::string::npos);
}

}  // namespace
}  // namespace wetfront::site

namespace wetfront::site {
namespace {

TEST(Objective, ProbeReadingsCountOnlyWithAWaterContentUncertaintyAndAreWeightedByIt) {
  ScratchSite site("objective");
  std::string toml = loam_study();
  testing::add_study(site, toml);
  const SeasonModel heads_only = testing::load_model(site, "2025-05-15");
  EXPECT_EQ(heads_only.compared_water_contents(), 0u);
  const ScoredRun a = heads_only.run({20.0, 1.5});
  ASSERT_TRUE(a.complete) << a.failure;
  EXPECT_EQ(static_cast<std::size_t>(a.residuals.size()), heads_only.compared_heads());
  EXPECT_FALSE(a.water_contents.has_value());

  site.replace("site.toml", "head_uncertainty = \"5 cm\"",
               "head_uncertainty = \"5 cm\"\nwater_content_uncertainty = \"2 %\"");
  const SeasonModel both = testing::load_model(site, "2025-05-15");
  ASSERT_GT(both.compared_water_contents(), 0u);
  const ScoredRun b = both.run({20.0, 1.5});
  ASSERT_TRUE(b.complete) << b.failure;
  ASSERT_EQ(static_cast<std::size_t>(b.residuals.size()), both.compared_heads() + both.compared_water_contents());
  ASSERT_TRUE(b.water_contents.has_value());
  // The head residuals are the same; the probe residuals are (simulated - observed) / 0.02, so
  // their sum of squares is count x (RMSE / 0.02)^2 (definition of the RMSE).
  const double head_part = a.objective;
  const double content_part = b.objective - head_part;
  EXPECT_NEAR(content_part, b.water_contents->count * std::pow(b.water_contents->root_mean_square_error / 0.02, 2),
              1e-9 * b.objective);
}

}  // namespace
}  // namespace wetfront::site
