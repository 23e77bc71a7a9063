// Owning handles for the SUNDIALS objects one IDA integration needs.
#pragma once

#include <memory>
#include <stdexcept>
#include <string>

#include <ida/ida.h>
#include <nvector/nvector_serial.h>
#include <sundials/sundials_context.h>
#include <sundials/sundials_nonlinearsolver.h>
#include <sunlinsol/sunlinsol_band.h>
#include <sunmatrix/sunmatrix_band.h>

namespace wetfront::solver::detail {

inline void check_flag(int flag, const char* call) {
  if (flag < 0) throw std::runtime_error(std::string(call) + " failed with SUNDIALS flag " + std::to_string(flag));
}
template <class T>
T* check_ptr(T* p, const char* call) {
  if (!p) throw std::runtime_error(std::string(call) + " returned no object");
  return p;
}

struct ContextDeleter { void operator()(SUNContext c) const { SUNContext_Free(&c); } };
struct VectorDeleter { void operator()(_generic_N_Vector* v) const { N_VDestroy(v); } };
struct MatrixDeleter { void operator()(_generic_SUNMatrix* m) const { SUNMatDestroy(m); } };
struct SolverDeleter { void operator()(_generic_SUNLinearSolver* s) const { SUNLinSolFree(s); } };
struct NonlinearSolverDeleter { void operator()(_generic_SUNNonlinearSolver* s) const { SUNNonlinSolFree(s); } };
struct IdaDeleter { void operator()(void* mem) const { IDAFree(&mem); } };

using ContextHandle = std::unique_ptr<std::remove_pointer_t<SUNContext>, ContextDeleter>;
using VectorHandle = std::unique_ptr<_generic_N_Vector, VectorDeleter>;
using MatrixHandle = std::unique_ptr<_generic_SUNMatrix, MatrixDeleter>;
using SolverHandle = std::unique_ptr<_generic_SUNLinearSolver, SolverDeleter>;
using NonlinearSolverHandle = std::unique_ptr<_generic_SUNNonlinearSolver, NonlinearSolverDeleter>;
using IdaHandle = std::unique_ptr<void, IdaDeleter>;

inline ContextHandle make_context() {
  SUNContext ctx = nullptr;
  check_flag(SUNContext_Create(nullptr, &ctx), "SUNContext_Create");
  return ContextHandle(ctx);
}
inline VectorHandle make_vector(std::size_t n, SUNContext ctx) {
  return VectorHandle(check_ptr(N_VNew_Serial(static_cast<sunindextype>(n), ctx), "N_VNew_Serial"));
}

}  // namespace wetfront::solver::detail
