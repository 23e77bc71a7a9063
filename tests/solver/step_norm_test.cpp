// The norm of IDA's error and Newton tests (ColumnModel::step_norm, with the face weights of
// ColumnModel::error_weights): a change spread over many faces is measured by its weighted RMS,
// a change of one thin cell's stored water in that cell's own tolerance. The expected values are
// derived from the norm's definition (identities); the loam is Carsel & Parrish's (1988; values
// from memory, solver_test_soils.hpp).
#include <gtest/gtest.h>

#include <cmath>
#include <memory>
#include <vector>

#include "column_model.hpp"
#include "solver_test_soils.hpp"
#include "wetfront/solver/root_uptake.hpp"

namespace wetfront::solver_tests {
namespace {

struct Weighed {
  std::unique_ptr<solver::detail::ColumnModel> model;
  std::vector<double> y, weights;
};

// 1600 cells of 0.125 cm of loam at a uniform -10 cm, where van Genuchten-Mualem gives K of about
// a fifth of Ks: every cell below the surface conducts (K >= 1 % of Ks) and has the same own
// tolerance, and a face between two of them 0.125 of it (the 1 cm floor of error_weights).
Weighed weighed(solver::ColumnProblem problem) {
  Weighed w{std::make_unique<solver::detail::ColumnModel>(problem), {}, {}};
  auto& m = *w.model;
  w.y.assign(m.unknowns(), 0.0);
  w.weights.assign(m.unknowns(), 0.0);
  m.initial_state(w.y);
  m.rebase(0.0, w.y);
  m.begin_period(0.0);
  m.choose_modes(0.0, w.y);
  m.error_weights(w.y, w.weights);
  return w;
}

solver::ColumnProblem thin_cells() {
  auto problem = make_column(single_layer(200.0, loam()), solver::uniform_grid(200.0, 1600));
  problem.initial = solver::UniformHead{-10.0};
  return problem;
}

double rms(const std::vector<double>& x, const std::vector<double>& weights) {
  double sum = 0;
  for (std::size_t i = 0; i < x.size(); ++i) sum += (x[i] * weights[i]) * (x[i] * weights[i]);
  return std::sqrt(sum / static_cast<double>(x.size()));
}

TEST(StepNorm, WaterPassingThroughEveryFaceIsMeasuredByTheWeightedRms) {
  const auto w = weighed(thin_cells());
  // The same amount through every face changes no cell's storage.
  const std::vector<double> x(w.y.size(), 1e-3);
  EXPECT_NEAR(w.model->step_norm(x, w.weights), rms(x, w.weights), 1e-12 * rms(x, w.weights));
}

TEST(StepNorm, OneThinCellsStorageIsMeasuredInItsOwnTolerance) {
  const auto w = weighed(thin_cells());
  const std::size_t face = 800;
  std::vector<double> x(w.y.size(), 0.0);
  x[w.model->face_index(face)] = 1e-4;  // cells 799 and 800 change by 1e-4 cm of water
  // The face's weight is 0.125 of each neighbour's own (the floor); the norm is the change in
  // that own weight divided by the local share 30, far above the RMS, which dilutes one face
  // among 1601.
  const double own_weight = w.weights[w.model->face_index(face)] / 0.125;
  EXPECT_NEAR(w.model->step_norm(x, w.weights), 1e-4 * own_weight / 30.0, 1e-12 * own_weight);
  EXPECT_GT(w.model->step_norm(x, w.weights), 10.0 * rms(x, w.weights));
}

TEST(StepNorm, AnUptakeAmountChangesItsCellsStorage) {
  auto problem = thin_cells();
  solver::RootUptakeSettings roots;
  roots.root_depth_cm = solver::StepSeries::constant(30.0);
  roots.potential_transpiration_cm_per_d = solver::StepSeries::constant(0.5);
  problem.sink = std::make_shared<solver::RootUptake>(roots, problem.grid);
  const auto w = weighed(problem);
  ASSERT_GT(w.model->uptake_cells(), 100u);
  const std::size_t cell = 100;
  std::vector<double> x(w.y.size(), 0.0);
  x[solver::detail::ColumnModel::uptake_index(cell)] = 1e-4;
  const double own_weight = w.weights[solver::detail::ColumnModel::uptake_index(cell)] / 0.125;
  EXPECT_NEAR(w.model->step_norm(x, w.weights), 1e-4 * own_weight / 30.0, 1e-12 * own_weight);
  // Water entering at the surface and passing every face down to the cell, to be taken up there,
  // changes no cell's storage.
  for (std::size_t face = 0; face <= cell; ++face) x[w.model->face_index(face)] = 1e-4;
  EXPECT_NEAR(w.model->step_norm(x, w.weights), rms(x, w.weights), 1e-12 * rms(x, w.weights));
}

}  // namespace
}  // namespace wetfront::solver_tests
