// Face conductivity at a layer interface: steady infiltration (q = 0.5 cm/d) through 50 cm of
// loam over 50 cm of sand resting on a water table, compared with the exact layered steady
// profile (dz/dh = 1 / (q/K - 1) in each layer, head continuous at the interface;
// tests/reference/steady_flux_profile). Uniform grids with the interface on a face.
// The errors and observed orders of the face means are printed and recorded. A second test
// compares the wetting front in dry loam, a third a topsoil drying on coarse cells (the
// evidence for the integral default).
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <fmt/format.h>

#include "solver_test_soils.hpp"
#include "steady_flux_profile.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

constexpr double kFlux = 0.5;  // cm/d, downward

double steady_interface_error(std::size_t cells, solver::FaceConductivity face) {
  const soils::LayeredProfile soil(
      {soils::SoilLayer{"loam", 0.0, 50.0, loam()}, soils::SoilLayer{"sand", 50.0, 100.0, sand()}});
  solver::ColumnProblem problem = make_column(soil, solver::uniform_grid(100.0, cells));
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(kFlux)};
  problem.bottom = solver::FixedHead{0.0};
  problem.initial = solver::Hydrostatic{100.0};
  problem.face_conductivity = face;
  problem.end_day = 400.0;
  problem.output_days = {400.0};
  problem.settings.relative_tolerance = 1e-8;
  problem.settings.absolute_tolerance_storage_cm = 1e-10;
  const solver::ColumnRun run = solver::simulate(problem);
  EXPECT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  if (run.profiles.empty()) return INFINITY;
  const auto& profile = run.profiles.back();
  for (const double f : profile.face_flux_cm_per_d) EXPECT_NEAR(f, kFlux, 1e-6);  // steady

  const reference::LayeredSteadyFluxProfile exact({{50.0, sand()}, {50.0, loam()}}, kFlux);
  double worst = 0.0;
  for (std::size_t i = 0; i < run.cell_depths_cm.size(); ++i)
    worst = std::max(worst, std::abs(profile.head_cm[i] - exact.pressure_head_cm(100.0 - run.cell_depths_cm[i])));
  return worst;
}

TEST(FaceConductivityAtALayerInterface, EveryMeanConvergesToTheLayeredSteadyProfile) {
  const std::size_t cells[] = {20, 40, 80, 160};
  for (const auto face : kFaceConductivities) {
    const char* name = face_name(face);
    double errors[4];
    for (int k = 0; k < 4; ++k) {
      errors[k] = steady_interface_error(cells[k], face);
      RecordProperty(fmt::format("{}_error_cm_{}_cells", name, cells[k]), fmt::format("{:.3e}", errors[k]));
    }
    SCOPED_TRACE(fmt::format(
        "{:<10} max |h - h_exact| (cm) on 20/40/80/160 cells: {:.3e} {:.3e} {:.3e} {:.3e}; orders {:.2f} {:.2f} {:.2f}",
        name, errors[0], errors[1], errors[2], errors[3], std::log2(errors[0] / errors[1]),
        std::log2(errors[1] / errors[2]), std::log2(errors[2] / errors[3])));
    for (int k = 1; k < 4; ++k) EXPECT_LT(errors[k], errors[k - 1]) << name << ", " << cells[k] << " cells";
    EXPECT_LT(errors[3], 1.0) << name;
    // Expected rates (the design note, after Belfort & Lehmann 2005, VZJ): the harmonic mean
    // is second order at an interface, the arithmetic mean first order.
    const double finest_order = std::log2(errors[2] / errors[3]);
    if (face == solver::FaceConductivity::harmonic) {
      EXPECT_GE(finest_order, 1.8);
    } else {
      EXPECT_GE(finest_order, 0.8) << name;
    }
  }
}

