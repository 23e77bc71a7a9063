// The parameter sets of an anchored season's members (anchored_season.hpp): a Latin hypercube of
// the [[adjustable]] ranges, or draws around the calibrated values of a calibration file with
// the covariance of that fit.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/anchored_season.hpp"

namespace wetfront::site::detail {

struct DrawnMembers {
  std::vector<studies::ParameterSet> values;  // one per member, natural units
  std::vector<std::string> warnings;          // a calibration made from other inputs
};

// Without settings.calibration_file: studies::latin_hypercube of the ranges. With it: draws from
// the normal distribution N(calibrated, covariance) on the search scale, a draw outside a range
// drawn again (studies::draw_parameter_sets: a normal truncated to the ranges). Throws
// base::InputError naming the calibration file when it cannot be read, is not a calibration,
// names other parameters than the site's [[adjustable]] entries (or in another order), or has no
// covariance. `input_hash` is the site's; a calibration of other inputs gives a warning.
DrawnMembers draw_members(const ParameterStudy& study, const AnchorSettings& settings, const std::string& input_hash);

}  // namespace wetfront::site::detail
