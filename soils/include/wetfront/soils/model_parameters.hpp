// The parameters of each hydraulic model in one table: the key the site file and the run file
// use, the unit (internal), and where the value lives in the model's value type. Every place
// that reads, writes, adjusts or reports a soil model's parameters goes through this table, so
// that a new model is described once (DEVELOPERS.md, "Adding a soil model").
#pragma once

#include <optional>
#include <span>
#include <string_view>
#include <vector>

#include "wetfront/base/quantity.hpp"
#include "wetfront/soils/hydraulic_models.hpp"

namespace wetfront::soils {

struct ModelParameter {
  std::string_view key;     // e.g. "saturated_conductivity"
  std::string_view unit;    // internal unit: "cm3/cm3", "1/cm", "cm/d", "cm" (a head) or "1"
  std::string_view symbol;  // as reports write it, e.g. "Ks"
  bool optional = false;    // a site file may leave it out; the value type's default stands
};

// The model's published name, e.g. "van Genuchten-Mualem".
std::string_view model_name(const HydraulicModel& model);

// The model's name in a site file's `model = "..."`, e.g. "brooks corey".
std::string_view model_key(const HydraulicModel& model);

// Every model, with the defaults of its value type, in the order of HydraulicModel.
std::vector<HydraulicModel> all_models();

// How a value of the parameter is given at the boundary: the dimension of its unit
// (base/quantity.hpp); empty for a plain number.
std::optional<base::Dimension> parameter_dimension(const ModelParameter& parameter);

// The model's parameters, in the order the run file and the reports list them.
std::span<const ModelParameter> model_parameters(const HydraulicModel& model);

// Every parameter key of any model, each once, in the order of the models in HydraulicModel.
std::vector<std::string_view> all_parameter_keys();

// The value of parameter `key` in `model`; nullptr when the model has no such parameter.
double* parameter_value(HydraulicModel& model, std::string_view key);
const double* parameter_value(const HydraulicModel& model, std::string_view key);

// The driest head at which the model is saturated (Se = 1): the air-entry head h_e (Ippisch,
// Vogel & Bastian 2006) or the bubbling head h_b (Brooks & Corey 1964), 0 cm for the others.
double full_saturation_head(const HydraulicModel& model);

}  // namespace wetfront::soils
