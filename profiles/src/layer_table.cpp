#include "wetfront/profiles/layer_table.hpp"

#include <type_traits>
#include <variant>

namespace wetfront::profiles {

namespace {

std::vector<LayerParameter> van_genuchten_parameters(const soils::VanGenuchtenMualem& model) {
  return {{"residual_water_content", model.residual_water_content, "cm3/cm3"},
          {"saturated_water_content", model.saturated_water_content, "cm3/cm3"},
          {"alpha", model.alpha_per_cm, "1/cm"},
          {"n", model.n, "1"},
          {"saturated_conductivity", model.saturated_conductivity_cm_per_d, "cm/d"},
          {"pore_connectivity", model.pore_connectivity, "1"}};
}

struct ModelTable {
  std::string name;
  std::vector<LayerParameter> parameters;
};

ModelTable tabulate(const soils::HydraulicModel& model) {
  return std::visit(
      [](const auto& m) -> ModelTable {
        using Model = std::decay_t<decltype(m)>;
        if constexpr (std::is_same_v<Model, soils::VanGenuchtenMualem>) {
          return {"van Genuchten-Mualem", van_genuchten_parameters(m)};
        } else if constexpr (std::is_same_v<Model, soils::VanGenuchtenAirEntry>) {
          ModelTable table{"van Genuchten-Mualem with air-entry head", van_genuchten_parameters(m.base)};
          table.parameters.push_back({"air_entry_head", m.air_entry_head_cm, "cm"});
          return table;
        } else if constexpr (std::is_same_v<Model, soils::BrooksCorey>) {
          return {"Brooks-Corey-Burdine",
                  {{"residual_water_content", m.residual_water_content, "cm3/cm3"},
                   {"saturated_water_content", m.saturated_water_content, "cm3/cm3"},
                   {"bubbling_head", m.bubbling_head_cm, "cm"},
                   {"pore_size_index", m.pore_size_index, "1"},
                   {"saturated_conductivity", m.saturated_conductivity_cm_per_d, "cm/d"}}};
        } else {
          static_assert(std::is_same_v<Model, soils::GardnerExponential>);
          return {"Gardner exponential",
                  {{"residual_water_content", m.residual_water_content, "cm3/cm3"},
                   {"saturated_water_content", m.saturated_water_content, "cm3/cm3"},
                   {"sorptive_number", m.sorptive_number_per_cm, "1/cm"},
                   {"saturated_conductivity", m.saturated_conductivity_cm_per_d, "cm/d"}}};
        }
      },
      model);
}

}  // namespace

std::vector<LayerDescription> describe_layers(const soils::LayeredProfile& profile) {
  std::vector<LayerDescription> table;
  for (const soils::SoilLayer& layer : profile.layers()) {
    ModelTable model = tabulate(layer.model);
    table.push_back({layer.name, layer.top_depth_cm, layer.bottom_depth_cm, std::move(model.name),
                     std::move(model.parameters)});
  }
  return table;
}

}  // namespace wetfront::profiles
