// A member's soil water as the filter updates it: the water content of every cell. Water
// content is the update variable because stored water is linear in it (an update's change of
// storage is the increment summed over the cells) and its physical range is a plain interval.
#pragma once

#include <span>
#include <vector>

#include "wetfront/soils/layers.hpp"

namespace wetfront::site::detail {

// Analysed heads from analysed water contents: each content held strictly inside
// (theta_r, theta_s) of the cell's soil (within kContentMargin of the range, and no drier than
// kDriestHeadCm), then turned into the head of that content. A cell whose content the update
// left unchanged keeps its forecast head, and so does a saturated cell pushed to or past
// saturation (its positive head carries the water table, which water content cannot tell).
std::vector<double> analysed_heads(const soils::LayeredProfile& soil, std::span<const double> cell_depths_cm,
                                   std::span<const double> forecast_heads_cm, std::span<const double> forecast_contents,
                                   std::span<const double> analysed_contents);

inline constexpr double kContentMargin = 1e-4;  // fraction of theta_s - theta_r
inline constexpr double kDriestHeadCm = -1e6;   // the storage tables resolve heads to about here

}  // namespace wetfront::site::detail
