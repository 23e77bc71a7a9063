// The HDF5 file of a parameter study (a sweep or a calibration): tables with one row per
// parameter set or per parameter, and the profiles of selected runs. Layout in
// docs/hdf5-layout.md, "Parameter study files". Written like a run file: built in memory,
// saved under a temporary name and renamed only when complete.
#pragma once

#include <filesystem>
#include <string>
#include <utility>
#include <vector>

#include "wetfront/solver/column_run.hpp"

namespace wetfront::profiles {

inline constexpr const char* kStudyFormat = "wetfront parameter study";
inline constexpr int kStudyFormatVersion = 1;

struct StudyColumn {
  std::string name;
  std::string units;  // UDUNITS-2 text, "1" for a plain number; empty: no units (values of mixed units)
  std::string long_name;
  std::vector<double> values;  // one per row of the table
};

struct StudyTextColumn {
  std::string name;
  std::string long_name;
  std::vector<std::string> values;
};

// rows x columns, row-major; rows follow the table's axis, columns their own axis.
struct StudyMatrix {
  std::string name, units, long_name;
  StudyColumn column_axis;  // written once per group under its name, as a dimension scale
  std::vector<double> values;
};

// One HDF5 group: an axis (a dimension scale) and columns and matrices along it.
struct StudyTable {
  std::string group;
  StudyColumn axis;
  std::vector<StudyColumn> columns;
  std::vector<StudyTextColumn> texts;
  std::vector<StudyMatrix> matrices;
};

// The simulated profiles of one run, with the parameter values it ran with.
struct StudyRun {
  std::string name;  // group name under /runs
  std::string description;
  std::vector<std::pair<std::string, double>> values;  // parameter name (with unit) -> value
  solver::ColumnRun run;
};

struct StudyRecord {
  std::string study_kind;  // "parameter sweep" or "calibration"
  std::string site_name;
  std::string run_start_date;  // ISO 8601; the origin of every time axis
  std::string program_version;
  std::string input_hash;
  std::string run_id;                                      // identity of the study, also written in its CSV file
  std::vector<std::pair<std::string, std::string>> notes;  // further root attributes
  std::vector<StudyTable> tables;
  std::vector<StudyRun> runs;
};

// Throws RunFileError (run_file.hpp) naming the path and the cause; the target is then
// untouched.
void write_study(const std::filesystem::path& path, const StudyRecord& record);

// What a calibration file (study_kind "calibration") says about the parameters: their names,
// the calibrated values and their covariance, both on the search scale (log10 of the value for
// a log range).
struct CalibratedParameters {
  std::vector<std::string> names;  // "layer: key" or the site key, as in /parameters/name
  std::vector<double> search_values;
  std::vector<double> covariance;  // row-major, names.size() squared; empty when the fit gave none
  std::string input_hash;
  std::string run_id;
};

// Reads /parameters of a calibration file. Throws RunFileError naming the path and the cause
// (no such file, not a wetfront study file, a study of another kind, a missing dataset).
CalibratedParameters read_calibrated_parameters(const std::filesystem::path& path);

}  // namespace wetfront::profiles
