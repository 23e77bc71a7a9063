// The season report of a run record: water balance for the season and per visit interval,
// solver statistics, and the cautions that go with every result. Printed by `wetfront run`
// and again by `wetfront show` from the HDF5 file.
#pragma once

#include <string>
#include <vector>

#include "report_table.hpp"
#include "sensor_check.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::cli {

// Per visit interval: dates, every balance term in mm, one row per interval. Also the CSV.
// With a sensor check holding a Darcy estimate: also that estimate and its agreement; with
// probes at two or more depths: the observed and the simulated change of stored water.
ReportTable visit_balance_table(const profiles::RunRecord& record, const SensorCheck* sensors = nullptr);

// "Sensors against the model": metrics per sensor and pooled, readings left out and why, and
// the Darcy estimates beside the model's drainage.
std::string sensor_section(const SensorCheck& sensors);

// "Stored water over the probe depths": observed against simulated storage between the
// shallowest and the deepest probe, or a note that the comparison needs probes at two depths.
std::string storage_section(const StorageCheck& storage);

// The whole report as text (tables, statements of units and signs, statistics, cautions).
// notes: extra lines about the inputs (gaps filled, shortened run, processes not simulated).
std::string season_report(const profiles::RunRecord& record, const std::vector<std::string>& notes,
                          const SensorCheck* sensors = nullptr);

}  // namespace wetfront::cli
