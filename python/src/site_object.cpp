// wetfront.load_site and the Site object: read and change soil, crop and boundary values, run.
//
// Values are in the library's internal units (docs/site-file.md): conductivity cm/d, alpha
// 1/cm, heads and depths cm, water contents cm3/cm3. A change goes through the same checks as
// a parameter study (site::with_parameters), so an unphysical value raises InputError.
#include <optional>
#include <string>
#include <variant>

#include <fmt/format.h>
#include <pybind11/stl.h>
#include <pybind11/stl/filesystem.h>

#include "bindings.hpp"
#include "wetfront/base/did_you_mean.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/forcing/pan_coefficient.hpp"
#include "wetfront/site/adjustable_parameters.hpp"
#include "wetfront/soils/model_parameters.hpp"

namespace wetfront::python {
namespace {

using Kind = site::ParameterTarget::Kind;
using LayerChoice = std::variant<std::size_t, std::string>;

std::size_t layer_index(const site::SiteSetup& setup, const LayerChoice& layer) {
  if (const auto* index = std::get_if<std::size_t>(&layer)) {
    if (*index >= setup.layers.size())
      throw py::index_error(fmt::format("layer {}: the site has {} layers", *index, setup.layers.size()));
    return *index;
  }
  const auto& name = std::get<std::string>(layer);
  std::vector<std::string> names;
  for (std::size_t i = 0; i < setup.layers.size(); ++i) {
    if (setup.layers[i].name == name) return i;
    names.push_back(fmt::format("'{}'", setup.layers[i].name));
  }
  throw py::key_error(fmt::format("no layer '{}'; the layers are {}", name, fmt::join(names, ", ")));
}

std::optional<Kind> site_kind(const std::string& key) {
  if (key == "kc_initial") return Kind::kc_initial;
  if (key == "kc_mid") return Kind::kc_mid;
  if (key == "kc_end") return Kind::kc_end;
  if (key == "pan_coefficient") return Kind::pan_coefficient;
  if (key == "water_table_depth") return Kind::water_table_depth;
  return std::nullopt;
}

const char* kSiteKeysText = "kc_initial, kc_mid, kc_end, pan_coefficient, water_table_depth";

std::string soil_keys_text(const soils::HydraulicModel& model) {
  std::vector<std::string_view> keys;
  for (const auto& p : soils::model_parameters(model)) keys.push_back(p.key);
  return fmt::format("{}", fmt::join(keys, ", "));
}

double get_value(const site::SiteSetup& setup, const std::string& key, const std::optional<LayerChoice>& layer) {
  if (layer) {
    const auto& model = setup.layers[layer_index(setup, *layer)].model;
    if (const double* value = soils::parameter_value(model, key)) return *value;
    throw py::key_error(fmt::format("'{}' is not a parameter of this layer's model; it has {}", key, soil_keys_text(model)));
  }
  const auto kind = site_kind(key);
  if (!kind) throw py::key_error(fmt::format("no site value '{}'; without a layer the keys are {}", key, kSiteKeysText));
  switch (*kind) {
    case Kind::kc_initial: return setup.crop.kc_curve.kc_initial;
    case Kind::kc_mid: return setup.crop.kc_curve.kc_mid;
    case Kind::kc_end: return setup.crop.kc_curve.kc_end;
    case Kind::pan_coefficient: return forcing::pan_coefficient(setup.pan.coefficient);
    case Kind::water_table_depth: {
      const auto* fixed = std::get_if<solver::FixedHead>(&setup.bottom);
      if (!fixed) throw py::key_error("the column bottom is not a water table: there is no water_table_depth");
      return setup.layers.back().bottom_depth_cm - fixed->head_cm;
    }
    case Kind::soil: break;
  }
  throw std::logic_error("unhandled site value");
}

void set_value(site::SiteSetup& setup, const std::string& key, double value, const std::optional<LayerChoice>& layer) {
  (void)get_value(setup, key, layer);  // the key must exist
  site::StudyParameter parameter;
  parameter.range.name = key;
  if (layer) {
    parameter.target.kind = Kind::soil;
    parameter.target.layer = layer_index(setup, *layer);
    parameter.target.soil_key = key;
  } else {
    parameter.target.kind = *site_kind(key);
  }
  site::ParameterStudy study;
  study.parameters.push_back(parameter);
  setup = site::with_parameters(setup, study, {value});
}

py::dict layer_dict(const soils::SoilLayer& layer) {
  py::dict parameters, units;
  for (const auto& p : soils::model_parameters(layer.model)) {
    parameters[py::str(std::string(p.key))] = *soils::parameter_value(layer.model, p.key);
    units[py::str(std::string(p.key))] = std::string(p.unit);
  }
  py::dict d;
  d["name"] = layer.name;
  d["top_depth_cm"] = layer.top_depth_cm;
  d["bottom_depth_cm"] = layer.bottom_depth_cm;
  d["model"] = std::string(soils::model_name(layer.model));
  d["parameters"] = parameters;
  d["units"] = units;
  return d;
}

}  // namespace

py::class_<Site> bind_site(py::module_& m) {
  py::class_<Site> site_class(m, "Site", "A loaded site file. Values in cm, days, cm3/cm3; change them with set().");
  site_class.def_property_readonly("file", [](const Site& s) { return s.setup.site_file.string(); })
      .def_property_readonly("name", [](const Site& s) { return s.setup.name; })
      .def_property_readonly("run_start", [](const Site& s) { return s.setup.run_start_text; })
      .def_property_readonly("run_end", [](const Site& s) { return s.setup.run_end_text; })
      .def_property_readonly("visit_days", [](const Site& s) { return s.setup.visit_days; })
      .def_property_readonly("layer_names",
                             [](const Site& s) {
                               std::vector<std::string> names;
                               for (const auto& l : s.setup.layers) names.push_back(l.name);
                               return names;
                             })
      .def_property_readonly("layers",
                             [](const Site& s) {
                               py::list layers;
                               for (const auto& l : s.setup.layers) layers.append(layer_dict(l));
                               return layers;
                             },
                             "Each layer: name, depths, model, parameters {key: value} and their units (a copy).")
      .def_property_readonly("crop", [](const Site& s) { return s.setup.crop.name; })
      .def_property_readonly("bottom", [](const Site& s) { return s.setup.bottom_text; })
      .def_property_readonly("initial", [](const Site& s) { return s.setup.initial_text; })
      .def("get", [](const Site& s, const std::string& key, const std::optional<LayerChoice>& layer) { return get_value(s.setup, key, layer); }, py::arg("key"), py::arg("layer") = py::none(),
           "A layer's model parameter (layer index or name), or without a layer one of kc_initial, kc_mid, kc_end, pan_coefficient, water_table_depth.")
      .def("set", [](Site& s, const std::string& key, double value, const std::optional<LayerChoice>& layer) { set_value(s.setup, key, value, layer); }, py::arg("key"), py::arg("value"), py::arg("layer") = py::none(),
           "Changes a value as get() names it; raises InputError for an unphysical one.")
      .def("copy", [](const Site& s) { return Site{s.setup}; })
      .def(
          "run",
          [](const Site& s) {
            const site::SiteSetup setup = s.setup;  // another Python thread may change `s` meanwhile
            py::gil_scoped_release release;
            return Result{site::run_season(setup, WETFRONT_VERSION)};
          },
          "Runs the season and checks it against the sensor readings.")
      .def("__repr__", [](const Site& s) {
        return fmt::format("<wetfront.Site '{}' {} layers, {} to {}>", s.setup.name, s.setup.layers.size(),
                           s.setup.run_start_text, s.setup.run_end_text);
      });

  m.def(
      "load_site",
      [](const std::filesystem::path& file, const std::string& start, const std::string& end) {
        site::PeriodOverride period{start, end};
        return Site{site::load_site_file(file, period)};
      },
      py::arg("file"), py::arg("start") = "", py::arg("end") = "",
      "Reads a site file (raises InputError with file, line and key); start/end: ISO dates to run another period.");
  return site_class;
}

}  // namespace wetfront::python
