// The vector operations and band LU compiled by wetfront (solver/src/compiled_kernels.hpp) must
// give what SUNDIALS' own serial vector and band solver give (identity checks on random data).
#include <gtest/gtest.h>

#include <cmath>
#include <random>
#include <span>
#include <thread>
#include <vector>

#include <nvector/nvector_serial.h>
#include <sunlinsol/sunlinsol_band.h>
#include <sunmatrix/sunmatrix_band.h>

#include "compiled_kernels.hpp"
#include "condensed_solver.hpp"

namespace wetfront::solver_tests {
namespace {

constexpr sunindextype length = 203;

class CompiledKernels : public testing::Test {
 protected:
  void SetUp() override { ASSERT_EQ(SUNContext_Create(nullptr, &context_), 0); }
  void TearDown() override { SUNContext_Free(&context_); }

  // A pair of vectors with the same random values: the library's operations and ours.
  std::pair<N_Vector, N_Vector> random_pair(double low, double high) {
    N_Vector library = N_VNew_Serial(length, context_), ours = N_VNew_Serial(length, context_);
    solver::detail::use_compiled_vector_ops(ours);
    std::uniform_real_distribution<double> value(low, high);
    for (sunindextype i = 0; i < length; ++i) NV_Ith_S(library, i) = NV_Ith_S(ours, i) = value(random_);
    made_.push_back(library), made_.push_back(ours);
    return {library, ours};
  }
  static void expect_same(N_Vector a, N_Vector b) {
    for (sunindextype i = 0; i < length; ++i)
      EXPECT_NEAR(NV_Ith_S(a, i), NV_Ith_S(b, i), 1e-14 * (1 + std::abs(NV_Ith_S(a, i))));
  }
  ~CompiledKernels() override {
    for (N_Vector v : made_) N_VDestroy(v);
  }

