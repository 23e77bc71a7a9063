// Writing and reading a run record as one self-describing HDF5 file.
// The layout (groups, datasets, attributes, units) is documented in docs/hdf5-layout.md.
#pragma once

#include <filesystem>
#include <stdexcept>

#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles {

// Every failure to write or read a run file; the message names the file.
class RunFileError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

// Root attribute `record_format` carries this text; `record_format_version` the version.
inline constexpr const char* kRecordFormat = "wetfront run record";
// Version 2: netCDF-4 with the CF conventions (docs/hdf5-layout.md); version 1 files are refused.
inline constexpr int kRecordFormatVersion = 2;
// Root attribute `Conventions` of run and study files.
inline constexpr const char* kConventions = "CF-1.10";

// Throws std::invalid_argument naming the first inconsistent field (shapes that disagree
// with the grid, times out of order, an unreadable run start date, ...).
void check_record(const RunRecord& record);

// Writes the record to a temporary file in the same directory and renames it to `path`
// only once it is complete and flushed, so `path` is either the old file or the whole new
// one. An incomplete run is written too (root attribute complete = 0, with the failure).
// On any error the temporary file is removed and RunFileError names `path` and the cause.
void write_run(const std::filesystem::path& path, const RunRecord& record);

// Whether read_run reads the profiles (per output time and cell) or leaves them out, for a reader
// of a long run that needs only its report (balances, visits, checks): its memory then does not
// grow with cells times output times.
enum class ProfileReading { keep, leave_out };

// Reads a file written by write_run. Throws RunFileError for a missing file, a file that
// is not HDF5, an HDF5 file that is not a run record, or a record with missing or
// mis-shaped parts (naming the dataset).
RunRecord read_run(const std::filesystem::path& path, ProfileReading profiles = ProfileReading::keep);

}  // namespace wetfront::profiles
