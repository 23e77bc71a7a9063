// Writes the parts of a RunRecord other than the profiles as netCDF-4 (HDF5 with netCDF-4's
// rules) following the CF conventions: root attributes, then one group per part of the record,
// each with its own coordinates (layout in docs/hdf5-layout.md). The profiles and their
// coordinates at the root come first, from run_file_stream.cpp.
#include <fmt/format.h>

#include "cf_variables.hpp"
#include "field_checks_io.hpp"
#include "hdf5_io.hpp"
#include "layout.hpp"
#include "run_file_parts.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/time_axis.hpp"

namespace wetfront::profiles {

namespace {

namespace h5 = hdf5;

// The run's time and depth axes. Each group holds its own copy of the coordinates its
// variables use, so that a reader opening one group (xarray.open_dataset(path, group=...))
// finds them there; the root holds those of the profiles.
struct Axes {
  std::string time_units;
  std::vector<double> times;
  std::vector<double> interval_ends;  // end of each visit interval
};

template <typename Row, typename Value>
std::vector<double> column(const std::vector<Row>& rows, Value Row::*member) {
  std::vector<double> values;
  values.reserve(rows.size());
  for (const Row& row : rows) values.push_back(static_cast<double>(row.*member));
  return values;
}

using cf::set_depth_attributes;
using cf::write_depth_axis;
using cf::write_time_axis;
using cf::write_times;

void write_root_attributes(hid_t file, const RunRecord& record) {
  h5::set_text_attribute(file, ".", "Conventions", kConventions);
  h5::set_text_attribute(file, ".", "title", fmt::format("wetfront run record of {}", record.site_name));
  h5::set_text_attribute(file, ".", "source", fmt::format("wetfront {}", record.program_version));
  h5::set_identity_attributes(file, {kRecordFormat, kRecordFormatVersion, record.program_version, record.site_name,
                                     record.run_start_date, record.input_hash, record.run_id});
  h5::set_int_attribute(file, ".", "complete", record.run.complete ? 1 : 0);
  if (record.run.failure) {
    h5::set_double_attribute(file, ".", "failure_time_days", record.run.failure->time_days);
    h5::set_double_attribute(file, ".", "failure_depth_cm", record.run.failure->depth_cm);
    h5::set_text_attribute(file, ".", "failure_reason", record.run.failure->reason);
  }
  h5::set_text_attribute(file, ".", "sign_convention", layout::kSignConvention);
}

Axes axes_of(const RunRecord& record) {
  return {days_since_units(record.run_start_date), column(record.run.balances, &solver::CumulativeBalance::time_days),
          column(record.visit_balance, &IntervalBalance::end_day)};
}

h5::Dataset write_output_times(hid_t parent, const Axes& axes) {
  return write_time_axis(parent, "time", axes.times, axes.time_units, "output time");
}

h5::Dataset write_interval_ends(hid_t parent, const Axes& axes) {
  return write_time_axis(parent, "interval_end", axes.interval_ends, axes.time_units, "end of the visit interval");
}

h5::Dataset write_plane_depths(hid_t parent, const RunRecord& record) {
  return write_depth_axis(parent, "plane_depth", record.flux_plane_depths_cm, "depth of the flux plane");
}

void write_balance(hid_t file, const RunRecord& record, const Axes& axes) {
  const solver::ColumnRun& run = record.run;
  h5::Group group = h5::create_group(file, "balance");
  const h5::Dataset time = write_output_times(group.id(), axes);
  const h5::Dataset plane_depth = write_plane_depths(group.id(), record);
  for (const layout::CumulativeTerm& term : layout::kCumulativeTerms) {
    h5::Dataset dataset =
        h5::write_vector(group.id(), term.name, column(run.balances, term.member), {"cm", term.long_name});
    h5::attach_dimension_scale(dataset, time, 0);
  }
  const std::size_t planes = record.flux_plane_depths_cm.size();
  std::vector<double> matrix;
  for (const solver::CumulativeBalance& row : run.balances)
    matrix.insert(matrix.end(), row.plane_flux_cm.begin(), row.plane_flux_cm.end());
  h5::Dataset plane_flux =
      h5::write_matrix(group.id(), "plane_flux", run.balances.size(), planes, matrix,
                       {"cm", "flow across the flux plane since the run start (positive downward)"});
  h5::attach_dimension_scale(plane_flux, time, 0);
  h5::attach_dimension_scale(plane_flux, plane_depth, 1);
}

void write_visits(hid_t file, const RunRecord& record, const Axes& axes) {
  h5::Group group = h5::create_group(file, "visits");
  write_time_axis(group.id(), "visit_time", record.visit_days, axes.time_units, "field visit");
  const h5::Dataset interval_end = write_interval_ends(group.id(), axes);
  const h5::Dataset plane_depth = write_plane_depths(group.id(), record);
  const std::vector<IntervalBalance>& rows = record.visit_balance;
  h5::Dataset interval_start = write_times(group.id(), "interval_start", column(rows, &IntervalBalance::start_day),
                                           axes.time_units, "start of the visit interval");
  h5::attach_dimension_scale(interval_start, interval_end, 0);
  for (const layout::IntervalTerm& term : layout::kIntervalTerms) {
    h5::Dataset dataset = h5::write_vector(group.id(), term.name, column(rows, term.member), {"cm", term.long_name});
    h5::attach_dimension_scale(dataset, interval_end, 0);
  }
  const std::size_t planes = record.flux_plane_depths_cm.size();
  std::vector<double> matrix;
  for (const IntervalBalance& row : rows)
    matrix.insert(matrix.end(), row.plane_flux_cm.begin(), row.plane_flux_cm.end());
  h5::Dataset plane_flux = h5::write_matrix(group.id(), "plane_flux", rows.size(), planes, matrix,
                                            {"cm", "flow across the flux plane in the interval (positive downward)"});
  h5::attach_dimension_scale(plane_flux, interval_end, 0);
  h5::attach_dimension_scale(plane_flux, plane_depth, 1);
}

void write_layers(hid_t inputs, const std::vector<LayerDescription>& layers) {
  h5::Group group = h5::create_group(inputs, "layers");
  const h5::Dataset layer = h5::make_named_dimension(group.id(), "layer", layers.size());
  const auto along_layers = [&](const h5::Dataset& dataset) { h5::attach_dimension_scale(dataset, layer, 0); };
  h5::Dataset top = h5::write_vector(group.id(), "top_depth", column(layers, &LayerDescription::top_depth_cm),
                                     {"cm", "depth of the top of the layer"});
  set_depth_attributes(top);
  along_layers(top);
  h5::Dataset bottom = h5::write_vector(group.id(), "bottom_depth", column(layers, &LayerDescription::bottom_depth_cm),
                                        {"cm", "depth of the bottom of the layer"});
  set_depth_attributes(bottom);
  along_layers(bottom);
  std::vector<std::string> names;
  std::vector<std::string> models;
  std::vector<std::int64_t> parameter_layer;
  std::vector<std::string> parameter_names;
  std::vector<double> parameter_values;
  std::vector<std::string> parameter_units;
  for (std::size_t i = 0; i < layers.size(); ++i) {
    names.push_back(layers[i].name);
    models.push_back(layers[i].model_name);
    for (const LayerParameter& parameter : layers[i].parameters) {
      parameter_layer.push_back(static_cast<std::int64_t>(i));
      parameter_names.push_back(parameter.name);
      parameter_values.push_back(parameter.value);
      parameter_units.push_back(parameter.unit);
    }
  }
  along_layers(h5::write_texts(group.id(), "name", names, {"", "layer name"}));
  along_layers(h5::write_texts(group.id(), "model", models, {"", "hydraulic property model"}));
  const h5::Dataset parameter = h5::make_named_dimension(group.id(), "parameter", parameter_names.size());
  const auto along_parameters = [&](const h5::Dataset& dataset) { h5::attach_dimension_scale(dataset, parameter, 0); };
  along_parameters(h5::write_integers(group.id(), "parameter_layer", parameter_layer,
                                      {"1", "index (from 0) of the layer the parameter belongs to"}));
  along_parameters(h5::write_texts(group.id(), "parameter_name", parameter_names, {"", "hydraulic parameter name"}));
  // One variable holds values of several units, so it has no `units`; parameter_unit gives each.
  along_parameters(h5::write_vector(group.id(), "parameter_value", parameter_values,
                                    {"", "hydraulic parameter value, in the unit given by parameter_unit"}));
  along_parameters(
      h5::write_texts(group.id(), "parameter_unit", parameter_units, {"", "unit of the hydraulic parameter"}));
}

void write_forcing(hid_t inputs, const std::vector<ForcingInterval>& forcing, const std::string& time_units) {
  h5::Group group = h5::create_group(inputs, "forcing");
  h5::Dataset start = write_time_axis(group.id(), "interval_start", column(forcing, &ForcingInterval::start_day),
                                      time_units, "start of the forcing interval");
  h5::attach_dimension_scale(write_times(group.id(), "interval_end", column(forcing, &ForcingInterval::end_day),
                                         time_units, "end of the forcing interval"),
                             start, 0);
  h5::attach_dimension_scale(
      h5::write_vector(group.id(), "water_input", column(forcing, &ForcingInterval::water_input_cm_per_d),
                       {"cm/d", "rain and irrigation rate reaching the surface"}),
      start, 0);
  h5::attach_dimension_scale(h5::write_vector(group.id(), "potential_evaporation",
                                              column(forcing, &ForcingInterval::potential_evaporation_cm_per_d),
                                              {"cm/d", "potential evaporation rate (positive leaving the soil)"}),
                             start, 0);
  h5::attach_dimension_scale(h5::write_vector(group.id(), "potential_transpiration",
                                              column(forcing, &ForcingInterval::potential_transpiration_cm_per_d),
                                              {"cm/d", "potential transpiration rate (positive leaving the soil)"}),
                             start, 0);
}

// Dimension `sensor` with the names as its coordinate; depth is an auxiliary coordinate (two
// sensors may share a depth, and wells and cores have none of their own).
void write_sensors(hid_t file, const std::vector<Sensor>& sensors) {
  h5::Group group = h5::create_group(file, "sensors");
  std::vector<std::string> names;
  for (const Sensor& sensor : sensors) names.push_back(sensor.name);
  h5::Dataset sensor = h5::write_texts(group.id(), "sensor", names, {"", "sensor name"});
  h5::make_coordinate(sensor);
  h5::set_text_attribute(sensor.id(), ".", "coordinates", "depth");  // CF: depth is an auxiliary coordinate
  h5::Dataset depth = h5::write_vector(group.id(), "depth", column(sensors, &Sensor::depth_cm),
                                       {"cm",
                                        "depth of the sensor below the soil surface (0 for an observation well or core "
                                        "samples, whose readings carry their own depths)"});
  set_depth_attributes(depth);
  h5::attach_dimension_scale(depth, sensor, 0);
}

void write_compared(hid_t parent, std::string_view name, const std::vector<ComparedReading>& readings,
                    std::string_view unit, std::string_view quantity, const std::string& time_units) {
  if (readings.empty()) return;
  h5::Group group = h5::create_group(parent, name);
  const h5::Dataset reading = h5::make_named_dimension(group.id(), "reading", readings.size());
  const auto along_readings = [&](const h5::Dataset& dataset) { h5::attach_dimension_scale(dataset, reading, 0); };
  std::vector<std::string> sensors;
  std::vector<std::int64_t> used;
  for (const auto& r : readings) {
    sensors.push_back(r.sensor);
    used.push_back(r.used ? 1 : 0);
  }
  along_readings(h5::write_texts(group.id(), "sensor", sensors, {"", "name of the sensor that took the reading"}));
  along_readings(write_times(group.id(), "time", column(readings, &ComparedReading::time_days), time_units,
                             "time of the reading"));
  h5::Dataset depth = h5::write_vector(group.id(), "depth", column(readings, &ComparedReading::depth_cm),
                                       {"cm", "depth of the sensor below the soil surface"});
  set_depth_attributes(depth);
  along_readings(depth);
  h5::Dataset observed = h5::write_vector(group.id(), "observed", column(readings, &ComparedReading::observed),
                                          {unit, fmt::format("{} from the reading", quantity)});
  h5::Dataset simulated = h5::write_vector(
      group.id(), "simulated", column(readings, &ComparedReading::simulated),
      {unit, fmt::format("simulated {} at the reading's time and depth (NaN outside the run)", quantity)});
  for (const h5::Dataset* values : {&observed, &simulated}) {
    along_readings(*values);
    h5::set_text_attribute(values->id(), ".", "coordinates", "time depth sensor");
  }
  along_readings(h5::write_integers(
      group.id(), "used", used,
      {"1",
       "1 when the reading is in the fit metrics, 0 when left out (beyond the working limit or outside the run)"}));
}

void write_sensor_comparison(hid_t file, const SensorComparisonRecord& comparison, const std::string& time_units) {
  h5::Group group = h5::create_group(file, "sensor_comparison");
  write_compared(group.id(), "pressure_head", comparison.pressure_head, "cm", "pressure head at the cup", time_units);
  write_compared(group.id(), "water_content", comparison.water_content, "cm3/cm3", "water content", time_units);
  h5::Group metrics = h5::create_group(group.id(), "metrics");
  const auto& rows = comparison.metrics;
  const h5::Dataset row = h5::make_named_dimension(metrics.id(), "row", rows.size());
  const auto along_rows = [&](const h5::Dataset& dataset) { h5::attach_dimension_scale(dataset, row, 0); };
  std::vector<std::string> names, quantities, units;
  std::vector<std::int64_t> used, beyond, outside;
  for (const auto& r : rows) {
    names.push_back(r.name);
    quantities.push_back(r.quantity);
    units.push_back(r.unit);
    used.push_back(r.readings_used);
    beyond.push_back(r.left_out_beyond_working_limit);
    outside.push_back(r.left_out_outside_run);
  }
  along_rows(h5::write_texts(metrics.id(), "name", names, {"", "sensor name, or all sensors of one kind pooled"}));
  along_rows(h5::write_texts(metrics.id(), "quantity", quantities, {"", "quantity compared"}));
  along_rows(h5::write_texts(metrics.id(), "unit", units,
                             {"", "unit of the quantity, of bias and of root_mean_square_error"}));
  h5::Dataset depth = h5::write_vector(metrics.id(), "depth", column(rows, &SensorMetrics::depth_cm),
                                       {"cm", "depth of the sensor below the soil surface (NaN for pooled rows)"});
  set_depth_attributes(depth);
  along_rows(depth);
  along_rows(h5::write_integers(metrics.id(), "readings_used", used, {"1", "readings paired with simulated values"}));
  along_rows(h5::write_integers(metrics.id(), "left_out_beyond_working_limit", beyond,
                                {"1", "tensiometer readings beyond the working limit, left out"}));
  along_rows(h5::write_integers(metrics.id(), "left_out_outside_run", outside,
                                {"1", "readings outside the time the run covers, left out"}));
  // Rows of heads and of water contents share these columns, so they carry no `units`; `unit`
  // names each row's.
  along_rows(h5::write_vector(metrics.id(), "bias", column(rows, &SensorMetrics::bias),
                              {"", "mean of simulated minus observed, in the unit given by unit"}));
  along_rows(h5::write_vector(metrics.id(), "root_mean_square_error",
                              column(rows, &SensorMetrics::root_mean_square_error),
                              {"", "root mean square of simulated minus observed, in the unit given by unit"}));
  along_rows(h5::write_vector(metrics.id(), "nash_sutcliffe", column(rows, &SensorMetrics::nash_sutcliffe),
                              {"1", "Nash-Sutcliffe efficiency (NaN when undefined)"}));
  along_rows(h5::write_vector(metrics.id(), "kling_gupta", column(rows, &SensorMetrics::kling_gupta),
                              {"1", "Kling-Gupta efficiency (NaN when undefined)"}));
}

void write_statistics(hid_t file, const solver::RunStatistics& statistics) {
  h5::Group group = h5::create_group(file, "run_statistics");
  const auto count = [&](std::string_view name, long value, std::string_view long_name) {
    h5::write_integer_scalar(group.id(), name, value, {"1", long_name});
  };
  count("steps", statistics.steps, "integration steps taken");
  count("residual_evaluations", statistics.residual_evaluations, "residual function evaluations");
  count("jacobian_evaluations", statistics.jacobian_evaluations, "Jacobian evaluations");
  count("nonlinear_iterations", statistics.nonlinear_iterations, "Newton iterations");
  count("nonlinear_failures", statistics.nonlinear_failures, "Newton convergence failures");
  count("error_test_failures", statistics.error_test_failures, "local error test failures");
  count("surface_switches", statistics.surface_switches,
        "changes between flux-limited, ponded and dry-limit surface conditions");
  count("bottom_switches", statistics.bottom_switches, "seepage face switching on or off");
}

}  // namespace

void write_record_parts(hid_t file, const RunRecord& record) {
  write_root_attributes(file, record);
  const Axes axes = axes_of(record);
  write_balance(file, record, axes);
  write_visits(file, record, axes);
  {
    h5::Group inputs = h5::create_group(file, "inputs");
    write_layers(inputs.id(), record.layers);
    write_forcing(inputs.id(), record.forcing, axes.time_units);
  }
  write_sensors(file, record.sensors);
  if (record.sensor_comparison) write_sensor_comparison(file, *record.sensor_comparison, axes.time_units);
  write_field_checks(file, record, axes.time_units, axes.interval_ends);
  write_statistics(file, record.run.statistics);
  h5::number_dimensions(file);
}

}  // namespace wetfront::profiles
