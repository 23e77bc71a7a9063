// graded_grid must obey the [grid] limits exactly on any layout of required faces (layer
// boundaries, sensor depths, recharge plane): the first cell no thicker than the surface cell,
// no cell thicker than the largest cell, neighbours within the growth factor both ways, a face
// on every required depth. Identity checks of the stated limits.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <vector>

#include "wetfront/solver/grid.hpp"

namespace wetfront::solver_tests {
namespace {

void expect_limits_obeyed(const solver::GridRequest& r) {
  const solver::Grid grid = solver::graded_grid(r);
  const auto faces = grid.face_depths_cm();
  ASSERT_EQ(faces.front(), 0.0);
  ASSERT_EQ(faces.back(), r.depth_cm);
  const double eps = 1e-12;
  EXPECT_LE(grid.cell_thickness_cm(0), r.surface_cell_cm * (1 + eps));
  for (std::size_t i = 0; i < grid.cell_count(); ++i) {
    EXPECT_LE(grid.cell_thickness_cm(i), r.max_cell_cm * (1 + eps)) << "cell " << i;
    if (i + 1 < grid.cell_count()) {
      const double ratio = grid.cell_thickness_cm(i + 1) / grid.cell_thickness_cm(i);
      EXPECT_LE(ratio, r.growth_factor * (1 + eps)) << "cells " << i << ", " << i + 1;
      EXPECT_GE(ratio, 1 / r.growth_factor * (1 - eps)) << "cells " << i << ", " << i + 1;
    }
  }
  for (double d : r.required_face_depths_cm) EXPECT_NO_THROW(grid.face_at(d)) << d;
}

TEST(GradedGrid, DemoLikeLayout) {
  // Layers at 30 and 80 cm, sensors at 20, 30, 50, 60, 80, 90, 120 cm, recharge plane 150 cm.
  expect_limits_obeyed({200.0, {30, 80, 20, 50, 60, 90, 120, 150}, 1.0, 1.1, 5.0});
}

TEST(GradedGrid, CloseRequiredFacesForceSmallCells) {
  // Faces 0.3 cm apart deep in the column: cells must shrink toward them and grow back.
  expect_limits_obeyed({150.0, {60.0, 60.3, 100.0, 100.05}, 0.5, 1.1, 5.0});
}

TEST(GradedGrid, StrongGrowthAndLargeCells) {
  expect_limits_obeyed({500.0, {1.0, 2.5, 33.3, 250.0, 499.0}, 0.1, 1.5, 20.0});
}

TEST(GradedGrid, UniformWhenGrowthIsOne) {
  // Growth factor 1: all cells equal, no thicker than 2 cm, faces at 25 and 70 cm. The largest
  // such cell divides 25, 45 and 30 cm: 5/3 cm, so 60 cells (arithmetic identity).
  const solver::GridRequest r{100.0, {25.0, 70.0}, 2.0, 1.0, 2.0};
  expect_limits_obeyed(r);
  EXPECT_EQ(solver::graded_grid(r).cell_count(), 60u);
}

TEST(GradedGrid, ManyLayoutsAtDifferentSettings) {
  const std::vector<std::vector<double>> layouts = {
      {}, {10.0}, {5.0, 5.5, 6.0}, {17.0, 43.0, 44.0, 99.0, 140.0}, {0.2, 199.8}, {33.0, 66.0, 99.0, 132.0, 165.0}};
  for (const auto& layout : layouts)
    for (double growth : {1.05, 1.1, 1.2, 1.31})
      for (double surface : {0.25, 1.0, 3.0})
        for (double largest : {3.0, 5.0, 10.0}) {
          if (largest < surface) continue;
          SCOPED_TRACE(::testing::Message() << "growth " << growth << " surface " << surface << " largest " << largest);
          expect_limits_obeyed({200.0, layout, surface, growth, largest});
        }
}

}  // namespace
}  // namespace wetfront::solver_tests
