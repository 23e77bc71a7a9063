#include "anchored_members.hpp"

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/study_file.hpp"
#include "wetfront/studies/parameter_sampling.hpp"
#include "wetfront/studies/parameter_uncertainty.hpp"

namespace wetfront::site::detail {

DrawnMembers draw_members(const ParameterStudy& study, const AnchorSettings& settings, const std::string& input_hash) {
  const std::vector<studies::AdjustableParameter> ranges = study.ranges();
  if (settings.calibration_file.empty()) return {studies::latin_hypercube(ranges, settings.members, settings.seed), {}};

  const std::string file = settings.calibration_file.string();
  profiles::CalibratedParameters calibrated;
  try {
    calibrated = profiles::read_calibrated_parameters(settings.calibration_file);
  } catch (const profiles::RunFileError& error) {
    throw base::InputError(file, 0, "", error.what());
  }
  std::vector<std::string> names;
  for (const auto& range : ranges) names.push_back(range.name);
  if (calibrated.names != names)
    throw base::InputError(file, 0, "/parameters/name",
                           fmt::format("the calibration adjusted {}, the site file's [[adjustable]] entries are {}; "
                                       "calibrate the same parameters in the same order",
                                       fmt::join(calibrated.names, ", "), fmt::join(names, ", ")));
  if (calibrated.covariance.empty())
    throw base::InputError(file, 0, "/parameters/covariance",
                           "the calibration gave no covariance (its report says why), so there is nothing to draw "
                           "the members from; draw them from the ranges instead");
  const auto n = static_cast<Eigen::Index>(names.size());
  const Eigen::VectorXd mean = Eigen::Map<const Eigen::VectorXd>(calibrated.search_values.data(), n);
  const Eigen::MatrixXd covariance = Eigen::Map<const Eigen::MatrixXd>(calibrated.covariance.data(), n, n);
  DrawnMembers drawn;
  try {
    drawn.values = studies::draw_parameter_sets(ranges, mean, covariance, settings.members, settings.seed);
  } catch (const base::InputError& error) {
    throw base::InputError(file, 0, "/parameters/covariance", error.problem());
  }
  if (calibrated.input_hash != input_hash)
    drawn.warnings.push_back(fmt::format(
        "the calibration file {} was made from other inputs than this run (its input hash differs): the members "
        "are drawn around values fitted to other records or settings",
        file));
  return drawn;
}

}  // namespace wetfront::site::detail
