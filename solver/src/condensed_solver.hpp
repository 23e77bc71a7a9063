// The direct solver of every column's Newton systems (column_model.hpp: unknowns F_0 U_0 F_1 U_1
// ... F_(M-1) U_(M-1) F_M ... F_N; M = 0 without a sink). Each uptake unknown U_i appears only in
// its own row and in the rows of the faces above and below its cell, so it is eliminated first
// (static condensation) and the faces are left with a tridiagonal system: about half the work of
// the band LU of width two on every setup and solve. That system is factored from both ends at
// once where it is diagonally dominant by rows, else with partial pivoting. Where an uptake row
// is not diagonally dominant (a sink slope comparable to cj), the band LU of
// compiled_kernels.hpp solves the full system instead.
#pragma once

#include <cstddef>

#include <sundials/sundials_context.h>
#include <sundials/sundials_linearsolver.h>
#include <sundials/sundials_nvector.h>

#include "compiled_kernels.hpp"

namespace wetfront::solver::detail {

// For SUNBandMatrix systems laid out as above with `uptake_cells` = M (0 without a sink).
SUNLinearSolver make_condensed_column_solver(N_Vector like, SUNContext context, std::size_t uptake_cells);

}  // namespace wetfront::solver::detail
