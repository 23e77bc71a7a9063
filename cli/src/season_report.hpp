// The season report of a run record: water balance for the season and per visit interval,
// solver statistics, and the cautions that go with every result. Printed by `wetfront run`
// and again by `wetfront show` from the HDF5 file.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/sensor_check.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::cli {

// The whole report as text (tables, statements of units and signs, statistics, cautions).
// notes: extra lines about the inputs (gaps filled, shortened run, processes not simulated).
std::string season_report(const profiles::RunRecord& record, const std::vector<std::string>& notes,
                          const site::SensorCheck* sensors = nullptr);

}  // namespace wetfront::cli
