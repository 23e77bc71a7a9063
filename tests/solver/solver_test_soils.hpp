// Soils and small helpers shared by the solver verification tests.
#pragma once

#include <array>
#include <string>
#include <vector>

#include "wetfront/soils/layers.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/grid.hpp"

namespace wetfront::solver_tests {

// USDA texture-class averages of Carsel & Parrish (1988, Water Resources Research 24(5):755),
// van Genuchten-Mualem with l = 0.5 (values from memory, not checked against the table):
// theta_r, theta_s, alpha (1/cm), n, Ks (cm/d).
inline soils::VanGenuchtenMualem loam() { return {0.078, 0.43, 0.036, 1.56, 24.96, 0.5}; }
inline soils::VanGenuchtenMualem sand() { return {0.045, 0.43, 0.145, 2.68, 712.8, 0.5}; }
inline soils::VanGenuchtenMualem clay() { return {0.068, 0.38, 0.008, 1.09, 4.8, 0.5}; }

inline soils::LayeredProfile single_layer(double depth_cm, soils::HydraulicModel model) {
  return soils::LayeredProfile({soils::SoilLayer{"test soil", 0.0, depth_cm, std::move(model)}});
}

// The same clay with an air-entry head of -2 cm (Ippisch, Vogel & Bastian 2006), which keeps
// the slope of K finite at saturation.
inline soils::VanGenuchtenAirEntry clay_with_air_entry() { return {clay(), -2.0}; }

// Sand over loam over clay, boundaries at 30 cm and 70 cm, bottom at 150 cm.
inline soils::LayeredProfile sand_loam_clay(soils::HydraulicModel clay_model = clay()) {
  return soils::LayeredProfile({soils::SoilLayer{"sand", 0.0, 30.0, sand()},
                                soils::SoilLayer{"loam", 30.0, 70.0, loam()},
                                soils::SoilLayer{"clay", 70.0, 150.0, std::move(clay_model)}});
}

// A column with every other setting at its documented default (named in full so that the
// aggregate is completely initialised).
inline solver::ColumnProblem make_column(soils::LayeredProfile soil, solver::Grid grid) {
  return solver::ColumnProblem{std::move(soil),
                               std::move(grid),
                               solver::PrescribedFlux{solver::StepSeries::constant(0.0)},
                               solver::FreeDrainage{},
                               solver::UniformHead{-100.0},
                               nullptr,
                               {},
                               1e-4,
                               solver::FaceConductivity::arithmetic,
                               0.0,
                               1.0,
                               {},
                               solver::SolverSettings{}};
}

// The four face conductivities, and their names in messages and test properties.
inline constexpr std::array<solver::FaceConductivity, 4> kFaceConductivities = {
    solver::FaceConductivity::arithmetic, solver::FaceConductivity::geometric, solver::FaceConductivity::harmonic,
    solver::FaceConductivity::integral};
inline const char* face_name(solver::FaceConductivity face) {
  return face == solver::FaceConductivity::arithmetic  ? "arithmetic"
         : face == solver::FaceConductivity::geometric ? "geometric"
         : face == solver::FaceConductivity::harmonic  ? "harmonic"
                                                       : "integral";
}

// One soil down to request.depth_cm on the graded grid `request` asks for: {depth, faces to
// keep, surface cell, growth factor, largest cell}, lengths in cm.
inline solver::ColumnProblem graded_column(soils::HydraulicModel model, const solver::GridRequest& request) {
  return make_column(single_layer(request.depth_cm, std::move(model)), solver::graded_grid(request));
}

}  // namespace wetfront::solver_tests
