#include "wetfront/site/run_season.hpp"

#include <utility>

namespace wetfront::site {

SeasonResult finish_season(Season season, solver::ColumnRun run, const std::string& program_version) {
  const SensorProfiles simulated = sensor_profiles(run);
  return finish_season(std::move(season), std::move(run), program_version, simulated);
}

SeasonResult finish_season(Season season, solver::ColumnRun run, const std::string& program_version,
                           const SensorProfiles& simulated) {
  const bool complete = run.complete;
  profiles::RunRecord record = make_record(season, std::move(run), program_version);
  SensorCheck sensors = check_sensors(season, season.sensor_readings, record, simulated);
  if (!season.sensor_readings.empty()) {
    record.sensor_comparison = comparison_record(sensors, season.sensor_readings, simulated);
  }
  store_field_checks(sensors, record);
  return SeasonResult{std::move(season), std::move(record), std::move(sensors), complete};
}

SeasonResult run_season_streamed(Season season, profiles::RunFileStream& stream, const std::string& program_version,
                                 const SimulateStreamed& simulate) {
  const std::vector<double> depths = reading_depths(season.sensor_readings);
  SensorProfileGatherer gatherer(season.problem.grid.cell_depths_cm(), depths);
  const solver::OutputObserver observe = [&](const solver::ProfileSnapshot& snapshot,
                                             const solver::CumulativeBalance&) {
    stream.append(snapshot);
    gatherer.add(snapshot);
  };
  solver::ColumnRun run = simulate ? simulate(season.problem, observe) : solver::simulate(season.problem, observe);
  return finish_season(std::move(season), std::move(run), program_version, gatherer.profiles());
}

SeasonResult run_season(const SiteSetup& site, const std::string& program_version, const Simulate& simulate) {
  Season season = prepare_season(site);
  solver::ColumnRun run = simulate ? simulate(season.problem) : solver::simulate(season.problem);
  return finish_season(std::move(season), std::move(run), program_version);
}

}  // namespace wetfront::site
