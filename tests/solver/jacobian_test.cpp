// The banded analytic Jacobian (ColumnModel::jacobian) must be the derivative of the residual:
// compared column by column with central differences of the residual (identity check), on
// states across a wetting front from saturation to dry soil, with and without a sink, for each
// surface mode the state allows.
#include <gtest/gtest.h>

#include <cmath>
#include <memory>
#include <vector>

#include <sundials/sundials_context.h>
#include <sunmatrix/sunmatrix_band.h>

#include "column_model.hpp"
#include "solver_test_soils.hpp"
#include "wetfront/solver/root_uptake.hpp"

namespace wetfront::solver_tests {
namespace {

void expect_jacobian_matches_differences(solver::ColumnProblem problem, double elapsed_days) {
  solver::detail::ColumnModel model(problem);
  const std::size_t n = model.unknowns();
  std::vector<double> y(n), yp(n, 0.0), r0(n), r1(n);
  model.initial_state(y);
  model.rebase(0.0, y);
  model.begin_period(0.0);
  model.choose_modes(0.0, y);
  // Move some water through the faces so that the state is not the stored initial one.
  for (std::size_t j = 0; j <= model.cells(); ++j)
    y[model.face_index(j)] = 1e-3 * std::sin(0.7 * static_cast<double>(j));
  const double t = elapsed_days;

  SUNContext context = nullptr;
  ASSERT_EQ(SUNContext_Create(nullptr, &context), 0);
  const auto band = static_cast<sunindextype>(model.bandwidth());
  SUNMatrix jacobian = SUNBandMatrixStorage(static_cast<sunindextype>(n), band, band, 2 * band, context);
  SUNMatZero(jacobian);  // as IDA does before it asks for the Jacobian
  model.jacobian(t, 0.0, y, jacobian);
  for (std::size_t k = 0; k < n; ++k) {
    const double step = 1e-7 * std::max(1e-3, std::abs(y[k]));
    auto plus = y, minus = y;
    plus[k] += step, minus[k] -= step;
    model.residual(t, plus, yp, r1);
    model.residual(t, minus, yp, r0);
    for (std::size_t row = 0; row < n; ++row) {
      const double difference = (r1[row] - r0[row]) / (2 * step);
      const bool in_band = std::abs(static_cast<long>(row) - static_cast<long>(k)) <= band;
      const double analytic =
          in_band ? SM_ELEMENT_B(jacobian, static_cast<sunindextype>(row), static_cast<sunindextype>(k)) : 0.0;
      EXPECT_NEAR(analytic, difference, 1e-5 * std::abs(difference) + 1e-6 * (1 + std::abs(analytic)))
          << "row " << row << " column " << k;
    }
  }
  SUNMatDestroy(jacobian);
  SUNContext_Free(&context);
}

solver::ColumnProblem front_in_loam() {
  auto problem = make_column(single_layer(20.0, loam()), solver::uniform_grid(20.0, 40));
  // Saturated at the top, a front at 5 cm, dry below.
  problem.initial = solver::HeadTable{{0.0, 3.0, 5.0, 6.0, 20.0}, {2.0, -0.01, -5.0, -800.0, -1000.0}};
  return problem;
}

TEST(Jacobian, PrescribedHeadOverAFront) {
  auto problem = front_in_loam();
  problem.top = solver::PrescribedHead{solver::StepSeries::constant(1.0)};
  expect_jacobian_matches_differences(problem, 0.0);
}

TEST(Jacobian, PondedSurfaceWithRootsAndWaterTable) {
  auto problem = front_in_loam();
  problem.top =
      solver::LimitedFlux{solver::StepSeries::constant(100.0), solver::StepSeries::constant(0.2), -15000.0, 1.0};
  problem.bottom = solver::FixedHead{-30.0};
  solver::RootUptakeSettings roots;
  roots.root_depth_cm = solver::StepSeries::constant(12.0);
  roots.potential_transpiration_cm_per_d = solver::StepSeries::constant(0.5);
  problem.sink = std::make_shared<solver::RootUptake>(roots, problem.grid);
  expect_jacobian_matches_differences(problem, 0.01);
}

TEST(Jacobian, EveryFaceConductivityMean) {
  for (const auto face : kFaceConductivities) {
    SCOPED_TRACE(face_name(face));
    auto problem = front_in_loam();
    problem.face_conductivity = face;
    problem.top =
        solver::LimitedFlux{solver::StepSeries::constant(100.0), solver::StepSeries::constant(0.2), -15000.0, 1.0};
    problem.bottom = solver::FixedHead{-30.0};
    expect_jacobian_matches_differences(problem, 0.01);
  }
}

TEST(Jacobian, DryLimitSurfaceOnSand) {
  auto problem = make_column(single_layer(20.0, sand()), solver::uniform_grid(20.0, 40));
  problem.initial = solver::HeadTable{{0.0, 2.0, 20.0}, {-3000.0, -60.0, -20.0}};
  problem.top =
      solver::LimitedFlux{solver::StepSeries::constant(0.0), solver::StepSeries::constant(2.0), -15000.0, 0.0};
  expect_jacobian_matches_differences(problem, 0.0);
}

}  // namespace
}  // namespace wetfront::solver_tests