// Depth (cm) where the water content first falls below the midpoint of its initial and
// surface values, searching down from the surface; linear between cell centres.
double front_depth_cm(const solver::ColumnRun& run, double initial_water_content) {
  const auto& theta = run.profiles.back().water_content;
  const double middle = 0.5 * (initial_water_content + theta.front());
  for (std::size_t i = 1; i < theta.size(); ++i) {
    if (theta[i] < middle) {
      const double w = (theta[i - 1] - middle) / (theta[i - 1] - theta[i]);
      return run.cell_depths_cm[i - 1] + w * (run.cell_depths_cm[i] - run.cell_depths_cm[i - 1]);
    }
  }
  return run.cell_depths_cm.back();
}

solver::ColumnRun dry_loam_infiltration(std::size_t cells, solver::FaceConductivity face) {
  solver::ColumnProblem problem = make_column(single_layer(60.0, loam()), solver::uniform_grid(60.0, cells));
  problem.top = solver::PrescribedFlux{solver::StepSeries::constant(2.0)};
  problem.bottom = solver::FreeDrainage{};
  problem.initial = solver::UniformHead{-1000.0};
  problem.face_conductivity = face;
  problem.end_day = 2.0;
  problem.output_days = {2.0};
  problem.settings.relative_tolerance = 1e-7;
  problem.settings.absolute_tolerance_storage_cm = 1e-9;
  return solver::simulate(problem);
}

TEST(FaceConductivityInDrySoil, WettingFrontPositionOnCoarseGrids) {
  // 2 cm/d into loam at -1000 cm for 2 days. Reference: the same scheme on 0.125 cm cells
  // (480 cells, where the three means agree to a small fraction of a cell); coarse grids of
  // 4, 2 and 1 cm. Mass balance puts the front near 4 cm / (theta behind - theta ahead).
  const double initial_theta = soils::water_content(loam(), -1000.0);
  const solver::ColumnRun fine = dry_loam_infiltration(480, solver::FaceConductivity::arithmetic);
  ASSERT_TRUE(fine.complete) << (fine.failure ? fine.failure->reason : "");
  const double reference_front = front_depth_cm(fine, initial_theta);
  const solver::ColumnRun fine_harmonic = dry_loam_infiltration(480, solver::FaceConductivity::harmonic);
  ASSERT_TRUE(fine_harmonic.complete);
  EXPECT_NEAR(front_depth_cm(fine_harmonic, initial_theta), reference_front, 0.125);
  SCOPED_TRACE(fmt::format("front at {:.3f} cm after 2 d (480 cells; harmonic on 480 cells: {:.3f} cm)",
                           reference_front, front_depth_cm(fine_harmonic, initial_theta)));
  double arithmetic_coarse_lag = 0.0;
  for (const auto face : kFaceConductivities) {
    const char* name = face_name(face);
    double lags[3];
    const std::size_t cells[] = {15, 30, 60};
    for (int k = 0; k < 3; ++k) {
      const solver::ColumnRun run = dry_loam_infiltration(cells[k], face);
      ASSERT_TRUE(run.complete) << name << ": " << (run.failure ? run.failure->reason : "");
      lags[k] = reference_front - front_depth_cm(run, initial_theta);
      RecordProperty(fmt::format("{}_front_lag_cm_{}_cells", name, cells[k]), fmt::format("{:.3f}", lags[k]));
    }
    SCOPED_TRACE(fmt::format("{:<10} front behind the reference by {:.3f} / {:.3f} / {:.3f} cm on 4 / 2 / 1 cm cells",
                             name, lags[0], lags[1], lags[2]));
    EXPECT_LT(std::abs(lags[2]), std::abs(lags[0])) << name;  // converging
    if (face == solver::FaceConductivity::harmonic) {
      // The harmonic mean takes the dry side's conductivity at the front and holds it back
      // on coarse grids (Belfort & Lehmann 2005, VZJ): more than the arithmetic mean does.
      EXPECT_GT(lags[0], arithmetic_coarse_lag + 1.0);
    } else {
      EXPECT_LT(std::abs(lags[2]), 0.5) << name;
    }
    if (face == solver::FaceConductivity::arithmetic) arithmetic_coarse_lag = lags[0];
  }
}

