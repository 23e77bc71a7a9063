// The printed reports and CSV tables of `wetfront sweep` and `wetfront calibrate`.
#pragma once

#include <string>

#include "wetfront/site/parameter_study.hpp"
#include "wetfront/site/report_table.hpp"

namespace wetfront::cli {

// What the objective compares, with the weights and reading counts.
std::string objective_text(const site::SeasonModel& model);

// The adjustable parameters with their ranges, scales and site values.
std::string parameters_text(const site::ParameterStudy& study);

// Every run, best first: rank, set number, values, objective, metrics, season and per-visit
// recharge (mm).
site::ReportTable sweep_table(const site::SeasonModel& model, const site::SweepResult& sweep);

// The printed sweep report: the first `shown` rows of the table and a recharge summary.
std::string sweep_report(const site::SeasonModel& model, const site::SweepResult& sweep, std::size_t shown,
                         double seconds, unsigned threads);

// Per interval: calibrated recharge, first-order interval and sampled band (mm).
site::ReportTable calibration_recharge_table(const site::SeasonModel& model, const site::CalibrationStudy& study);

std::string calibration_report(const site::SeasonModel& model, const site::CalibrationStudy& study, double seconds,
                               unsigned threads);

}  // namespace wetfront::cli
