// Vector arithmetic and the banded LU solve that IDA spends its steps in, compiled with this
// project's optimisation.
//
// Debian 12's libsundials 6.4.1 is built without optimisation: the loops of its serial vector
// and band solver keep every index on the stack, so at 200 cells IDA spent about three quarters
// of a step in them (callgrind: ~20 instructions per element of a linear sum). Both are ordinary
// SUNDIALS extension points: the serial vector keeps its type and storage and only its
// arithmetic operations are replaced by the same loops compiled here; the linear solver is a
// SUNDIALS "custom" direct solver working on the library's own band matrix. Results agree with
// the library's to round-off (tests/solver/compiled_kernels_test.cpp), except the weighted RMS
// norm while a ScopedStepNorm is installed.
#pragma once

#include <span>

#include <sundials/sundials_context.h>
#include <sundials/sundials_linearsolver.h>
#include <sundials/sundials_matrix.h>
#include <sundials/sundials_nvector.h>

namespace wetfront::solver::detail {

// Replaces the arithmetic operations of a serial vector (clones inherit them).
void use_compiled_vector_ops(N_Vector serial_vector);

// A weighted norm of our own for IDA's error and Newton tests (vector operations carry no user
// data, so it is installed per thread): while a ScopedStepNorm lives, the weighted RMS norm of
// the compiled vectors on this thread calls norm(context, x, weights) instead.
struct StepNorm {
  double (*norm)(const void* context, std::span<const double> x, std::span<const double> weights);
  const void* context;
};
class ScopedStepNorm {
 public:
  explicit ScopedStepNorm(StepNorm norm);
  ~ScopedStepNorm();
  ScopedStepNorm(const ScopedStepNorm&) = delete;
  ScopedStepNorm& operator=(const ScopedStepNorm&) = delete;

 private:
  StepNorm norm_;
  const StepNorm* previous_;
};

// Replaces the zeroing of a band matrix (IDA zeroes the Jacobian before each evaluation).
void use_compiled_zero(SUNMatrix band_matrix);

// A direct solver for SUNBandMatrix systems: LU with partial pivoting (the band algorithm of
// Golub & Van Loan 2013, Matrix Computations, 4th ed., Alg. 4.3.5 with row interchanges), the
// matrix factored in place in setup and the factors used in solve. The matrix must be created
// with the storage upper bandwidth mu + ml that pivoting can fill.
SUNLinearSolver make_band_lu_solver(N_Vector like, SUNContext context);

// The operations of a direct solver of our own over SUNDIALS' matrices.
struct DirectSolverOps {
  int (*initialize)(SUNLinearSolver);
  int (*setup)(SUNLinearSolver, SUNMatrix);
  int (*solve)(SUNLinearSolver, SUNMatrix, N_Vector, N_Vector, double);
  sunindextype (*last_flag)(SUNLinearSolver);
  int (*free)(SUNLinearSolver);
};
// An empty SUNDIALS linear solver of type "direct, custom" holding `content` with these
// operations; nullptr if SUNDIALS cannot allocate it (the caller still owns `content` then).
SUNLinearSolver new_direct_solver(SUNContext context, void* content, const DirectSolverOps& ops);

}  // namespace wetfront::solver::detail
