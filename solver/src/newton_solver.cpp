#include "newton_solver.hpp"

#include <sundials/sundials_nvector.h>

namespace wetfront::solver::detail {

namespace {

struct Newton {
  SUNNonlinSolSysFn residual = nullptr;
  SUNNonlinSolLSetupFn setup_linear = nullptr;
  SUNNonlinSolLSolveFn solve_linear = nullptr;
  SUNNonlinSolConvTestFn converged = nullptr;
  void* test_data = nullptr;
  N_Vector correction = nullptr;  // the Newton update, and the residual before it
  int max_iterations = 4;
  int current_iteration = 0;
  long iterations = 0;  // in the last solve (IDA adds them up)
  long failures = 0;    // in the last solve
};
Newton& content(SUNNonlinearSolver s) { return *static_cast<Newton*>(s->content); }

SUNNonlinearSolver_Type solver_type(SUNNonlinearSolver) { return SUNNONLINEARSOLVER_ROOTFIND; }
int initialize(SUNNonlinearSolver s) {
  auto& n = content(s);
  n.iterations = n.failures = 0;
  return n.residual && n.solve_linear && n.converged ? SUN_NLS_SUCCESS : SUN_NLS_MEM_NULL;
}

// Solves residual(y0 + correction) = 0 for the correction, starting from `correction` (zero
// from IDA). `setup_first`: IDA asks for a new Jacobian before the first iteration.
int solve(SUNNonlinearSolver s, N_Vector, N_Vector correction, N_Vector weights, double tolerance, booleantype setup_first,
          void* ida) {
  auto& n = content(s);
  n.current_iteration = 0;
  n.iterations = n.failures = 0;
  int flag = n.residual(correction, n.correction, ida);
  bool setup = setup_first && n.setup_linear;
  for (;;) {
    if (flag != SUN_NLS_SUCCESS) break;
    if (setup) {
      booleantype current = SUNFALSE;
      flag = n.setup_linear(n.current_iteration > 0, &current, ida);
      if (flag != SUN_NLS_SUCCESS) break;
    }
    ++n.iterations;
    N_VScale(-1.0, n.correction, n.correction);
    flag = n.solve_linear(n.correction, ida);
    if (flag != SUN_NLS_SUCCESS) break;
    N_VLinearSum(1.0, correction, 1.0, n.correction, correction);
    flag = n.converged(s, correction, n.correction, tolerance, weights, n.test_data);
    if (flag == SUN_NLS_SUCCESS) return SUN_NLS_SUCCESS;
    if (flag != SUN_NLS_CONTINUE) break;
    if (++n.current_iteration >= n.max_iterations) {
      flag = SUN_NLS_CONV_RECVR;
      break;
    }
    flag = n.residual(correction, n.correction, ida);
    setup = n.setup_linear != nullptr;  // from here on: the Jacobian of the current iterate
  }
  ++n.failures;
  return flag;
}

int free_solver(SUNNonlinearSolver s) {
  if (!s) return SUN_NLS_SUCCESS;
  if (s->content) {
    N_VDestroy(content(s).correction);
    delete static_cast<Newton*>(s->content);
    s->content = nullptr;
  }
  SUNNonlinSolFreeEmpty(s);
  return SUN_NLS_SUCCESS;
}

int set_residual(SUNNonlinearSolver s, SUNNonlinSolSysFn f) { return content(s).residual = f, SUN_NLS_SUCCESS; }
int set_setup(SUNNonlinearSolver s, SUNNonlinSolLSetupFn f) { return content(s).setup_linear = f, SUN_NLS_SUCCESS; }
int set_solve(SUNNonlinearSolver s, SUNNonlinSolLSolveFn f) { return content(s).solve_linear = f, SUN_NLS_SUCCESS; }
int set_test(SUNNonlinearSolver s, SUNNonlinSolConvTestFn f, void* data) {
  content(s).converged = f;
  content(s).test_data = data;
  return SUN_NLS_SUCCESS;
}
int set_max_iterations(SUNNonlinearSolver s, int most) {
  if (most < 1) return SUN_NLS_ILL_INPUT;
  content(s).max_iterations = most;
  return SUN_NLS_SUCCESS;
}
int get_iterations(SUNNonlinearSolver s, long* count) { return *count = content(s).iterations, SUN_NLS_SUCCESS; }
int get_current_iteration(SUNNonlinearSolver s, int* iteration) {
  return *iteration = content(s).current_iteration, SUN_NLS_SUCCESS;
}
int get_failures(SUNNonlinearSolver s, long* count) { return *count = content(s).failures, SUN_NLS_SUCCESS; }

}  // namespace

SUNNonlinearSolver make_refreshing_newton(N_Vector like, SUNContext context) {
  SUNNonlinearSolver s = SUNNonlinSolNewEmpty(context);
  if (!s) return nullptr;
  auto* n = new Newton;
  n->correction = N_VClone(like);
  s->content = n;
  s->ops->gettype = solver_type;
  s->ops->initialize = initialize;
  s->ops->solve = solve;
  s->ops->free = free_solver;
  s->ops->setsysfn = set_residual;
  s->ops->setlsetupfn = set_setup;
  s->ops->setlsolvefn = set_solve;
  s->ops->setctestfn = set_test;
  s->ops->setmaxiters = set_max_iterations;
  s->ops->getnumiters = get_iterations;
  s->ops->getcuriter = get_current_iteration;
  s->ops->getnumconvfails = get_failures;
  if (!n->correction) {
    free_solver(s);
    return nullptr;
  }
  return s;
}

}  // namespace wetfront::solver::detail
