// Split of crop evapotranspiration into potential soil evaporation and potential
// transpiration by the share of radiation reaching the soil.
//
// Leaf area index (Beer's law): Ep = ETc exp(-k LAI), Tp = ETc - Ep, after Ritchie (1972,
// Water Resources Research 8(5)), who used k of about 0.4.
// Soil cover fraction: Ep = ETc (1 - cover), Tp = ETc cover.
#pragma once

#include "wetfront/forcing/dated_table.hpp"

namespace wetfront::forcing {

// Extinction coefficient for the Beer's-law split: 0.398 after Ritchie (1972), from memory.
inline constexpr double default_extinction_coefficient = 0.398;

struct EvapotranspirationSplit {
  double soil_evaporation = 0;  // same units as the ETc passed in
  double transpiration = 0;
};

EvapotranspirationSplit split_by_leaf_area(double crop_et, double leaf_area_index, double extinction_coefficient);
EvapotranspirationSplit split_by_soil_cover(double crop_et, double cover_fraction);

struct CanopySplit {
  enum class Method { leaf_area_index, soil_cover };
  Method method = Method::leaf_area_index;
  double extinction_coefficient = default_extinction_coefficient;
  DatedTable leaf_area_index = DatedTable::constant("leaf area index", 0.0);  // m2/m2, always reported
  DatedTable soil_cover = DatedTable::constant("soil cover fraction", 0.0);   // 0..1, Method::soil_cover
};

}  // namespace wetfront::forcing
