// The season report of a run record: water balance for the season and per visit interval,
// solver statistics, and the cautions that go with every result. Printed by `wetfront run`
// and again by `wetfront show` from the HDF5 file.
#pragma once

#include <string>
#include <vector>

#include "report_table.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::cli {

// Per visit interval: dates, every balance term in mm, one row per interval. Also the CSV.
ReportTable visit_balance_table(const profiles::RunRecord& record);

// The whole report as text (tables, statements of units and signs, statistics, cautions).
// notes: extra lines about the inputs (gaps filled, shortened run, processes not simulated).
std::string season_report(const profiles::RunRecord& record, const std::vector<std::string>& notes);

}  // namespace wetfront::cli