  SUNContext context_ = nullptr;
  std::mt19937_64 random_{20261202};
  std::vector<N_Vector> made_;
};

TEST_F(CompiledKernels, VectorOperationsAgreeWithTheLibrary) {
  auto [x0, x1] = random_pair(-2, 2);
  auto [y0, y1] = random_pair(0.5, 3);
  auto [z0, z1] = random_pair(0, 1);
  auto [w0, w1] = random_pair(0.1, 1);
  N_VLinearSum(0.7, x0, -1.3, y0, z0), N_VLinearSum(0.7, x1, -1.3, y1, z1), expect_same(z0, z1);
  N_VProd(x0, y0, z0), N_VProd(x1, y1, z1), expect_same(z0, z1);
  N_VDiv(x0, y0, z0), N_VDiv(x1, y1, z1), expect_same(z0, z1);
  N_VScale(2.5, x0, z0), N_VScale(2.5, x1, z1), expect_same(z0, z1);
  N_VAbs(x0, z0), N_VAbs(x1, z1), expect_same(z0, z1);
  N_VInv(y0, z0), N_VInv(y1, z1), expect_same(z0, z1);
  N_VAddConst(x0, 0.25, z0), N_VAddConst(x1, 0.25, z1), expect_same(z0, z1);
  N_VCompare(1.0, x0, z0), N_VCompare(1.0, x1, z1), expect_same(z0, z1);
  EXPECT_NEAR(N_VDotProd(x0, y0), N_VDotProd(x1, y1), 1e-12);
  EXPECT_EQ(N_VMaxNorm(x0), N_VMaxNorm(x1));
  EXPECT_NEAR(N_VWrmsNorm(x0, w0), N_VWrmsNorm(x1, w1), 1e-14);
  EXPECT_NEAR(N_VWrmsNormMask(x0, w0, y0), N_VWrmsNormMask(x1, w1, y1), 1e-14);
  EXPECT_EQ(N_VMin(x0), N_VMin(x1));
  EXPECT_NEAR(N_VWL2Norm(x0, w0), N_VWL2Norm(x1, w1), 1e-12);
  EXPECT_NEAR(N_VL1Norm(x0), N_VL1Norm(x1), 1e-12);
  EXPECT_EQ(N_VInvTest(y0, z0), N_VInvTest(y1, z1)), expect_same(z0, z1);
  // Fused: z = 0.5 x + 2 y - w, also with the output as the first input.
  double c[3] = {0.5, 2.0, -1.0};
  N_Vector library_in[3] = {x0, y0, w0}, ours_in[3] = {x1, y1, w1};
  N_VLinearCombination(3, c, library_in, z0), N_VLinearCombination(3, c, ours_in, z1), expect_same(z0, z1);
  N_Vector library_self[3] = {z0, y0, w0}, ours_self[3] = {z1, y1, w1};
  N_VLinearCombination(3, c, library_self, z0), N_VLinearCombination(3, c, ours_self, z1), expect_same(z0, z1);
  // Z_j = a_j x + Y_j.
  double a[2] = {1.5, -0.5};
  N_Vector library_y[2] = {y0, w0}, ours_y[2] = {y1, w1};
  N_Vector library_z[2] = {z0, x0}, ours_z[2] = {z1, x1};
  N_VScaleAddMulti(2, a, x0, library_y, library_z), N_VScaleAddMulti(2, a, x1, ours_y, ours_z);
  expect_same(z0, z1), expect_same(x0, x1);
}

// While a ScopedStepNorm lives, the weighted RMS norm of the compiled vectors on this thread is
// the installed one (the innermost, when nested); other threads and the library keep theirs.
TEST_F(CompiledKernels, AnInstalledStepNormServesItsThreadWhileItLives) {
  auto [x0, x1] = random_pair(-2, 2);
  auto [w0, w1] = random_pair(0.1, 1);
  const double plain = N_VWrmsNorm(x0, w0);
  auto length_times = [](const void* factor, std::span<const double> x, std::span<const double>) {
    return *static_cast<const double*>(factor) * static_cast<double>(x.size());
  };
  const double two = 2.0, three = 3.0;
  {
    const solver::detail::ScopedStepNorm outer({length_times, &two});
    EXPECT_EQ(N_VWrmsNorm(x1, w1), 2.0 * length);
    {
      const solver::detail::ScopedStepNorm inner({length_times, &three});
      EXPECT_EQ(N_VWrmsNorm(x1, w1), 3.0 * length);
    }
    EXPECT_EQ(N_VWrmsNorm(x1, w1), 2.0 * length);
    double elsewhere = 0;
    N_Vector x = x1, w = w1;  // clang 14 cannot capture structured bindings
    std::thread([&] { elsewhere = N_VWrmsNorm(x, w); }).join();
    EXPECT_NEAR(elsewhere, plain, 1e-14);
    EXPECT_EQ(N_VWrmsNorm(x0, w0), plain);
  }
  EXPECT_NEAR(N_VWrmsNorm(x1, w1), plain, 1e-14);
}

TEST_F(CompiledKernels, BandLuSolvesLikeTheLibrary) {
  for (sunindextype band : {1, 2, 3}) {
    SUNMatrix a_library = SUNBandMatrixStorage(length, band, band, 2 * band, context_);
    SUNMatrix a_ours = SUNBandMatrixStorage(length, band, band, 2 * band, context_);
    std::uniform_real_distribution<double> value(-1, 1);
    // Weak diagonal, so that partial pivoting swaps rows.
    for (sunindextype j = 0; j < length; ++j)
      for (sunindextype i = std::max<sunindextype>(0, j - band); i <= std::min(length - 1, j + band); ++i)
        SM_ELEMENT_B(a_library, i, j) = SM_ELEMENT_B(a_ours, i, j) = value(random_) + (i == j ? 0.1 : 0.0);
    auto [b0, b1] = random_pair(-1, 1);
    auto [x0, x1] = random_pair(0, 0);
    SUNLinearSolver library = SUNLinSol_Band(b0, a_library, context_);
    SUNLinearSolver ours = solver::detail::make_band_lu_solver(b1, context_);
    ASSERT_EQ(SUNLinSolInitialize(library), 0);
    ASSERT_EQ(SUNLinSolInitialize(ours), 0);
    ASSERT_EQ(SUNLinSolSetup(library, a_library), 0);
    ASSERT_EQ(SUNLinSolSetup(ours, a_ours), 0);
    ASSERT_EQ(SUNLinSolSolve(library, a_library, x0, b0, 0.0), 0);
    ASSERT_EQ(SUNLinSolSolve(ours, a_ours, x1, b1, 0.0), 0);
    for (sunindextype i = 0; i < length; ++i)
      EXPECT_NEAR(NV_Ith_S(x0, i), NV_Ith_S(x1, i), 1e-9 * (1 + std::abs(NV_Ith_S(x0, i))));
    SUNLinSolFree(library), SUNLinSolFree(ours), SUNMatDestroy(a_library), SUNMatDestroy(a_ours);
  }
}

// The column's layout with a sink (column_model.hpp): F_0 U_0 ... F_(M-1) U_(M-1) F_M ... F_N,
// and without one (M = 0). Every entry the model can fill is random. Uptake rows have a large
// diagonal (eliminated first), or one of them a tiny one (the band LU fallback). Face rows have a
// diagonal of 3 +- 1 (the face system then needs row interchanges) or 12 +- 1 (diagonally
// dominant: factored from both ends without them).
TEST_F(CompiledKernels, CondensedSolverSolvesLikeTheLibrary) {
  for (const std::size_t uptake : {std::size_t{60}, std::size_t{0}})
    for (const double face_diagonal : {3.0, 12.0})
      for (const bool weak_row : {false, true}) {
        if (uptake == 0 && weak_row) continue;
        SCOPED_TRACE(testing::Message() << uptake << " uptake rows, face diagonal " << face_diagonal
                                        << (weak_row ? ", one uptake row without a dominant diagonal" : ""));
        const std::size_t faces = static_cast<std::size_t>(length) - uptake;
        auto face = [uptake](std::size_t j) { return static_cast<sunindextype>(j + std::min(j, uptake)); };
        auto cell_unknowns = [&](std::size_t cell) {
          std::vector<sunindextype> unknowns{face(cell), face(cell + 1)};
          if (cell < uptake) unknowns.push_back(static_cast<sunindextype>(2 * cell + 1));
          return unknowns;
        };
        SUNMatrix a_library = SUNBandMatrixStorage(length, 2, 2, 4, context_);
        SUNMatrix a_ours = SUNBandMatrixStorage(length, 2, 2, 4, context_);
        std::uniform_real_distribution<double> value(-1, 1);
        auto set = [&](sunindextype row, sunindextype col, double v) {
          SM_ELEMENT_B(a_library, row, col) = SM_ELEMENT_B(a_ours, row, col) = v;
        };
        for (std::size_t j = 0; j < faces; ++j) {  // a face row: the cells above and below it
          for (std::size_t cell : {j - 1, j})
            if (cell < faces - 1)
              for (sunindextype k : cell_unknowns(cell)) set(face(j), k, value(random_));
          set(face(j), face(j), face_diagonal + value(random_));
        }
        for (std::size_t i = 0; i < uptake; ++i) {  // an uptake row: its own cell
          const auto row = static_cast<sunindextype>(2 * i + 1);
          for (sunindextype k : cell_unknowns(i)) set(row, k, value(random_));
          set(row, row, (weak_row && i == uptake / 2) ? 1e-3 : 5.0 + value(random_));
        }
        auto [b0, b1] = random_pair(-1, 1);
        auto [x0, x1] = random_pair(0, 0);
        SUNLinearSolver library = SUNLinSol_Band(b0, a_library, context_);
        SUNLinearSolver ours = solver::detail::make_condensed_column_solver(b1, context_, uptake);
        ASSERT_EQ(SUNLinSolInitialize(library), 0);
        ASSERT_EQ(SUNLinSolInitialize(ours), 0);
        ASSERT_EQ(SUNLinSolSetup(library, a_library), 0);
        ASSERT_EQ(SUNLinSolSetup(ours, a_ours), 0);
        for (int repeat = 0; repeat < 2; ++repeat) {  // the factors serve more than one solve
          ASSERT_EQ(SUNLinSolSolve(library, a_library, x0, b0, 0.0), 0);
          ASSERT_EQ(SUNLinSolSolve(ours, a_ours, x1, b1, 0.0), 0);
          for (sunindextype i = 0; i < length; ++i)
            EXPECT_NEAR(NV_Ith_S(x0, i), NV_Ith_S(x1, i), 1e-9 * (1 + std::abs(NV_Ith_S(x0, i)))) << "unknown " << i;
        }
        SUNLinSolFree(library), SUNLinSolFree(ours), SUNMatDestroy(a_library), SUNMatDestroy(a_ours);
      }
}

}  // namespace
}  // namespace wetfront::solver_tests
