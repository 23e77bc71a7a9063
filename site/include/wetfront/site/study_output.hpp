// The HDF5 files of `wetfront sweep` and `wetfront calibrate` (layout in docs/hdf5-layout.md,
// "Parameter study files"). run_id (output_files.hpp) goes into the root attribute run_id. Both throw base::InputError
// naming the file when it cannot be written.
#pragma once

#include <filesystem>
#include <string>

#include "wetfront/site/parameter_study.hpp"

namespace wetfront::site {

// The ranked table of every set and the profiles of the `kept` best complete runs (run again
// on `threads` threads to get their profiles; the runs are deterministic, so they are the runs
// of the table).
void write_sweep_file(const std::filesystem::path& path, const SeasonModel& model, const SweepResult& sweep,
                      std::size_t kept, unsigned threads, const std::string& program_version,
                      const std::string& run_id = {});

// Parameters with standard errors, covariance and correlation, the recharge band per interval,
// and the profiles of the calibrated run.
void write_calibration_file(const std::filesystem::path& path, const SeasonModel& model, const CalibrationStudy& study,
                            const std::string& program_version, const std::string& run_id = {});

}  // namespace wetfront::site
