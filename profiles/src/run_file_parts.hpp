// The parts of a run file other than the profiles (root attributes, balance, visits, inputs,
// sensors, checks, statistics), written once the run is over (run_file_write.cpp).
#pragma once

#include <hdf5.h>

#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles {

// Writes them into `file`, whose profiles and root coordinates (time, cell_depth, face_depth)
// are already there, and numbers the file's dimensions for netCDF-4.
void write_record_parts(hid_t file, const RunRecord& record);

}  // namespace wetfront::profiles
