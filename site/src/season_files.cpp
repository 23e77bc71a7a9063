#include "wetfront/site/season_files.hpp"

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/site/run_file_probe.hpp"
#include "wetfront/site/season_tables.hpp"

namespace wetfront::site {

SeasonFiles season_files(const std::filesystem::path& run_file) {
  return {run_file, beside(run_file, "-visits.csv"), beside(run_file, "-sensors.csv")};
}

SeasonFiles default_season_files(const std::filesystem::path& site_file) {
  std::filesystem::path run_file = site_file;
  run_file.replace_extension(".h5");
  return season_files(run_file);
}

bool write_season_files(profiles::RunRecord& record, const SensorCheck& sensors, const SeasonFiles& files,
                        profiles::RunFileStream* stream) {
  record.run_id = new_run_id();
  const bool metrics = !sensors.sensors.empty() || !sensors.pooled.empty();
  std::vector<std::pair<std::filesystem::path, ReportTable>> tables{
      {files.visits_csv, visit_balance_table(record, &sensors)}};
  if (metrics) tables.push_back({files.sensors_csv, sensor_metrics_table(sensors)});
  for (auto& table : tables) table.second.run_id = record.run_id;
  write_files_together(tables, [&] {
    try {
      if (stream == nullptr) {
        profiles::write_run(files.run_file, record);
      } else {
        stream->finish(record);
        stream->commit();
      }
    } catch (const profiles::RunFileError& error) {
      throw base::InputError(error.what());
    }
  });
  if (!metrics) std::filesystem::remove(files.sensors_csv);
  return metrics;
}

std::vector<ForeignTable> foreign_tables(const SeasonFiles& files, const profiles::RunRecord& record) {
  std::vector<ForeignTable> foreign;
  if (record.run_id.empty()) return foreign;  // a run file from before run ids
  for (const auto& csv : {files.visits_csv, files.sensors_csv}) {
    std::error_code error;
    if (!std::filesystem::exists(csv, error)) continue;
    std::string id = csv_run_id(csv);
    if (id != record.run_id) foreign.push_back({csv, std::move(id)});
  }
  return foreign;
}

WrittenSeason run_season_to_files(Season season, const SeasonFiles& files, const std::string& program_version,
                                  const SimulateStreamed& simulate,
                                  const std::function<void(const SeasonResult&)>& before_writing) {
  std::optional<profiles::RunFileStream> stream;
  std::optional<SeasonResult> result;
  try {
    stream.emplace(files.run_file, season.site.run_start_text, season.problem.grid.cell_depths_cm(),
                   season.problem.grid.face_depths_cm());
    result = run_season_streamed(std::move(season), *stream, program_version, simulate);
  } catch (const profiles::RunFileError& error) {
    throw base::InputError(error.what());
  }
  if (before_writing) before_writing(*result);
  const bool sensor_table = write_season_files(result->record, result->sensors, files, &*stream);
  return {std::move(*result), sensor_table};
}

StoredRun read_stored_run(const std::filesystem::path& run_file) {
  StoredRun stored{.run_file = run_file, .record = {}, .sensors = {}};
  try {
    probe_run_file(run_file);
    stored.record = profiles::read_run(run_file, profiles::ProfileReading::leave_out);
  } catch (const profiles::RunFileError& error) {
    throw base::InputError(error.what());
  }
  const profiles::RunRecord& r = stored.record;
  if (r.sensor_comparison || r.darcy_estimate || r.water_table_estimate || r.stored_water) {
    stored.sensors = check_from_record(r);
  }
  return stored;
}

void check_stored_tables(const StoredRun& stored, const std::filesystem::path& sensors_csv) {
  if (sensors_csv.empty()) return;
  if (!stored.sensors || (stored.sensors->sensors.empty() && stored.sensors->pooled.empty())) {
    throw base::InputError(
        fmt::format("{}: the run file holds no sensor comparison, so there are no fit metrics for {}",
                    stored.run_file.string(), sensors_csv.string()));
  }
}

void write_stored_tables(const StoredRun& stored, const std::filesystem::path& visits_csv,
                         const std::filesystem::path& sensors_csv) {
  check_stored_tables(stored, sensors_csv);
  const auto write = [&](ReportTable table, const std::filesystem::path& path) {
    table.run_id = stored.record.run_id;
    write_csv(table, path.string());
  };
  if (!visits_csv.empty())
    write(visit_balance_table(stored.record, stored.sensors ? &*stored.sensors : nullptr), visits_csv);
  if (!sensors_csv.empty()) write(sensor_metrics_table(*stored.sensors), sensors_csv);
}

}  // namespace wetfront::site
