#include "wetfront/site/season_files.hpp"

#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/site/season_tables.hpp"

namespace wetfront::site {
namespace {

std::filesystem::path beside(const std::filesystem::path& run_file, const std::string& suffix) {
  std::filesystem::path csv = run_file;
  csv.replace_filename(run_file.stem().string() + suffix);
  return csv;
}

}  // namespace

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

}  // namespace wetfront::site
