#include "wetfront/profiles/layer_table.hpp"

#include "wetfront/soils/model_parameters.hpp"

namespace wetfront::profiles {

std::vector<LayerDescription> describe_layers(const soils::LayeredProfile& profile) {
  std::vector<LayerDescription> table;
  for (const soils::SoilLayer& layer : profile.layers()) {
    std::vector<LayerParameter> parameters;
    for (const auto& p : soils::model_parameters(layer.model)) {
      parameters.push_back({std::string(p.key), *soils::parameter_value(layer.model, p.key), std::string(p.unit)});
    }
    table.push_back({layer.name, layer.top_depth_cm, layer.bottom_depth_cm, std::string(soils::model_name(layer.model)),
                     std::move(parameters)});
  }
  return table;
}

}  // namespace wetfront::profiles
