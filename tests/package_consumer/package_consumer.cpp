// Evaluates a van Genuchten water content through the installed wetfront::soils and checks it
// against the closed form written out here. Exit code 0 when they agree.
#include <cmath>
#include <cstdio>

#include "wetfront/soils/hydraulic_models.hpp"

int main() {
  // Loam class averages (Carsel & Parrish 1988, Table 3): theta_r 0.078, theta_s 0.43,
  // alpha 0.036 1/cm, n 1.56, Ks 24.96 cm/d.
  const wetfront::soils::VanGenuchtenMualem loam{0.078, 0.43, 0.036, 1.56, 24.96, 0.5};
  const double head_cm = -100.0;
  const double theta = wetfront::soils::water_content(loam, head_cm);
  // van Genuchten (1980) eq. (3): Se = [1 + (alpha |h|)^n]^-m with m = 1 - 1/n.
  const double m = 1.0 - 1.0 / loam.n;
  const double se = std::pow(1.0 + std::pow(loam.alpha_per_cm * -head_cm, loam.n), -m);
  const double expected =
      loam.residual_water_content + (loam.saturated_water_content - loam.residual_water_content) * se;
  if (std::abs(theta - expected) > 1e-12 || std::abs(theta - 0.2421) > 5e-4) {
    std::fprintf(stderr, "water content at %g cm: %.6f, expected %.6f\n", head_cm, theta, expected);
    return 1;
  }
  return 0;
}
