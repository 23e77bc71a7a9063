// Steady vertical flow above a water table in a homogeneous soil, for any hydraulic model.
//
// With z measured upward from the water table (h = 0 at z = 0) and the flux q positive
// downward, Darcy's law q = K(h) (dh/dz + 1) gives dz/dh = 1 / (q / K(h) - 1), so
//   z(h) = integral from h to 0 of dh' / (1 - q / K(h')).
// For infiltration (0 < q < Ks) the profile tends to the head where K = q as z grows; for
// evaporation or capillary rise (q < 0) the head falls ever faster with height. The integral
// is evaluated by adaptive Simpson quadrature and inverted for h(z) by safeguarded Newton
// iteration (dz/dh is the integrand itself).
#pragma once

#include <vector>

#include "wetfront/soils/hydraulic_models.hpp"

namespace wetfront::reference {

class SteadyFluxProfile {
 public:
  // flux_cm_per_d < saturated conductivity (else no unsaturated steady profile exists).
  // base_head_cm is the head at z = 0 (0 at a water table; the head on an interface when the
  // profile continues one below); for infiltration it must lie above the asymptotic head, so
  // that h falls with height.
  SteadyFluxProfile(soils::HydraulicModel model, double flux_cm_per_d, double quadrature_tolerance_cm = 1e-10,
                    double base_head_cm = 0.0);

  // Height above z = 0 at which the steady head is head_cm (<= base head).
  double height_above_table_cm(double head_cm) const;
  // Steady head at a height above z = 0, to about 1e-9 cm (less where the profile
  // is within about 1e-6 |h| of the asymptotic head, as rounding of K(h) - q limits it).
  double pressure_head_cm(double height_above_table_cm) const;
  // The head where K(h) = q (infiltration only): the asymptote far above the table.
  double asymptotic_head_cm() const { return asymptotic_head_cm_; }

 private:
  double slope(double head_cm) const;  // dz/dh (negative)

  soils::HydraulicModel model_;
  double flux_cm_per_d_;
  double tolerance_cm_;
  double base_head_cm_;
  double asymptotic_head_cm_;  // -infinity unless 0 < q < Ks
};

// Steady flux through layers stacked on a water table: the head is continuous across each
// interface, so each layer's profile starts from the head at the top of the layer below.
struct SteadyLayer {
  double thickness_cm;
  soils::HydraulicModel model;
};
class LayeredSteadyFluxProfile {
 public:
  // layers_from_table: the lowest layer (resting on the water table) first.
  LayeredSteadyFluxProfile(std::vector<SteadyLayer> layers_from_table, double flux_cm_per_d);
  double pressure_head_cm(double height_above_table_cm) const;

 private:
  std::vector<double> layer_base_heights_cm_;
  std::vector<SteadyFluxProfile> profiles_;
};

}  // namespace wetfront::reference
