// Soils and column set-up shared by the surface-boundary and root-uptake tests.
#pragma once

#include <cmath>
#include <vector>

#include "wetfront/soils/layers.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/column_run.hpp"
#include "solver_test_soils.hpp"

namespace wetfront::surface_tests {

// The Carsel & Parrish (1988) test soils, the single-layer profile and the fully named column
// are shared with the solver verification tests (tests/solver/solver_test_soils.hpp).
using solver_tests::graded_column;
using solver_tests::loam;
using solver_tests::make_column;
using solver_tests::sand;
using solver_tests::single_layer;

// Carsel & Parrish (1988) class average for silt loam, van Genuchten-Mualem with l = 0.5:
// theta_r, theta_s, alpha (1/cm), n, Ks (cm/d). From memory.
inline soils::VanGenuchtenMualem silt_loam() { return {0.067, 0.45, 0.020, 1.41, 10.8, 0.5}; }

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
