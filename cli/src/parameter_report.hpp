// The printed reports of `wetfront sweep` and `wetfront calibrate` (their CSV tables:
// wetfront/site/parameter_study_tables.hpp).
#pragma once

#include <string>

#include "wetfront/site/parameter_study.hpp"

namespace wetfront::cli {

// What the objective compares, with the weights and reading counts.
std::string objective_text(const site::SeasonModel& model);

// The adjustable parameters with their ranges, scales and site values.
std::string parameters_text(const site::ParameterStudy& study);

// The printed sweep report: the first `shown` rows of the table and a recharge summary.
std::string sweep_report(const site::SeasonModel& model, const site::SweepResult& sweep, std::size_t shown,
                         double seconds, unsigned threads);

std::string calibration_report(const site::SeasonModel& model, const site::CalibrationStudy& study, double seconds,
                               unsigned threads);

}  // namespace wetfront::cli
