// The nonlinear solver of each IDA step: Newton's method that refreshes the Jacobian at the
// current iterate from its second iteration on.
//
// IDA's own Newton keeps one Jacobian for a whole step (and several steps). Where cells fill to
// saturation the total capacity C(h) + Ss drops by one or two orders of magnitude within a
// centimetre of head, so a Jacobian from the start of the step is wrong by that factor in
// the cells that cross saturation: the corrections overshoot into an odd-even oscillation of the
// heads and IDA cuts the step, again and again (ponded loam on 0.25 cm cells: half of all steps
// failed). With the Jacobian of the current iterate Newton converges there. A step whose first
// correction already passes IDA's convergence test costs nothing extra. IDA's convergence test
// (rate and tolerance) decides as before.
#pragma once

#include <sundials/sundials_context.h>
#include <sundials/sundials_nonlinearsolver.h>

namespace wetfront::solver::detail {

// The caller owns the solver (SUNNonlinSolFree after IDAFree).
SUNNonlinearSolver make_refreshing_newton(N_Vector like, SUNContext context);

}  // namespace wetfront::solver::detail
