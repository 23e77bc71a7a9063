// The season report of a run record: water balance for the season and per visit interval,
// solver statistics, and the cautions that go with every result. Printed by `wetfront run`
// and again by `wetfront show` from the HDF5 file.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/report_table.hpp"
#include "wetfront/site/sensor_check.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::cli {

// Per visit interval: dates, every balance term in mm, one row per interval. Also the CSV.
// With a sensor check holding a Darcy or a water-table estimate: also that estimate and its
// agreement with the model; with water contents at two or more depths: the observed and the
// simulated change of stored water.
site::ReportTable visit_balance_table(const profiles::RunRecord& record, const site::SensorCheck* sensors = nullptr);

// The whole report as text (tables, statements of units and signs, statistics, cautions).
// notes: extra lines about the inputs (gaps filled, shortened run, processes not simulated).
std::string season_report(const profiles::RunRecord& record, const std::vector<std::string>& notes,
                          const site::SensorCheck* sensors = nullptr);

}  // namespace wetfront::cli
