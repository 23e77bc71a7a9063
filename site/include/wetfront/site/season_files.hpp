// The files of a season run: the HDF5 run file and, beside it, NAME-visits.csv (the balance per
// visit interval) and NAME-sensors.csv (the fit metrics per sensor), written as one set with one
// run id.
#pragma once

#include <filesystem>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "wetfront/profiles/run_file_stream.hpp"
#include "wetfront/profiles/run_record.hpp"
#include "wetfront/site/run_season.hpp"
#include "wetfront/site/sensor_check.hpp"

namespace wetfront::site {

struct SeasonFiles {
  std::filesystem::path run_file;
  std::filesystem::path visits_csv;
  std::filesystem::path sensors_csv;
};

// The run file `run_file` with its tables beside it: NAME-visits.csv and NAME-sensors.csv.
SeasonFiles season_files(const std::filesystem::path& run_file);

// The set a site writes by default: the site file's name with .h5, and its tables.
SeasonFiles default_season_files(const std::filesystem::path& site_file);

// Gives `record` a new run id and writes the run file with its visit table and, where the site
// has sensor metrics, its sensor table, as one set. Without metrics an earlier sensor table is
// removed: it would no longer describe this run file. Returns whether the sensor table was
// written. With `stream`, the run file is that stream (its profiles written as the run went),
// finished with the record's other parts and committed. Throws base::InputError naming a file
// that cannot be written.
bool write_season_files(profiles::RunRecord& record, const SensorCheck& sensors, const SeasonFiles& files,
                        profiles::RunFileStream* stream = nullptr);

// A table beside a run file that carries another run id than the run file (a run stopped
// between its renames, or a file copied from elsewhere); `run_id` is empty when it has none.
struct ForeignTable {
  std::filesystem::path csv;
  std::string run_id;
};

// The existing tables of `files` that do not belong to `record`; none for a run file from before
// run ids.
std::vector<ForeignTable> foreign_tables(const SeasonFiles& files, const profiles::RunRecord& record);

// A season whose profiles go to the run file's temporary name as the run reaches them; then
// `before_writing` (e.g. a grid check of the result), then the whole set (write_season_files).
// Throws base::InputError naming a file that cannot be written.
struct WrittenSeason {
  SeasonResult result;
  bool sensor_table = false;  // whether NAME-sensors.csv was written
};
WrittenSeason run_season_to_files(Season season, const SeasonFiles& files, const std::string& program_version,
                                  const SimulateStreamed& simulate,
                                  const std::function<void(const SeasonResult&)>& before_writing = {});

// A finished run back from its run file, read first in a child process (probe_run_file): the
// record without its profiles and, where it holds field checks, the sensor check. Throws
// base::InputError naming a damaged or unreadable file.
struct StoredRun {
  std::filesystem::path run_file;
  profiles::RunRecord record;
  std::optional<SensorCheck> sensors;
};
StoredRun read_stored_run(const std::filesystem::path& run_file);

// The tables of a stored run written again, each only when its path is not empty: the balance per
// visit interval to `visits_csv`, the fit metrics to `sensors_csv`, under the run's id.
// check_stored_tables, before any output: throws base::InputError when the metrics are asked for
// and the run holds none. write_stored_tables throws base::InputError naming a file it cannot write.
void check_stored_tables(const StoredRun& stored, const std::filesystem::path& sensors_csv);
void write_stored_tables(const StoredRun& stored, const std::filesystem::path& visits_csv,
                         const std::filesystem::path& sensors_csv);

}  // namespace wetfront::site
