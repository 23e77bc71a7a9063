// Reads a RunRecord back from a file written by write_run, checking every shape.
#include <fmt/format.h>

#include "field_checks_io.hpp"
#include "hdf5_io.hpp"
#include "layout.hpp"
#include "wetfront/profiles/run_file.hpp"

namespace wetfront::profiles {

namespace {

namespace h5 = hdf5;

std::string shape_text(const std::vector<std::size_t>& dims) { return fmt::format("{}", fmt::join(dims, " x ")); }

// Reads a dataset that must have exactly the given shape.
std::vector<double> read_shaped(hid_t parent, std::string_view name, std::vector<std::size_t> expected) {
  std::vector<std::size_t> dims;
  std::vector<double> values = h5::read_doubles(parent, name, static_cast<int>(expected.size()), dims);
  if (dims != expected)
    throw h5::Error(fmt::format("dataset {} has shape {}, expected {}", h5::child_path(parent, name), shape_text(dims),
                                shape_text(expected)));
  return values;
}

std::vector<double> read_vector(hid_t parent, std::string_view name) {
  std::vector<std::size_t> dims;
  return h5::read_doubles(parent, name, 1, dims);
}

void read_root_attributes(hid_t file, RunRecord& record) {
  record.program_version = h5::get_text_attribute(file, ".", "program_version");
  record.site_name = h5::get_text_attribute(file, ".", "site_name");
  record.run_start_date = h5::get_text_attribute(file, ".", "run_start_date");
  record.input_hash = h5::get_text_attribute(file, ".", "input_hash");
  if (h5::has_attribute(file, ".", "run_id")) record.run_id = h5::get_text_attribute(file, ".", "run_id");
  record.run.complete = h5::get_int_attribute(file, ".", "complete") != 0;
  if (h5::has_attribute(file, ".", "failure_reason")) {
    solver::RunFailure failure;
    failure.time_days = h5::get_double_attribute(file, ".", "failure_time_days");
    failure.depth_cm = h5::get_double_attribute(file, ".", "failure_depth_cm");
    failure.reason = h5::get_text_attribute(file, ".", "failure_reason");
    record.run.failure = failure;
  }
}

void read_profiles(hid_t file, solver::ColumnRun& run, const std::vector<double>& times, ProfileReading reading) {
  run.cell_depths_cm = read_vector(file, "cell_depth");
  run.face_depths_cm = read_shaped(file, "face_depth", {run.cell_depths_cm.size() + 1});
  if (reading == ProfileReading::leave_out) return;
  const std::size_t cells = run.cell_depths_cm.size();
  run.profiles.assign(times.size(), {});
  for (std::size_t t = 0; t < times.size(); ++t) run.profiles[t].time_days = times[t];
  for (const layout::ProfileField& field : layout::kCellFields) {
    const std::vector<double> matrix = read_shaped(file, field.name, {times.size(), cells});
    for (std::size_t t = 0; t < times.size(); ++t)
      (run.profiles[t].*field.member).assign(matrix.begin() + t * cells, matrix.begin() + (t + 1) * cells);
  }
  const std::vector<double> flux = read_shaped(file, "face_flux", {times.size(), cells + 1});
  const std::vector<double> ponded = read_shaped(file, "ponded_depth", {times.size()});
  for (std::size_t t = 0; t < times.size(); ++t) {
    run.profiles[t].face_flux_cm_per_d.assign(flux.begin() + t * (cells + 1), flux.begin() + (t + 1) * (cells + 1));
    run.profiles[t].ponded_depth_cm = ponded[t];
  }
}

void read_balance(hid_t file, RunRecord& record, const std::vector<double>& times) {
  h5::Group group = h5::open_group(file, "balance");
  std::vector<solver::CumulativeBalance>& rows = record.run.balances;
  rows.assign(times.size(), {});
  for (std::size_t t = 0; t < times.size(); ++t) rows[t].time_days = times[t];
  for (const layout::CumulativeTerm& term : layout::kCumulativeTerms) {
    const std::vector<double> values = read_shaped(group.id(), term.name, {times.size()});
    for (std::size_t t = 0; t < times.size(); ++t) rows[t].*term.member = values[t];
  }
  record.flux_plane_depths_cm = read_vector(group.id(), "plane_depth");
  const std::size_t planes = record.flux_plane_depths_cm.size();
  const std::vector<double> matrix = read_shaped(group.id(), "plane_flux", {times.size(), planes});
  for (std::size_t t = 0; t < times.size(); ++t)
    rows[t].plane_flux_cm.assign(matrix.begin() + t * planes, matrix.begin() + (t + 1) * planes);
}

void read_visits(hid_t file, RunRecord& record) {
  h5::Group group = h5::open_group(file, "visits");
  record.visit_days = read_vector(group.id(), "visit_time");
  const std::vector<double> ends = read_vector(group.id(), "interval_end");
  const std::size_t count = ends.size();
  const std::vector<double> starts = read_shaped(group.id(), "interval_start", {count});
  std::vector<IntervalBalance>& rows = record.visit_balance;
  rows.assign(count, {});
  for (std::size_t i = 0; i < count; ++i) {
    rows[i].start_day = starts[i];
    rows[i].end_day = ends[i];
  }
  for (const layout::IntervalTerm& term : layout::kIntervalTerms) {
    const std::vector<double> values = read_shaped(group.id(), term.name, {count});
    for (std::size_t i = 0; i < count; ++i) rows[i].*term.member = values[i];
  }
  const std::size_t planes = record.flux_plane_depths_cm.size();
  const std::vector<double> matrix = read_shaped(group.id(), "plane_flux", {count, planes});
  for (std::size_t i = 0; i < count; ++i)
    rows[i].plane_flux_cm.assign(matrix.begin() + i * planes, matrix.begin() + (i + 1) * planes);
}

void read_layers(hid_t inputs, std::vector<LayerDescription>& layers) {
  h5::Group group = h5::open_group(inputs, "layers");
  const std::vector<double> tops = read_vector(group.id(), "top_depth");
  const std::size_t count = tops.size();
  const std::vector<double> bottoms = read_shaped(group.id(), "bottom_depth", {count});
  const std::vector<std::string> names = h5::read_texts_of_length(group.id(), "name", count);
  const std::vector<std::string> models = h5::read_texts_of_length(group.id(), "model", count);
  layers.assign(count, {});
  for (std::size_t i = 0; i < count; ++i) layers[i] = {names[i], tops[i], bottoms[i], models[i], {}};
  std::vector<std::size_t> dims;
  const std::vector<std::int64_t> owners = h5::read_integers(group.id(), "parameter_layer", 1, dims);
  const std::size_t parameters = owners.size();
  const std::vector<std::string> parameter_names = h5::read_texts_of_length(group.id(), "parameter_name", parameters);
  const std::vector<double> values = read_shaped(group.id(), "parameter_value", {parameters});
  const std::vector<std::string> units = h5::read_texts_of_length(group.id(), "parameter_unit", parameters);
  for (std::size_t p = 0; p < parameters; ++p) {
    if (owners[p] < 0 || static_cast<std::size_t>(owners[p]) >= count)
      throw h5::Error(fmt::format("dataset {}/parameter_layer: entry {} names layer {}, but there are {} layers",
                                  h5::object_path(group.id()), p, owners[p], count));
    layers[static_cast<std::size_t>(owners[p])].parameters.push_back({parameter_names[p], values[p], units[p]});
  }
}

void read_forcing(hid_t inputs, std::vector<ForcingInterval>& forcing) {
  h5::Group group = h5::open_group(inputs, "forcing");
  const std::vector<double> starts = read_vector(group.id(), "interval_start");
  const std::size_t count = starts.size();
  const std::vector<double> ends = read_shaped(group.id(), "interval_end", {count});
  const std::vector<double> input = read_shaped(group.id(), "water_input", {count});
  const std::vector<double> evaporation = read_shaped(group.id(), "potential_evaporation", {count});
  const std::vector<double> transpiration = read_shaped(group.id(), "potential_transpiration", {count});
  forcing.assign(count, {});
  for (std::size_t i = 0; i < count; ++i) forcing[i] = {starts[i], ends[i], input[i], evaporation[i], transpiration[i]};
}

void read_sensors(hid_t file, std::vector<Sensor>& sensors) {
  h5::Group group = h5::open_group(file, "sensors");
  const std::vector<double> depths = read_vector(group.id(), "depth");
  const std::vector<std::string> names = h5::read_texts_of_length(group.id(), "sensor", depths.size());
  sensors.assign(depths.size(), {});
  for (std::size_t i = 0; i < depths.size(); ++i) sensors[i] = {names[i], depths[i]};
}

std::vector<std::int64_t> read_integer_vector(hid_t parent, std::string_view name, std::size_t length) {
  std::vector<std::size_t> dims;
  std::vector<std::int64_t> values = h5::read_integers(parent, name, 1, dims);
  if (values.size() != length)
    throw h5::Error(
        fmt::format("dataset {} has {} entries, expected {}", h5::child_path(parent, name), values.size(), length));
  return values;
}

std::vector<ComparedReading> read_compared(hid_t parent, std::string_view name) {
  std::vector<ComparedReading> readings;
  if (!h5::has_link(parent, name)) return readings;
  h5::Group group = h5::open_group(parent, name);
  const std::vector<double> times = read_vector(group.id(), "time");
  const std::size_t n = times.size();
  const auto sensors = h5::read_texts_of_length(group.id(), "sensor", n);
  const auto depths = read_shaped(group.id(), "depth", {n});
  const auto observed = read_shaped(group.id(), "observed", {n});
  const auto simulated = read_shaped(group.id(), "simulated", {n});
  const auto used = read_integer_vector(group.id(), "used", n);
  for (std::size_t i = 0; i < n; ++i)
    readings.push_back({sensors[i], times[i], depths[i], observed[i], simulated[i], used[i] != 0});
  return readings;
}

void read_sensor_comparison(hid_t file, RunRecord& record) {
  if (!h5::has_link(file, "sensor_comparison")) return;
  h5::Group group = h5::open_group(file, "sensor_comparison");
  SensorComparisonRecord comparison;
  comparison.pressure_head = read_compared(group.id(), "pressure_head");
  comparison.water_content = read_compared(group.id(), "water_content");
  h5::Group metrics = h5::open_group(group.id(), "metrics");
  const std::vector<double> depth = read_vector(metrics.id(), "depth");
  const std::size_t n = depth.size();
  const auto names = h5::read_texts_of_length(metrics.id(), "name", n);
  const auto quantities = h5::read_texts_of_length(metrics.id(), "quantity", n);
  const auto units = h5::read_texts_of_length(metrics.id(), "unit", n);
  const auto used = read_integer_vector(metrics.id(), "readings_used", n);
  const auto beyond = read_integer_vector(metrics.id(), "left_out_beyond_working_limit", n);
  const auto outside = read_integer_vector(metrics.id(), "left_out_outside_run", n);
  const auto bias = read_shaped(metrics.id(), "bias", {n});
  const auto rmse = read_shaped(metrics.id(), "root_mean_square_error", {n});
  const auto nse = read_shaped(metrics.id(), "nash_sutcliffe", {n});
  const auto kge = read_shaped(metrics.id(), "kling_gupta", {n});
  for (std::size_t i = 0; i < n; ++i) {
    comparison.metrics.push_back({names[i], quantities[i], units[i], depth[i], static_cast<int>(used[i]),
                                  static_cast<int>(beyond[i]), static_cast<int>(outside[i]), bias[i], rmse[i], nse[i],
                                  kge[i]});
  }
  record.sensor_comparison = std::move(comparison);
}

void read_statistics(hid_t file, solver::RunStatistics& statistics) {
  h5::Group group = h5::open_group(file, "run_statistics");
  const auto count = [&](std::string_view name) -> long {
    std::vector<std::size_t> dims;
    return static_cast<long>(h5::read_integers(group.id(), name, 0, dims).at(0));
  };
  statistics.steps = count("steps");
  statistics.residual_evaluations = count("residual_evaluations");
  statistics.jacobian_evaluations = count("jacobian_evaluations");
  statistics.nonlinear_iterations = count("nonlinear_iterations");
  statistics.nonlinear_failures = count("nonlinear_failures");
  statistics.error_test_failures = count("error_test_failures");
  statistics.surface_switches = count("surface_switches");
  statistics.bottom_switches = count("bottom_switches");
}

void require_run_record(hid_t file) {
  if (!h5::has_attribute(file, ".", "record_format"))
    throw h5::Error("an HDF5 file, but not a wetfront run record (no root attribute 'record_format')");
  const std::string format = h5::get_text_attribute(file, ".", "record_format");
  if (format != kRecordFormat)
    throw h5::Error(fmt::format("an HDF5 file, but not a wetfront run record (record_format is '{}', expected '{}')",
                                format, kRecordFormat));
  const int version = h5::get_int_attribute(file, ".", "record_format_version");
  // Version 1 kept the profiles in /profiles and attached datasets to scales in other groups,
  // which netCDF readers refuse; it is not read (run the site again to write the current layout).
  if (version != kRecordFormatVersion)
    throw h5::Error(
        fmt::format("the file has run record layout version {}; this program reads only version {} ({}). "
                    "Run the site again with this program to write it in the current layout",
                    version, kRecordFormatVersion,
                    version < kRecordFormatVersion ? "the netCDF/CF layout" : "a newer program wrote it"));
}

}  // namespace

RunRecord read_run(const std::filesystem::path& path, ProfileReading profiles) {
  const auto failure = [&](std::string_view cause) {
    return RunFileError(fmt::format("cannot read run record '{}': {}", path.string(), cause));
  };
  std::error_code status;
  if (std::filesystem::is_directory(path, status)) throw failure("is a folder, not a run file");
  if (!std::filesystem::is_regular_file(path, status)) throw failure("no such file");
  h5::QuietErrors quiet;
  if (H5Fis_hdf5(path.c_str()) <= 0) throw failure("not an HDF5 file");
  try {
    h5::File file = h5::open_file_read_only(path.string());
    require_run_record(file.id());
    RunRecord record;
    read_root_attributes(file.id(), record);
    const std::vector<double> times = read_vector(file.id(), "time");
    read_profiles(file.id(), record.run, times, profiles);
    read_balance(file.id(), record, times);
    read_visits(file.id(), record);
    {
      h5::Group inputs = h5::open_group(file.id(), "inputs");
      read_layers(inputs.id(), record.layers);
      read_forcing(inputs.id(), record.forcing);
    }
    read_sensors(file.id(), record.sensors);
    read_sensor_comparison(file.id(), record);
    read_field_checks(file.id(), record);
    read_statistics(file.id(), record.run.statistics);
    return record;
  } catch (const std::exception& error) {
    throw failure(error.what());
  }
}

}  // namespace wetfront::profiles
