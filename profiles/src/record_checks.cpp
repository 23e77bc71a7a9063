#include <fmt/format.h>

#include <cmath>
#include <stdexcept>

#include "field_checks_io.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/time_axis.hpp"

namespace wetfront::profiles {

namespace {

void require(bool condition, const std::string& message) {
  if (!condition) throw std::invalid_argument(message);
}

void require_increasing(const std::vector<double>& values, std::string_view what) {
  for (std::size_t i = 0; i < values.size(); ++i) {
    require(std::isfinite(values[i]), fmt::format("{} {} is not a finite number", what, i));
    if (i > 0)
      require(values[i] > values[i - 1],
              fmt::format("{} {} ({}) is not greater than {} {} ({})", what, i, values[i], what, i - 1, values[i - 1]));
  }
}

void check_snapshot(const solver::ProfileSnapshot& snapshot, std::size_t index, std::size_t cells) {
  const auto require_size = [&](const std::vector<double>& values, std::size_t expected, std::string_view field) {
    require(values.size() == expected, fmt::format("profile {} (day {}): {} has {} values, expected {}", index,
                                                   snapshot.time_days, field, values.size(), expected));
  };
  require_size(snapshot.head_cm, cells, "head_cm");
  require_size(snapshot.water_content, cells, "water_content");
  require_size(snapshot.conductivity_cm_per_d, cells, "conductivity_cm_per_d");
  require_size(snapshot.sink_rate_per_day, cells, "sink_rate_per_day");
  require_size(snapshot.face_flux_cm_per_d, cells + 1, "face_flux_cm_per_d");
}

void check_run(const solver::ColumnRun& run, std::size_t planes) {
  const std::size_t cells = run.cell_depths_cm.size();
  require(cells > 0, "the run has no cells (cell_depths_cm is empty)");
  require(run.face_depths_cm.size() == cells + 1,
          fmt::format("the run has {} cells but {} faces, expected {}", cells, run.face_depths_cm.size(), cells + 1));
  require_increasing(run.cell_depths_cm, "cell depth");
  require_increasing(run.face_depths_cm, "face depth");
  // The profiles are kept at the output times of the balance rows, or were written to the file
  // as the run went (RunFileStream) and are not kept at all.
  std::vector<double> times;
  for (std::size_t i = 0; i < run.profiles.size(); ++i) {
    check_snapshot(run.profiles[i], i, cells);
    times.push_back(run.profiles[i].time_days);
  }
  require_increasing(times, "output time of profile");
  require(run.profiles.empty() || run.balances.size() == run.profiles.size(),
          fmt::format("the run has {} profiles but {} balance rows; both are kept at the same output times",
                      run.profiles.size(), run.balances.size()));
  if (run.profiles.empty()) {
    for (const solver::CumulativeBalance& row : run.balances) times.push_back(row.time_days);
    require_increasing(times, "output time of balance row");
  }
  for (std::size_t i = 0; i < run.balances.size(); ++i) {
    const solver::CumulativeBalance& row = run.balances[i];
    require(row.time_days == times[i],
            fmt::format("balance row {} is at day {} but profile {} is at day {}", i, row.time_days, i, times[i]));
    require(row.plane_flux_cm.size() == planes,
            fmt::format("balance row {} (day {}) has {} flux plane values but the record lists {} flux plane depths", i,
                        row.time_days, row.plane_flux_cm.size(), planes));
  }
  require(!(run.complete && run.failure), "the run is marked complete but carries a failure");
}

}  // namespace

void check_record(const RunRecord& record) {
  days_since_units(record.run_start_date);
  check_run(record.run, record.flux_plane_depths_cm.size());
  for (std::size_t i = 0; i < record.flux_plane_depths_cm.size(); ++i)
    require(std::isfinite(record.flux_plane_depths_cm[i]), fmt::format("flux plane depth {} is not finite", i));
  for (std::size_t i = 0; i < record.layers.size(); ++i) {
    const LayerDescription& layer = record.layers[i];
    require(layer.top_depth_cm < layer.bottom_depth_cm,
            fmt::format("layer {} ('{}'): top {} cm is not above bottom {} cm", i, layer.name, layer.top_depth_cm,
                        layer.bottom_depth_cm));
  }
  for (std::size_t i = 0; i < record.sensors.size(); ++i) {
    const Sensor& sensor = record.sensors[i];
    require(!sensor.name.empty(), fmt::format("sensor {} (at {} cm) has no name", i, sensor.depth_cm));
    require(std::isfinite(sensor.depth_cm) && sensor.depth_cm >= 0,
            fmt::format("sensor {} ('{}'): depth {} cm is not at or below the soil surface", i, sensor.name,
                        sensor.depth_cm));
  }
  for (std::size_t i = 0; i < record.forcing.size(); ++i) {
    const ForcingInterval& interval = record.forcing[i];
    require(interval.start_day < interval.end_day,
            fmt::format("forcing interval {}: start day {} is not before end day {}", i, interval.start_day,
                        interval.end_day));
  }
  require_increasing(record.visit_days, "visit day");
  for (std::size_t i = 0; i < record.visit_balance.size(); ++i)
    require(record.visit_balance[i].plane_flux_cm.size() == record.flux_plane_depths_cm.size(),
            fmt::format("visit balance row {} has {} flux plane values but the record lists {} flux plane depths", i,
                        record.visit_balance[i].plane_flux_cm.size(), record.flux_plane_depths_cm.size()));
  check_field_checks(record);
}

}  // namespace wetfront::profiles
