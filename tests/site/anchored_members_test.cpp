// The members of an anchored season drawn around a calibration (site/src/anchored_members.hpp):
// a calibration file written by the calibration's own writer, read back, and drawn from.
#include <gtest/gtest.h>

#include <cmath>
#include <string>

#include "anchored_members.hpp"
#include "site_test_helpers.hpp"
#include "wetfront/site/parameter_study.hpp"
#include "wetfront/site/study_output.hpp"

namespace wetfront::site {
namespace {

using testing::ScratchSite;

// A calibration of the demo's two loam parameters with values and covariance of our choosing
// (search scale: log10 of Ks in cm/d, n as it is), written as `wetfront calibrate` writes it.
std::filesystem::path write_calibration(const ScratchSite& site, const Eigen::Vector2d& best_search,
                                        const Eigen::Matrix2d& covariance) {
  const SiteSetup setup = load_site_file(site.site_file());
  const SeasonModel model(setup, load_parameter_study(setup));
  CalibrationStudy calibration;
  studies::CalibrationResult& fit = calibration.fit;
  fit.parameters = model.study().ranges();
  fit.start = {20.0, 1.5};
  fit.best = {std::pow(10.0, best_search[0]), best_search[1]};
  fit.best_search = best_search;
  fit.standard_errors = covariance.diagonal().cwiseSqrt();
  fit.covariance = covariance;
  const Eigen::Vector2d inverse_sd = fit.standard_errors.cwiseInverse();
  fit.correlation = inverse_sd.asDiagonal() * covariance * inverse_sd.asDiagonal();
  const std::filesystem::path path = site.folder() / "site-calibration.h5";
  write_calibration_file(path, model, calibration, "test");
  return path;
}

TEST(AnchoredMembers, DrawnAroundTheCalibratedValuesWithTheirCovariance) {
  ScratchSite site("anchored-members");
  const Eigen::Vector2d best{std::log10(12.0), 1.4};
  const double sd_ks = 0.05, sd_n = 0.02, correlation = 0.6;
  Eigen::Matrix2d covariance;
  covariance << sd_ks * sd_ks, correlation * sd_ks * sd_n, correlation * sd_ks * sd_n, sd_n * sd_n;
  const AnchorSettings settings{
      .members = 2000, .seed = 5, .calibration_file = write_calibration(site, best, covariance)};
  const SiteSetup setup = load_site_file(site.site_file());
  const ParameterStudy study = load_parameter_study(setup);
  const detail::DrawnMembers drawn = detail::draw_members(study, settings, read_field_records(setup).input_hash);
  EXPECT_TRUE(drawn.warnings.empty());
  ASSERT_EQ(drawn.values.size(), settings.members);
  Eigen::MatrixXd search(2, static_cast<Eigen::Index>(drawn.values.size()));
  for (std::size_t j = 0; j < drawn.values.size(); ++j) {
    const auto& values = drawn.values[j];
    ASSERT_EQ(values.size(), 2u);
    EXPECT_TRUE(values[0] >= 5.0 && values[0] <= 80.0 && values[1] >= 1.25 && values[1] <= 1.8);
    search.col(static_cast<Eigen::Index>(j)) << std::log10(values[0]), values[1];
  }
  // The sample mean within 4 standard errors, the sample covariance within 10 % (2000 draws:
  // standard error of a variance about 3 %, of a correlation about 0.015; common practice). The
  // ranges lie over 20 sd away, so the truncation changes nothing measurable.
  const Eigen::Vector2d mean = search.rowwise().mean();
  const Eigen::MatrixXd anomalies = search.colwise() - mean;
  const Eigen::Matrix2d sample = anomalies * anomalies.transpose() / static_cast<double>(settings.members - 1);
  EXPECT_NEAR(mean[0], best[0], 4 * sd_ks / std::sqrt(2000.0));
  EXPECT_NEAR(mean[1], best[1], 4 * sd_n / std::sqrt(2000.0));
  EXPECT_NEAR(sample(0, 0), covariance(0, 0), 0.1 * covariance(0, 0));
  EXPECT_NEAR(sample(1, 1), covariance(1, 1), 0.1 * covariance(1, 1));
  EXPECT_NEAR(sample(0, 1) / std::sqrt(sample(0, 0) * sample(1, 1)), correlation, 0.06);
}

TEST(AnchoredMembers, ACalibrationOfOtherParametersOrInputsIsNamed) {
  ScratchSite site("anchored-members-mismatch");
  const std::filesystem::path calibration =
      write_calibration(site, {std::log10(12.0), 1.4}, Eigen::Matrix2d::Identity() * 1e-4);
  // The same site with rain changed: the members are drawn, with a warning.
  site.write("rain.csv", site.read("rain.csv") + "\n");
  SiteSetup setup = load_site_file(site.site_file());
  ParameterStudy study = load_parameter_study(setup);
  const AnchorSettings settings{.members = 4, .seed = 1, .calibration_file = calibration};
  const detail::DrawnMembers drawn = detail::draw_members(study, settings, read_field_records(setup).input_hash);
  ASSERT_EQ(drawn.warnings.size(), 1u);
  EXPECT_NE(drawn.warnings[0].find("other inputs"), std::string::npos) << drawn.warnings[0];
  // Only one of the two parameters adjustable: the calibration does not fit.
  std::string text = site.read("site.toml");
  site.write("site.toml", text.erase(text.rfind("\n[[adjustable]]")));
  setup = load_site_file(site.site_file());
  study = load_parameter_study(setup);
  try {
    detail::draw_members(study, settings, "");
    FAIL() << "expected an input error";
  } catch (const base::InputError& error) {
    EXPECT_EQ(error.file(), calibration.string());
    EXPECT_NE(error.problem().find("same parameters"), std::string::npos) << error.what();
  }
  // No such file.
  try {
    detail::draw_members(study, {.members = 4, .calibration_file = site.folder() / "missing.h5"}, "");
    FAIL() << "expected an input error";
  } catch (const base::InputError& error) {
    EXPECT_NE(std::string(error.what()).find("missing.h5"), std::string::npos) << error.what();
  }
}

}  // namespace
}  // namespace wetfront::site
