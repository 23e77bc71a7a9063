// The Result object: one season's profiles, balance, per-visit balance, sensor comparison
// and recharge estimates as numpy arrays (dicts of arrays). Units: cm, days, cm3/cm3, cm/d;
// fluxes positive downward; times are days since the run start (Result.run_start).
#include <cmath>
#include <limits>
#include <string>
#include <vector>

#include <pybind11/numpy.h>
#include <pybind11/stl.h>

#include "bindings.hpp"

namespace wetfront::python {
namespace {

using Array = py::array_t<double>;

template <class Item, class Get>
Array column(const std::vector<Item>& items, Get get) {
  Array a(static_cast<py::ssize_t>(items.size()));
  auto out = a.mutable_unchecked<1>();
  for (std::size_t i = 0; i < items.size(); ++i) out(static_cast<py::ssize_t>(i)) = get(items[i]);
  return a;
}

Array vector_array(const std::vector<double>& v) {
  return column(v, [](double x) { return x; });
}

// rows x columns from one vector per item (profiles over time, plane fluxes over time).
template <class Item, class Get>
Array matrix(const std::vector<Item>& items, std::size_t columns, Get get) {
  Array a({static_cast<py::ssize_t>(items.size()), static_cast<py::ssize_t>(columns)});
  auto out = a.mutable_unchecked<2>();
  for (std::size_t i = 0; i < items.size(); ++i) {
    const std::vector<double>& row = get(items[i]);
    for (std::size_t j = 0; j < columns; ++j)
      out(static_cast<py::ssize_t>(i), static_cast<py::ssize_t>(j)) =
          j < row.size() ? row[j] : std::numeric_limits<double>::quiet_NaN();
  }
  return a;
}

const solver::ColumnRun& run_of(const Result& r) { return r.season.record.run; }

py::dict profile_arrays(const Result& r) {
  const auto& run = run_of(r);
  const auto& p = run.profiles;
  const std::size_t cells = run.cell_depths_cm.size(), faces = run.face_depths_cm.size();
  py::dict d;
  d["time"] = column(p, [](const auto& s) { return s.time_days; });
  d["cell_depth"] = vector_array(run.cell_depths_cm);
  d["face_depth"] = vector_array(run.face_depths_cm);
  d["head"] = matrix(
      p, cells, [](const auto& s) -> const auto& { return s.head_cm; });
  d["water_content"] = matrix(
      p, cells, [](const auto& s) -> const auto& { return s.water_content; });
  d["conductivity"] = matrix(
      p, cells, [](const auto& s) -> const auto& { return s.conductivity_cm_per_d; });
  d["root_uptake"] = matrix(
      p, cells, [](const auto& s) -> const auto& { return s.sink_rate_per_day; });
  d["flux"] = matrix(
      p, faces, [](const auto& s) -> const auto& { return s.face_flux_cm_per_d; });
  d["ponded_depth"] = column(p, [](const auto& s) { return s.ponded_depth_cm; });
  return d;
}

// The amounts the cumulative balance rows and the visit intervals share (cm, fluxes positive
// downward), one column each, and the flux across each recharge plane.
template <class Row>
void add_flux_columns(py::dict& d, const std::vector<Row>& rows, std::size_t planes) {
  d["water_input"] = column(rows, [](const auto& x) { return x.water_input_cm; });
  d["potential_evaporation"] = column(rows, [](const auto& x) { return x.potential_evaporation_cm; });
  d["actual_evaporation"] = column(rows, [](const auto& x) { return x.actual_evaporation_cm; });
  d["runoff"] = column(rows, [](const auto& x) { return x.runoff_cm; });
  d["infiltration"] = column(rows, [](const auto& x) { return x.infiltration_cm; });
  d["transpiration"] = column(rows, [](const auto& x) { return x.transpiration_cm; });
  d["bottom_flux"] = column(rows, [](const auto& x) { return x.bottom_flux_cm; });
  d["plane_flux"] = matrix(
      rows, planes, [](const auto& x) -> const auto& { return x.plane_flux_cm; });
}

py::dict balance_arrays(const Result& r) {
  const auto& b = run_of(r).balances;
  const std::size_t planes = r.season.record.flux_plane_depths_cm.size();
  py::dict d;
  d["time"] = column(b, [](const auto& x) { return x.time_days; });
  add_flux_columns(d, b, planes);
  d["ponded_depth"] = column(b, [](const auto& x) { return x.ponded_depth_cm; });
  d["soil_storage"] = column(b, [](const auto& x) { return x.soil_storage_cm; });
  d["balance_error"] = column(b, [](const auto& x) { return x.balance_error_cm; });
  return d;
}

// Season totals, cm: the cumulative balance at the last output time.
py::dict season_totals(const Result& r) {
  const auto& b = run_of(r).balances;
  py::dict d;
  if (b.empty()) return d;
  const auto& first = b.front();
  const auto& last = b.back();
  d["end_day"] = last.time_days;
  d["water_input"] = last.water_input_cm;
  d["potential_evaporation"] = last.potential_evaporation_cm;
  d["actual_evaporation"] = last.actual_evaporation_cm;
  d["runoff"] = last.runoff_cm;
  d["infiltration"] = last.infiltration_cm;
  d["transpiration"] = last.transpiration_cm;
  d["bottom_flux"] = last.bottom_flux_cm;
  d["storage_change"] = last.soil_storage_cm - first.soil_storage_cm;
  d["ponded_change"] = last.ponded_depth_cm - first.ponded_depth_cm;
  d["balance_error"] = last.balance_error_cm;
  d["recharge"] = last.plane_flux_cm.empty() ? std::nan("") : last.plane_flux_cm.front();
  return d;
}

py::dict visit_arrays(const Result& r) {
  const auto& v = r.season.record.visit_balance;
  const std::size_t planes = r.season.record.flux_plane_depths_cm.size();
  py::dict d;
  d["start_day"] = column(v, [](const auto& x) { return x.start_day; });
  d["end_day"] = column(v, [](const auto& x) { return x.end_day; });
  add_flux_columns(d, v, planes);
  d["recharge"] = column(v, [](const auto& x) { return x.plane_flux_cm.empty() ? std::nan("") : x.plane_flux_cm[0]; });
  d["ponded_change"] = column(v, [](const auto& x) { return x.ponded_change_cm; });
  d["storage_change"] = column(v, [](const auto& x) { return x.storage_change_cm; });
  d["balance_error_change"] = column(v, [](const auto& x) { return x.balance_error_change_cm; });
  return d;
}

py::dict readings_arrays(const std::vector<profiles::ComparedReading>& readings) {
  py::dict d;
  std::vector<std::string> sensors;
  std::vector<bool> used;
  for (const auto& x : readings) {
    sensors.push_back(x.sensor);
    used.push_back(x.used);
  }
  d["sensor"] = py::array(py::cast(sensors));
  d["time"] = column(readings, [](const auto& x) { return x.time_days; });
  d["depth"] = column(readings, [](const auto& x) { return x.depth_cm; });
  d["observed"] = column(readings, [](const auto& x) { return x.observed; });
  d["simulated"] = column(readings, [](const auto& x) { return x.simulated; });
  d["used"] = py::array_t<bool>(py::cast(used));
  return d;
}

py::object comparison(const Result& r) {
  const auto& c = r.season.record.sensor_comparison;
  if (!c) return py::none();
  py::list metrics;
  for (const auto& m : c->metrics) {
    py::dict row;
    row["name"] = m.name;
    row["quantity"] = m.quantity;
    row["unit"] = m.unit;
    row["depth"] = m.depth_cm;
    row["readings_used"] = m.readings_used;
    row["left_out_beyond_working_limit"] = m.left_out_beyond_working_limit;
    row["left_out_outside_run"] = m.left_out_outside_run;
    row["bias"] = m.bias;
    row["root_mean_square_error"] = m.root_mean_square_error;
    row["nash_sutcliffe"] = m.nash_sutcliffe;
    row["kling_gupta"] = m.kling_gupta;
    metrics.append(row);
  }
  py::dict d;
  d["pressure_head"] = readings_arrays(c->pressure_head);
  d["water_content"] = readings_arrays(c->water_content);
  d["metrics"] = metrics;
  return d;
}

// Per visit interval the model's drainage beside a field estimate; estimate NaN where missing.
py::dict estimate_arrays(const std::vector<site::EstimateInterval>& intervals) {
  py::dict d;
  d["start_day"] = column(intervals, [](const auto& x) { return x.start_day; });
  d["end_day"] = column(intervals, [](const auto& x) { return x.end_day; });
  d["model"] = column(intervals, [](const auto& x) { return x.model_cm; });
  d["estimate"] = column(intervals, [](const auto& x) { return x.estimate_cm.value_or(std::nan("")); });
  return d;
}

py::dict estimates(const Result& r) {
  py::dict d;
  const auto& s = r.season.sensors;
  d["darcy"] = s.darcy ? py::object(estimate_arrays(s.darcy->intervals)) : py::none();
  d["water_table"] = s.water_table ? py::object(estimate_arrays(s.water_table->intervals)) : py::none();
  return d;
}

}  // namespace

void bind_result(py::module_& m) {
  py::class_<Result>(m, "Result", "One season run: arrays in cm, days, cm3/cm3; fluxes positive downward.")
      .def_property_readonly("complete", [](const Result& r) { return r.season.complete; })
      .def_property_readonly("failure",
                             [](const Result& r) -> py::object {
                               const auto& f = run_of(r).failure;
                               return f ? py::str(f->reason) : py::object(py::none());
                             })
      .def_property_readonly("notes", [](const Result& r) { return r.season.season.notes; })
      .def_property_readonly("run_start", [](const Result& r) { return r.season.record.run_start_date; })
      .def_property_readonly("recharge_plane_depths",
                             [](const Result& r) { return vector_array(r.season.record.flux_plane_depths_cm); })
      .def_property_readonly("profiles", &profile_arrays,
                             "time (d), cell_depth, face_depth (cm); head (cm), water_content, conductivity (cm/d), "
                             "root_uptake (1/d): time x cell; flux (cm/d): time x face")
      .def_property_readonly("balance", &balance_arrays, "Cumulative balance at each output time, cm")
      .def_property_readonly("season", &season_totals, "Season totals, cm; recharge across the first plane")
      .def_property_readonly("visits", &visit_arrays, "Balance per visit interval, cm")
      .def_property_readonly("sensor_comparison", &comparison,
                             "Observed beside simulated per reading, and the fit metrics; None without sensors")
      .def_property_readonly("recharge_estimates", &estimates,
                             "Per visit interval the model's recharge beside the Darcy and water-table estimates");
}

}  // namespace wetfront::python