// Head at a depth, linear between cell centres.
double head_at(const solver::ColumnRun& run, double depth_cm) {
  const auto& z = run.cell_depths_cm;
  const auto& h = run.profiles.back().head_cm;
  const auto i = static_cast<std::size_t>(std::lower_bound(z.begin(), z.end(), depth_cm) - z.begin());
  if (i == 0) return h.front();
  if (i == z.size()) return h.back();
  const double w = (depth_cm - z[i - 1]) / (z[i] - z[i - 1]);
  return h[i - 1] + w * (h[i] - h[i - 1]);
}

solver::ColumnRun drying_sandy_loam(std::size_t cells, solver::FaceConductivity face) {
  // Carsel & Parrish (1988) sandy loam over a water table at 100 cm, under 0.5 cm/d of potential
  // evaporation and no rain for 20 days; the surface falls to the dry limit within days.
  const soils::VanGenuchtenMualem sandy_loam{0.065, 0.41, 0.075, 1.89, 106.1, 0.5};
  solver::ColumnProblem problem = make_column(single_layer(100.0, sandy_loam), solver::uniform_grid(100.0, cells));
  problem.top =
      solver::LimitedFlux{solver::StepSeries::constant(0.0), solver::StepSeries::constant(0.5), -15000.0, 0.0};
  problem.bottom = solver::FixedHead{0.0};
  problem.initial = solver::Hydrostatic{100.0};
  problem.face_conductivity = face;
  problem.end_day = 20.0;
  problem.output_days = {20.0};
  problem.settings.relative_tolerance = 1e-5;
  problem.settings.absolute_tolerance_storage_cm = 1e-8;
  return solver::simulate(problem);
}

TEST(FaceConductivityInDrySoil, DryingTopsoilOnCoarseCells) {
  // The evidence for the integral default: next to a dry cell the arithmetic mean lets a wet
  // cell's conductivity carry water out of soil that cannot conduct it, so coarse cells dry a
  // topsoil too far and evaporate too much. Reference: the same scheme on 0.125 cm cells (800).
  const solver::ColumnRun fine = drying_sandy_loam(800, solver::FaceConductivity::integral);
  ASSERT_TRUE(fine.complete) << (fine.failure ? fine.failure->reason : "");
  const double fine_evaporation = fine.balances.back().actual_evaporation_cm;
  double error[2] = {}, evaporation_error[2] = {};
  const solver::FaceConductivity faces[2] = {solver::FaceConductivity::integral, solver::FaceConductivity::arithmetic};
  for (int k = 0; k < 2; ++k) {
    const solver::ColumnRun coarse = drying_sandy_loam(50, faces[k]);  // 2 cm cells
    ASSERT_TRUE(coarse.complete) << face_name(faces[k]);
    for (double depth : {5.0, 10.0, 20.0})
      error[k] =
          std::max(error[k], std::abs(head_at(coarse, depth) - head_at(fine, depth)) / std::abs(head_at(fine, depth)));
    evaporation_error[k] = std::abs(coarse.balances.back().actual_evaporation_cm - fine_evaporation) / fine_evaporation;
  }
  SCOPED_TRACE(
      fmt::format("2 cm cells against 0.125 cm: largest relative head error at 5, 10, 20 cm {:.3f} (integral), "
                  "{:.3f} (arithmetic); evaporation {:.4f} / {:.4f} relative; fine evaporation {:.3f} cm",
                  error[0], error[1], evaporation_error[0], evaporation_error[1], fine_evaporation));
  // Measured: 0.002 and 0.24 of the head, 0.009 and 0.39 of the evaporation.
  EXPECT_LT(error[0], 0.02);
  EXPECT_GT(error[1], 5 * error[0]);
  EXPECT_LT(evaporation_error[0], 0.03);
  EXPECT_GT(evaporation_error[1], 5 * evaporation_error[0]);
}

}  // namespace
}  // namespace wetfront::solver_tests
