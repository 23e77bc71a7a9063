// Darcy flux across a face between two points of a vertical column, depth d positive down:
//   q = K_face (1 - (h_lower - h_upper) / distance)          (Darcy-Buckingham, q positive down)
// with K_face a mean of the conductivities on either side (FaceConductivity).
#pragma once

#include <cmath>

#include "wetfront/solver/column_problem.hpp"

namespace wetfront::solver::detail {

// One side of a face: head, conductivity, and their slopes with respect to that side's own
// variable (a cell's stored water, or a pond's depth).
struct FaceSide {
  double head_cm;
  double conductivity;         // cm/d
  double head_slope;           // dh / d(variable)
  double conductivity_slope;   // dK / d(variable)
  double potential_slope = 0;  // dPhi / d(variable), for the integral mean
};

struct FaceFlux {
  double flux;         // cm/d, positive downward
  double slope_upper;  // dq / d(upper variable)
  double slope_lower;  // dq / d(lower variable)
};

struct MeanAndSlopes {
  double mean;
  double slope_a;  // d mean / d a
  double slope_b;
};

inline MeanAndSlopes face_mean(FaceConductivity kind, double a, double b) {
  switch (kind) {
    case FaceConductivity::geometric: {
      const double g = std::sqrt(a * b);
      return {g, g > 0 ? 0.5 * g / a : 0.0, g > 0 ? 0.5 * g / b : 0.0};
    }
    case FaceConductivity::harmonic: {
      const double s = a + b;
      if (!(s > 0)) return {0.0, 0.0, 0.0};
      return {2.0 * a * b / s, 2.0 * b * b / (s * s), 2.0 * a * a / (s * s)};
    }
    case FaceConductivity::arithmetic:
    default: return {0.5 * (a + b), 0.5, 0.5};
  }
}

inline FaceFlux darcy_face(FaceConductivity kind, const FaceSide& upper, const FaceSide& lower, double distance_cm) {
  const auto k = face_mean(kind, upper.conductivity, lower.conductivity);
  const double gradient = 1.0 - (lower.head_cm - upper.head_cm) / distance_cm;
  return {k.mean * gradient, k.slope_a * upper.conductivity_slope * gradient + k.mean / distance_cm * upper.head_slope,
          k.slope_b * lower.conductivity_slope * gradient - k.mean / distance_cm * lower.head_slope};
}

// Integral (Kirchhoff) mean of one soil: K_face = (Phi_u - Phi_l) / (h_u - h_l), the mean of K
// over the heads between the two sides; Phi = integral of K dh.
inline FaceFlux integral_face(const FaceSide& upper, double phi_upper, const FaceSide& lower, double phi_lower,
                              double distance_cm) {
  const double dh = upper.head_cm - lower.head_cm;
  const double gradient = 1.0 - (lower.head_cm - upper.head_cm) / distance_cm;
  if (!(std::abs(dh) > 1e-4)) return darcy_face(FaceConductivity::arithmetic, upper, lower, distance_cm);
  const double k = (phi_upper - phi_lower) / dh;
  const double k_upper = (upper.potential_slope - k * upper.head_slope) / dh;
  const double k_lower = (k * lower.head_slope - lower.potential_slope) / dh;
  return {k * gradient, k_upper * gradient + k / distance_cm * upper.head_slope,
          k_lower * gradient - k / distance_cm * lower.head_slope};
}

}  // namespace wetfront::solver::detail
