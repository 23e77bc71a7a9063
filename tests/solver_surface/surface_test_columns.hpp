// Soils and column set-up shared by the surface-boundary and root-uptake tests.
#pragma once

#include <cmath>
#include <vector>

#include "wetfront/soils/layers.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::surface_tests {

// Class averages of Carsel & Parrish (1988, Water Resources Research 24(5):755), van
// Genuchten-Mualem with l = 0.5: theta_r, theta_s, alpha (1/cm), n, Ks (cm/d). From memory.
inline soils::VanGenuchtenMualem loam() { return {0.078, 0.43, 0.036, 1.56, 24.96, 0.5}; }
inline soils::VanGenuchtenMualem sand() { return {0.045, 0.43, 0.145, 2.68, 712.8, 0.5}; }
inline soils::VanGenuchtenMualem silt_loam() { return {0.067, 0.45, 0.020, 1.41, 10.8, 0.5}; }

inline soils::LayeredProfile single_layer(double depth_cm, soils::HydraulicModel model) {
  return soils::LayeredProfile({soils::SoilLayer{"test soil", 0.0, depth_cm, std::move(model)}});
}

// A column with every setting named (the aggregate fully initialised); the caller changes
// what the test is about.
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

// Output times start, start + step, ..., end.
inline std::vector<double> every(double step_days, double start_days, double end_days) {
  std::vector<double> t;
  const auto count = static_cast<long>(std::llround((end_days - start_days) / step_days));
  for (long k = 0; k <= count; ++k) t.push_back(start_days + static_cast<double>(k) * step_days);
  return t;
}

// Soil balance: storage change - (infiltration - transpiration - bottom flux), cm.
inline double soil_balance_error(const solver::ColumnRun& run, const solver::CumulativeBalance& b) {
  const double change = b.soil_storage_cm - run.balances.front().soil_storage_cm;
  return change - (b.infiltration_cm - b.transpiration_cm - b.bottom_flux_cm);
}

// Surface balance: water input - actual evaporation - runoff - infiltration - ponded depth, cm.
inline double surface_balance_error(const solver::CumulativeBalance& b) {
  return b.water_input_cm - b.actual_evaporation_cm - b.runoff_cm - b.infiltration_cm - b.ponded_depth_cm;
}

}  // namespace wetfront::surface_tests
