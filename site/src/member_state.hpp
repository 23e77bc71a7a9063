// A member's soil water as the filter updates it: the pressure head of every cell, on the scale
// log10(1 cm + suction).
//
// Why heads and not water contents: the members differ in their soils (the adjustable
// parameters), and at a visit their water contents differ mostly because their retention curves
// do, at nearly the same heads. An update of water content then moves every member towards the
// readings' water contents whether or not its own soil can hold them at the heads the
// tensiometers show; a member whose soil holds less water at a head (a larger van Genuchten n)
// is left far wetter in head than the readings, drains the added water before the next visit,
// and receives it again there. Heads are what the members share, and what moves water (Darcy);
// each member's water content follows from its head through its own retention curve, which is
// also how a probe or core reading is predicted. docs/anchored-season.md gives the evidence.
#pragma once

#include <span>
#include <vector>

#include "wetfront/soils/layers.hpp"

namespace wetfront::site::detail {

// The update variable of a head: log10(1 cm + suction), 0 at and above saturation. Members'
// heads span orders of magnitude in dry soil; on this scale their spread is closer to the
// Gaussian the update assumes.
double log_suction(double head_cm);

// Analysed heads from analysed log suctions: each head held to where the cell's soil (after any
// parameter update) holds a water content strictly inside (theta_r, theta_s) (within
// kContentMargin of the range, and no drier than kDriestHeadCm). A cell whose value the update
// left unchanged keeps its forecast head, and so does a cell at or above saturation that the
// update leaves there (its positive head carries the water table, which suction cannot tell).
std::vector<double> heads_from_log_suction(const soils::LayeredProfile& soil, std::span<const double> cell_depths_cm,
                                           std::span<const double> forecast_heads_cm,
                                           std::span<const double> analysed_log_suction);

inline constexpr double kContentMargin = 1e-4;  // fraction of theta_s - theta_r
inline constexpr double kDriestHeadCm = -1e6;   // the storage tables resolve heads to about here

}  // namespace wetfront::site::detail
