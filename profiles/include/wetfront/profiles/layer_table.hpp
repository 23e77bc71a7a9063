// The layer table of a run record, from the soil profile the run used.
#pragma once

#include <vector>

#include "wetfront/profiles/run_record.hpp"
#include "wetfront/soils/layers.hpp"

namespace wetfront::profiles {

// One description per layer: depths, model name and every model parameter with its unit.
std::vector<LayerDescription> describe_layers(const soils::LayeredProfile& profile);

}  // namespace wetfront::profiles
