// Darcy flux across a face between two points of a vertical column, depth d positive down:
//   q = K_face (1 - (h_lower - h_upper) / distance)          (Darcy-Buckingham, q positive down)
// with K_face a mean of the conductivities on either side (FaceConductivity).
#pragma once

#include <cmath>

#include "wetfront/solver/column_problem.hpp"

namespace wetfront::solver::detail {

struct FaceFlux {
  double flux;          // cm/d, positive downward
  double slope_upper;   // dq / dh_upper
  double slope_lower;   // dq / dh_lower
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
      return {2.0 * a * b / s, 2.0 * b * b / (s * s), 2.0 * a * a / (s * s)};
    }
    case FaceConductivity::arithmetic:
    default:
      return {0.5 * (a + b), 0.5, 0.5};
  }
}

// Upper and lower side: head (cm), conductivity K (cm/d) and dK/dh.
inline FaceFlux darcy_face(FaceConductivity kind, double h_upper, double k_upper, double dk_upper, double h_lower,
                           double k_lower, double dk_lower, double distance_cm) {
  const auto k = face_mean(kind, k_upper, k_lower);
  const double gradient = 1.0 - (h_lower - h_upper) / distance_cm;
  return {k.mean * gradient, k.slope_a * dk_upper * gradient + k.mean / distance_cm,
          k.slope_b * dk_lower * gradient - k.mean / distance_cm};
}

}  // namespace wetfront::solver::detail
