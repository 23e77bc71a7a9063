// Tension disc infiltrometer: unsaturated conductivity near saturation from steady
// infiltration at several negative supply heads on one disc.
//
// Wooding (1968, Water Resour. Res. 4:1259) steady infiltration from a shallow circular
// source of radius r at head h0 into a Gardner (1958) soil, K(h) = Ks exp(alpha h):
//     Q(h0) = pi r^2 K(h0) (1 + 4 / (pi r alpha))                               (1)
// At two heads on the same disc the bracket cancels in the ratio, so
//     alpha = ln(Q1 / Q2) / (h1 - h2)                                           (2)
// for each pair of successive heads, then K(h) from (1) with that alpha, and
//     Ks = K(h_w) exp(-alpha h_w)                                               (3)
// by extrapolating the wettest pair's Gardner curve from its wetter head h_w to h = 0.
// Every value carries the head range it rests on: the model holds only piecewise.
#pragma once

#include <span>
#include <vector>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

struct DiscFlow {
  double supply_head_cm = 0.0;           // h0 at the disc, cm (negative)
  double steady_inflow_cm3_per_d = 0.0;  // Q, cm3/d (positive into the soil)
};

struct HeadRange {
  double drier_head_cm = 0.0;
  double wetter_head_cm = 0.0;
};

// Gardner alpha between two successive heads, eq. (2).
struct PairSlope {
  HeadRange heads;
  double alpha_per_cm = 0.0;
};

// K at one supply head, eq. (1), with the alpha of the pair named in `alpha_from`.
struct HeadConductivity {
  double supply_head_cm = 0.0;
  double conductivity_cm_per_d = 0.0;
  HeadRange alpha_from;
};

struct DiscResult {
  std::vector<PairSlope> pairs;                  // from driest to wettest pair
  std::vector<HeadConductivity> conductivities;  // one per head, driest first
  double saturated_conductivity_cm_per_d = 0.0;  // Ks, eq. (3)
  HeadRange saturated_from;                      // the wettest pair
};

// Steady flow predicted by eq. (1) for a Gardner soil; used for synthetic data and checks.
double disc_inflow(double supply_head_cm, double disc_radius_cm, double saturated_conductivity_cm_per_d,
                   double alpha_per_cm);

// Analyses flows at two or more distinct negative heads (any order; sorted inside).
// Throws base::InputError for fewer than two heads, a head >= 0, a repeated head, a
// non-positive disc radius or flow, or a flow that does not increase toward the wetter
// head (alpha <= 0: the Gardner model cannot describe it).
DiscResult analyse_disc(std::span<const DiscFlow> flows, double disc_radius_cm);

}  // namespace wetfront::soils
