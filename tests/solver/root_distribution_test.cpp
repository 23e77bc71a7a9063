// Root-density shapes integrated over the cells: the fractions sum to one over the root depth
// for every shape, including a root tip that ends inside a cell, and match hand-worked
// integrals; the sink then removes exactly the potential transpiration from an unstressed column.
#include <gtest/gtest.h>

#include <cmath>
#include <numeric>
#include <stdexcept>

#include "wetfront/solver/root_uptake.hpp"

namespace wetfront::surface_tests {
namespace {

using solver::RootDistribution;

std::vector<RootDistribution> every_shape() {
  return {solver::UniformRoots{}, solver::LinearRoots{}, solver::ExponentialRoots{12.0},
          solver::RootDensityTable{{0.0, 0.3, 1.0}, {1.0, 1.0, 0.2}}};
}

double sum(const std::vector<double>& v) { return std::accumulate(v.begin(), v.end(), 0.0); }

TEST(RootDistribution, FractionsSumToOneWhenTheRootTipEndsMidCell) {
  const auto grid = solver::graded_grid({100.0, {}, 0.5, 1.1, 3.0});
  for (const auto& shape : every_shape()) {
    for (double root_depth : {0.3, 7.77, 31.4, 55.0, 100.0}) {
      const auto fractions = solver::root_fractions_per_cell(shape, root_depth, grid.face_depths_cm());
      EXPECT_NEAR(sum(fractions), 1.0, 1e-14) << "shape " << shape.index() << ", root depth " << root_depth;
      for (std::size_t i = 0; i < fractions.size(); ++i) {
        EXPECT_GE(fractions[i], 0.0);
        if (grid.face_depths_cm()[i] >= root_depth) {
          EXPECT_EQ(fractions[i], 0.0) << "cell below the root tip";
        }
      }
    }
  }
}

TEST(RootDistribution, RootsBelowTheColumnAreHeldAtItsBottom) {
  const auto grid = solver::uniform_grid(40.0, 8);
  for (const auto& shape : every_shape())
    EXPECT_NEAR(sum(solver::root_fractions_per_cell(shape, 90.0, grid.face_depths_cm())), 1.0, 1e-14);
  EXPECT_EQ(sum(solver::root_fractions_per_cell(solver::UniformRoots{}, 0.0, grid.face_depths_cm())), 0.0);
}

// Hand-worked integrals on 10 cm cells with a 25 cm root depth (the tip in the third cell).
TEST(RootDistribution, CellFractionsMatchTheIntegralsOfEachShape) {
  const auto grid = solver::uniform_grid(40.0, 4);
  const auto faces = grid.face_depths_cm();
  // Uniform: 10/25, 10/25, 5/25, 0.
  auto f = solver::root_fractions_per_cell(solver::UniformRoots{}, 25.0, faces);
  EXPECT_DOUBLE_EQ(f[0], 0.4);
  EXPECT_DOUBLE_EQ(f[1], 0.4);
  EXPECT_DOUBLE_EQ(f[2], 0.2);
  EXPECT_EQ(f[3], 0.0);
  // Linear to zero at the tip: F(z) = 1 - (1 - z/L)^2 -> 1 - 0.36, 0.36 - 0.04, 0.04.
  f = solver::root_fractions_per_cell(solver::LinearRoots{}, 25.0, faces);
  EXPECT_NEAR(f[0], 0.64, 1e-15);
  EXPECT_NEAR(f[1], 0.32, 1e-15);
  EXPECT_NEAR(f[2], 0.04, 1e-15);
  // Exponential, length 10 cm: F(z) = (1 - e^(-z/10)) / (1 - e^(-2.5)).
  f = solver::root_fractions_per_cell(solver::ExponentialRoots{10.0}, 25.0, faces);
  const double norm = 1.0 - std::exp(-2.5);
  EXPECT_NEAR(f[0], (1.0 - std::exp(-1.0)) / norm, 1e-15);
  EXPECT_NEAR(f[1], (std::exp(-1.0) - std::exp(-2.0)) / norm, 1e-15);
  EXPECT_NEAR(f[2], (std::exp(-2.0) - std::exp(-2.5)) / norm, 1e-15);
  // Table: density 2 at the surface falling to 0 at 0.4 L = 10 cm, then 0 to 0.8 L = 20 cm, then
  // rising to 1 at L. Areas in units of L: 0.4, 0, 0.1; total 0.5 -> fractions 0.8, 0, 0.2.
  f = solver::root_fractions_per_cell(solver::RootDensityTable{{0.0, 0.4, 0.8, 1.0}, {2.0, 0.0, 0.0, 1.0}}, 25.0,
                                      faces);
  EXPECT_NEAR(f[0], 0.8, 1e-15);
  EXPECT_NEAR(f[1], 0.0, 1e-15);
  EXPECT_NEAR(f[2], 0.2, 1e-15);
}

TEST(RootDistribution, TableWithConstantDensityIsUniform) {
  const auto grid = solver::graded_grid({60.0, {}, 0.5, 1.2, 4.0});
  const auto table = solver::root_fractions_per_cell(solver::RootDensityTable{{0.0, 0.5, 1.0}, {3.0, 3.0, 3.0}},
                                                     41.3, grid.face_depths_cm());
  const auto uniform = solver::root_fractions_per_cell(solver::UniformRoots{}, 41.3, grid.face_depths_cm());
  for (std::size_t i = 0; i < table.size(); ++i) EXPECT_NEAR(table[i], uniform[i], 1e-15);
}

TEST(RootDistribution, RejectsUnusableShapes) {
  EXPECT_THROW(solver::check_root_distribution(solver::ExponentialRoots{0.0}), std::invalid_argument);
  EXPECT_THROW(solver::check_root_distribution(solver::RootDensityTable{{0.0, 0.5}, {1.0, 1.0}}),
               std::invalid_argument);  // does not reach the root tip
  EXPECT_THROW(solver::check_root_distribution(solver::RootDensityTable{{0.0, 1.0}, {0.0, 0.0}}),
               std::invalid_argument);  // no roots
  EXPECT_THROW(solver::check_root_distribution(solver::RootDensityTable{{0.0, 1.0}, {1.0, -1.0}}),
               std::invalid_argument);
}

// Unstressed heads: sum of rate * dz is exactly Tp, whatever the shape; the slope is zero.
// In the stressed range the slope matches a difference quotient of the rate.
TEST(RootUptakeSink, RemovesThePotentialTranspirationWhenUnstressed) {
  const auto grid = solver::graded_grid({80.0, {}, 0.5, 1.15, 4.0});
  const std::size_t n = grid.cell_count();
  for (const auto& shape : every_shape()) {
    solver::RootUptakeSettings settings;
    settings.response = solver::feddes_grass();
    settings.distribution = shape;
    settings.root_depth_cm = {{0.0, 10.0}, {23.3, 47.9}};
    settings.potential_transpiration_cm_per_d = {{0.0, 5.0}, {0.4, 0.15}};
    const solver::RootUptake sink(settings, grid);
    std::vector<double> head(n, -100.0), rate(n), slope(n);
    for (double t : {2.0, 7.0, 12.0}) {
      sink.evaluate(t, grid.cell_depths_cm(), head, rate, slope);
      double total = 0.0;
      for (std::size_t i = 0; i < n; ++i) total += rate[i] * grid.cell_thickness_cm(i);
      const double tp = t < 5.0 ? 0.4 : 0.15;
      EXPECT_NEAR(total, tp, 1e-14) << "shape " << shape.index() << ", day " << t;
      for (double s : slope) EXPECT_EQ(s, 0.0);
    }
    std::vector<double> dry(n, -3000.0), rate_up(n), rate_down(n);
    sink.evaluate(12.0, grid.cell_depths_cm(), dry, rate, slope);
    std::vector<double> up = dry, down = dry;
    for (auto& h : up) h += 0.01;
    for (auto& h : down) h -= 0.01;
    sink.evaluate(12.0, grid.cell_depths_cm(), up, rate_up, slope);
    std::vector<double> ignored(n);
    sink.evaluate(12.0, grid.cell_depths_cm(), down, rate_down, ignored);
    sink.evaluate(12.0, grid.cell_depths_cm(), dry, rate, slope);
    for (std::size_t i = 0; i < n; ++i) EXPECT_NEAR(slope[i], (rate_up[i] - rate_down[i]) / 0.02, 1e-12);
  }
}

// The solver evaluates a sink at the start of the forcing period in progress, so a period start
// must give that period's demand and root depth.
TEST(RootUptakeSink, APeriodStartBelongsToThePeriodItBegins) {
  solver::RootUptakeSettings settings;
  settings.response = solver::feddes_maize();
  settings.root_depth_cm = {{0.0, 10.0}, {20.0, 30.0}};
  settings.potential_transpiration_cm_per_d = {{0.0, 3.0, 10.0}, {0.1, 0.2, 0.3}};
  const auto grid = solver::uniform_grid(50.0, 10);  // 5 cm cells
  const solver::RootUptake sink(settings, grid);
  EXPECT_EQ(sink.breakpoints_days(), (std::vector<double>{0.0, 3.0, 10.0}));
  std::vector<double> head(10, -100.0), rate(10), slope(10);
  auto total = [&](double t) {
    sink.evaluate(t, grid.cell_depths_cm(), head, rate, slope);
    return std::accumulate(rate.begin(), rate.end(), 0.0) * 5.0;
  };
  EXPECT_NEAR(total(0.0), 0.1, 1e-15);
  EXPECT_NEAR(total(3.0), 0.2, 1e-15);
  EXPECT_NEAR(total(10.0), 0.3, 1e-15);
  sink.evaluate(10.0, grid.cell_depths_cm(), head, rate, slope);
  EXPECT_GT(rate[5], 0.0);  // 25-30 cm: rooted from day 10 (30 cm roots)
  EXPECT_EQ(rate[6], 0.0);
  sink.evaluate(9.99, grid.cell_depths_cm(), head, rate, slope);
  EXPECT_EQ(rate[4], 0.0);  // 20-25 cm: not rooted before day 10 (20 cm roots)
}

}  // namespace
}  // namespace wetfront::surface_tests
