// The CSV tables of a sweep and a calibration of a site (NAME-sweep.csv, NAME-calibration.csv),
// also printed in their reports, and the few ways of writing their values that the reports share.
// Recharge in mm to 0.01 mm, positive downward.
#pragma once

#include <string>

#include "wetfront/site/parameter_study.hpp"
#include "wetfront/site/report_table.hpp"

namespace wetfront::site {

// Millimetres to 0.01 mm; amounts below that print as 0.00 rather than as round-off.
std::string mm_hundredths(double cm);

// A fit metric to 4 significant digits; blank when it is not finite.
std::string metric_text(double value);

// "log" or "linear": the scale a parameter is searched on.
std::string scale_name(const studies::AdjustableParameter& parameter);

// "the recharge plane at 150 cm (positive downward)".
std::string recharge_plane_text(const SeasonModel& model);

// Every run, best first: rank, set number, values, objective, metrics, season and per-visit
// recharge (mm).
ReportTable sweep_table(const SeasonModel& model, const SweepResult& sweep);

// Per interval: calibrated recharge, first-order interval and sampled band (mm).
ReportTable calibration_recharge_table(const SeasonModel& model, const CalibrationStudy& study);

}  // namespace wetfront::site
