// The tables of a season's results: printed in the season report and written as CSV beside the
// run file (NAME-visits.csv, NAME-sensors.csv). Amounts in mm, fluxes positive downward.
#pragma once

#include <string>

#include <fmt/format.h>

#include "wetfront/profiles/run_record.hpp"
#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/site/report_table.hpp"
#include "wetfront/site/sensor_check.hpp"

namespace wetfront::site {

inline constexpr double kMmPerCm = 10.0;

// An amount in cm as mm with one decimal.
inline std::string mm(double cm) { return fmt::format("{:.1f}", cm * kMmPerCm); }

// "20-80 cm": the depths the stored water spans.
inline std::string depth_range(const StorageCheck& storage) {
  return fmt::format("{}-{} cm", number(storage.depths_cm.front()), number(storage.depths_cm.back()));
}

// The ISO 8601 time `days` after the run start; "day 12.50" when the start is not a timestamp.
std::string date_after(const std::string& run_start, double days);

// Net downward flux across the first recharge plane over an interval (cm); 0 without a plane.
double recharge_cm(const profiles::IntervalBalance& balance);

// "drainage at 150 cm", or "recharge plane" when the record has no plane.
std::string plane_label(const profiles::RunRecord& record);

// Per visit interval: dates, every balance term in mm, one row per interval. Also the CSV.
// With a sensor check holding a Darcy or a water-table estimate: also that estimate and its
// agreement with the model; with water contents at two or more depths: the observed and the
// simulated change of stored water.
ReportTable visit_balance_table(const profiles::RunRecord& record, const SensorCheck* sensors = nullptr);

// The fit metrics per sensor and pooled, one row each, with units in the headers.
ReportTable sensor_metrics_table(const SensorCheck& sensors);

}  // namespace wetfront::site
