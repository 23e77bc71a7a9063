// A layered soil profile: contiguous depth intervals from the surface down, each with one
// hydraulic model. Depths are in cm, positive downward from the soil surface.
#pragma once

#include <string>
#include <vector>

#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

struct SoilLayer {
  std::string name;         // user label, e.g. "sandy loam topsoil"
  double top_depth_cm = 0;  // cm, positive downward
  double bottom_depth_cm = 0;
  HydraulicModel model;
};

// Ordered layers that start at 0 cm and touch without gaps or overlaps.
class LayeredProfile {
 public:
  // Throws base::InputError naming the offending layer when the layers are not
  // contiguous from the surface or a layer has zero or negative thickness.
  explicit LayeredProfile(std::vector<SoilLayer> layers);

  const std::vector<SoilLayer>& layers() const { return layers_; }
  double total_depth_cm() const { return layers_.back().bottom_depth_cm; }
  // Index of the layer holding the depth; a depth on an interface belongs to the layer below.
  std::size_t layer_index_at(double depth_cm) const;
  const HydraulicModel& model_at(double depth_cm) const { return layers_[layer_index_at(depth_cm)].model; }

 private:
  std::vector<SoilLayer> layers_;
};

}  // namespace wetfront::soils
