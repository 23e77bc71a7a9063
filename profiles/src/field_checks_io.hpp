// Writing and reading the field checks of a run record: /recharge_estimates (Darcy and
// water-table-fluctuation estimates per visit interval) and /stored_water (docs/hdf5-layout.md).
#pragma once

#include <string>

#include "hdf5_io.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles {

// The sizes of the field checks against the visit table; throws std::invalid_argument naming
// the field that disagrees.
void check_field_checks(const RunRecord& record);

// Needs /visits/interval_end written already (the per-interval datasets attach to it).
void write_field_checks(hid_t file, const RunRecord& record, const std::string& time_units);

// Fills the three optionals of the record from the file; groups that are absent leave them empty.
void read_field_checks(hid_t file, RunRecord& record);

}  // namespace wetfront::profiles
