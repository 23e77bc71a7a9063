#include "wetfront/soils/layers.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

LayeredProfile::LayeredProfile(std::vector<SoilLayer> layers) : layers_(std::move(layers)) {
  if (layers_.empty()) throw base::InputError("a soil profile needs at least one layer");
  double expected_top = 0.0;
  for (const auto& layer : layers_) {
    if (!std::isfinite(layer.top_depth_cm) || !std::isfinite(layer.bottom_depth_cm))
      throw base::InputError(fmt::format("layer '{}' has a depth that is not a finite number (top {} cm, bottom {} cm)",
                                         layer.name, layer.top_depth_cm, layer.bottom_depth_cm));
    if (layer.top_depth_cm != expected_top)
      throw base::InputError(fmt::format(
          "layer '{}' starts at {} cm but the layer above ends at {} cm: layers must touch without gaps or overlaps",
          layer.name, layer.top_depth_cm, expected_top));
    if (!(layer.bottom_depth_cm > layer.top_depth_cm))
      throw base::InputError(fmt::format("layer '{}' has bottom {} cm not below its top {} cm", layer.name,
                                         layer.bottom_depth_cm, layer.top_depth_cm));
    expected_top = layer.bottom_depth_cm;
  }
}

std::size_t LayeredProfile::layer_index_at(double depth_cm) const {
  for (std::size_t i = 0; i < layers_.size(); ++i)
    if (depth_cm < layers_[i].bottom_depth_cm) return i;
  return layers_.size() - 1;
}

}  // namespace wetfront::soils
