// Writing and reading the field checks of a run record: /recharge_estimates (Darcy and
// water-table-fluctuation estimates per visit interval) and /stored_water (docs/hdf5-layout.md).
#pragma once

#include <string>
#include <vector>

#include "hdf5_io.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles {

// The sizes of the field checks against the visit table; throws std::invalid_argument naming
// the field that disagrees.
void check_field_checks(const RunRecord& record);

// `interval_ends`: end of each visit interval (days); every group with per-interval variables
// holds them as its own coordinate `interval_end`.
void write_field_checks(hid_t file, const RunRecord& record, const std::string& time_units,
                        const std::vector<double>& interval_ends);

// Fills the three optionals of the record from the file; groups that are absent leave them empty.
void read_field_checks(hid_t file, RunRecord& record);

}  // namespace wetfront::profiles
