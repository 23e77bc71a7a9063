// A parameter study of a site: which values may change ([[adjustable]]) and how runs are
// scored against the sensor readings ([fit]). Keys, units and examples: docs/site-file.md,
// "Parameter studies".
//
// Scoring (the objective): the weighted sum of squared residuals
//   S = sum over tensiometer readings ((h_sim - h_obs) / sigma_h)^2
//     + sum over probe and core readings ((theta_sim - theta_obs) / sigma_theta)^2   (only with sigma_theta)
// with sigma the stated reading uncertainty, i.e. weights 1 / sigma^2. Tensiometer readings
// beyond the working limit, readings outside the run and well levels are left out.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "wetfront/site/site_file.hpp"
#include "wetfront/studies/parameter_space.hpp"

namespace wetfront::site {

// The value of the site that an adjustable parameter sets.
struct ParameterTarget {
  enum class Kind { soil, kc_initial, kc_mid, kc_end, pan_coefficient, water_table_depth };
  Kind kind = Kind::soil;
  std::size_t layer = 0;  // soil: index into SiteSetup::layers
  std::string soil_key;   // soil: the layer's key, e.g. "saturated_conductivity"
};

struct StudyParameter {
  studies::AdjustableParameter range;  // internal units; start = the site's value
  ParameterTarget target;
  std::size_t line = 0;  // of the [[adjustable]] entry, for messages
};

struct FitWeights {
  double head_uncertainty_cm = 10.0;                // sigma_h
  std::optional<double> water_content_uncertainty;  // sigma_theta; probes count only when given
};

struct ParameterStudy {
  std::vector<StudyParameter> parameters;
  FitWeights weights;
  std::vector<studies::AdjustableParameter> ranges() const;
};

// Reads [fit] and [[adjustable]] from the site file of `site` (already loaded by
// load_site_file). Throws base::InputError naming the file, line and key: an unknown parameter (with
// the ones this layer's model has), a layer that does not exist, a range without units or
// with the ends reversed, a log scale over values that are not positive, a site value outside
// the range, the same parameter twice. No [[adjustable]] entries give an empty study.
ParameterStudy load_parameter_study(const SiteSetup& site);

// The site with the values applied (internal units, in study order). Throws
// base::InputError when the combination is not physical (e.g. residual water content
// above saturated), naming the layer.
SiteSetup with_parameters(const SiteSetup& site, const ParameterStudy& study, const studies::ParameterSet& values);

// "0.0312 1/cm"-style text of a parameter value in its unit.
std::string parameter_value_text(const studies::AdjustableParameter& parameter, double value);

}  // namespace wetfront::site
