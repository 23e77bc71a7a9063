// Radiation reaching the soil under a canopy decays as exp(-k LAI) (Beer's law); the soil
// takes that share of the evaporative demand (Ritchie 1972).
#include "wetfront/forcing/canopy_split.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

EvapotranspirationSplit split_by_leaf_area(double crop_et, double lai, double k) {
  if (!(lai >= 0)) throw base::InputError(fmt::format("leaf area index {:g}: expected >= 0", lai));
  if (!(k > 0)) throw base::InputError(fmt::format("extinction coefficient {:g}: expected > 0", k));
  const double soil = crop_et * std::exp(-k * lai);
  return {soil, crop_et - soil};
}

EvapotranspirationSplit split_by_soil_cover(double crop_et, double cover) {
  if (!(cover >= 0 && cover <= 1))
    throw base::InputError(fmt::format("soil cover fraction {:g}: expected 0 to 1", cover));
  return {crop_et * (1.0 - cover), crop_et * cover};
}

}  // namespace wetfront::forcing
