// Time integration of the column DAE with IDAS (BDF, variable order and step), a banded
// analytic Jacobian, exact stops at forcing breakpoints and located boundary switches.
// IDAS rather than IDA for its quadrature states: the cumulative boundary and plane fluxes
// are integrated by the same BDF formula as the stored water, so the balance closes.
#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <span>
#include <stdexcept>

#include <fmt/format.h>

#include "column_model.hpp"
#include "ida_handles.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver {

namespace {

using detail::ColumnModel;

std::span<double> view(N_Vector v) { return {N_VGetArrayPointer(v), static_cast<std::size_t>(N_VGetLength(v))}; }

bool all_finite(std::span<const double> v) {
  return std::all_of(v.begin(), v.end(), [](double x) { return std::isfinite(x); });
}

int residual_fn(double t, N_Vector y, N_Vector yp, N_Vector r, void* user) {
  auto* model = static_cast<ColumnModel*>(user);
  if (!all_finite(view(y))) return 1;  // recoverable: IDA cuts the step
  model->residual(t, view(y), view(yp), view(r));
  return all_finite(view(r)) ? 0 : 1;
}

int jacobian_fn(double t, double cj, N_Vector y, N_Vector, N_Vector, SUNMatrix J, void* user, N_Vector, N_Vector,
                N_Vector) {
  static_cast<ColumnModel*>(user)->jacobian(t, cj, view(y), J);
  return 0;
}

int root_fn(double t, N_Vector y, N_Vector, double* g, void* user) {
  auto* model = static_cast<ColumnModel*>(user);
  model->roots(t, view(y), {g, static_cast<std::size_t>(model->root_count())});
  return 0;
}

int quadrature_fn(double t, N_Vector y, N_Vector, N_Vector rates, void* user) {
  static_cast<ColumnModel*>(user)->quadrature_rates(t, view(y), view(rates));
  return 0;
}

void validate(const ColumnProblem& p) {
  if (!(p.end_day > p.start_day)) throw std::invalid_argument("the run must end after it starts");
  for (std::size_t i = 0; i < p.output_days.size(); ++i) {
    const double t = p.output_days[i];
    if (t < p.start_day || t > p.end_day)
      throw std::invalid_argument(fmt::format("output time {} d lies outside the run ({} to {} d)", t, p.start_day,
                                              p.end_day));
    if (i > 0 && !(t > p.output_days[i - 1])) throw std::invalid_argument("output times must increase");
  }
}

class Integrator {
 public:
  Integrator(const ColumnProblem& problem, ColumnModel& model)
      : problem_(problem), model_(model), ctx_(detail::make_context()) {
    const std::size_t n = model.unknowns();
    y_ = detail::make_vector(n, ctx_.get());
    yp_ = detail::make_vector(n, ctx_.get());
    quad_ = detail::make_vector(model.quadratures(), ctx_.get());
    N_VConst(0.0, quad_.get());
    model.initial_state(view(y_.get()));
    model.begin_period(problem.start_day);
    model.choose_modes(view(y_.get()));
    model.consistent_rates(problem.start_day, view(y_.get()), view(yp_.get()));
    initial_storage_ = soil_storage();

    mem_.reset(detail::check_ptr(IDACreate(ctx_.get()), "IDACreate"));
    void* mem = mem_.get();
    detail::check_flag(IDAInit(mem, residual_fn, problem.start_day, y_.get(), yp_.get()), "IDAInit");
    detail::check_flag(IDASetUserData(mem, &model), "IDASetUserData");
    const auto& s = problem.settings;
    auto weights = detail::make_vector(n, ctx_.get());
    N_VConst(s.absolute_tolerance_storage_cm, weights.get());
    detail::check_flag(IDASVtolerances(mem, s.relative_tolerance, weights.get()), "IDASVtolerances");
    detail::check_flag(IDASetMaxStep(mem, s.max_step_days), "IDASetMaxStep");
    detail::check_flag(IDASetMaxNumSteps(mem, s.max_steps_per_output), "IDASetMaxNumSteps");
    matrix_.reset(detail::check_ptr(SUNBandMatrix(static_cast<sunindextype>(n), 1, 1, ctx_.get()), "SUNBandMatrix"));
    solver_.reset(detail::check_ptr(SUNLinSol_Band(y_.get(), matrix_.get(), ctx_.get()), "SUNLinSol_Band"));
    detail::check_flag(IDASetLinearSolver(mem, solver_.get(), matrix_.get()), "IDASetLinearSolver");
    detail::check_flag(IDASetJacFn(mem, jacobian_fn), "IDASetJacFn");
    detail::check_flag(IDASetNonlinConvCoef(mem, s.nonlinear_convergence_factor), "IDASetNonlinConvCoef");
    detail::check_flag(IDARootInit(mem, model.root_count(), root_fn), "IDARootInit");
    auto directions = model.root_directions();
    detail::check_flag(IDASetRootDirection(mem, directions.data()), "IDASetRootDirection");
    detail::check_flag(IDAQuadInit(mem, quadrature_fn, quad_.get()), "IDAQuadInit");
    detail::check_flag(IDASetQuadErrCon(mem, SUNFALSE), "IDASetQuadErrCon");
  }

  ColumnRun run() {
    ColumnRun result;
    const auto& grid = model_.grid();
    result.cell_depths_cm.assign(grid.cell_depths_cm().begin(), grid.cell_depths_cm().end());
    result.face_depths_cm.assign(grid.face_depths_cm().begin(), grid.face_depths_cm().end());

    std::vector<double> stops;
    for (double b : model_.breakpoints())
      if (b > problem_.start_day && b < problem_.end_day) stops.push_back(b);
    stops.push_back(problem_.end_day);

    const auto& outputs = problem_.output_days;
    std::size_t next_output = 0;
    double t = problem_.start_day;
    if (next_output < outputs.size() && outputs[next_output] <= t) record(t, result), ++next_output;

    for (double stop : stops) {
      detail::check_flag(IDASetStopTime(mem_.get(), stop), "IDASetStopTime");
      while (t < stop) {
        const bool to_output = next_output < outputs.size() && outputs[next_output] <= stop;
        const double tout = to_output ? outputs[next_output] : stop;
        double reached = t;
        const int flag = IDASolve(mem_.get(), tout, &reached, y_.get(), yp_.get(), IDA_NORMAL);
        if (flag < 0) {
          fail(flag, result);
          return result;
        }
        t = reached;
        if (flag == IDA_ROOT_RETURN) {
          switch_modes(result);
          restart(t);
          detail::check_flag(IDASetStopTime(mem_.get(), stop), "IDASetStopTime");
        }
        if (to_output && t >= tout) record(t, result), ++next_output;
      }
      // A new forcing period starts at `stop`.
      if (stop < problem_.end_day) {
        const auto before = model_.surface_mode();
        model_.begin_period(stop);
        model_.choose_modes(view(y_.get()));
        if (model_.surface_mode() != before) ++stats_.surface_switches;
        restart(stop);
      }
    }
    collect_statistics();
    result.statistics = stats_;
    result.complete = true;
    return result;
  }

 private:
  double soil_storage() const {
    const auto y = view(y_.get());
    double total = 0;
    for (std::size_t i = 0; i < model_.cells(); ++i) total += y[ColumnModel::storage_index(i)];
    return total;
  }

  void switch_modes(ColumnRun&) {
    std::vector<int> found(static_cast<std::size_t>(model_.root_count()));
    detail::check_flag(IDAGetRootInfo(mem_.get(), found.data()), "IDAGetRootInfo");
    for (int k = 0; k < model_.root_count(); ++k) {
      if (found[static_cast<std::size_t>(k)] == 0) continue;
      if (model_.switch_mode(k, view(y_.get())))
        ++stats_.surface_switches;
      else
        ++stats_.bottom_switches;
      break;  // one switch at a time; a second one is found again at once if still due
    }
  }

  // Starts a new integration from the current state: the forcing or the boundary mode changed,
  // so the rates are discontinuous and the BDF history is dropped.
  void restart(double t) {
    collect_statistics();
    double tq = t;
    detail::check_flag(IDAGetQuad(mem_.get(), &tq, quad_.get()), "IDAGetQuad");
    model_.consistent_rates(t, view(y_.get()), view(yp_.get()));
    detail::check_flag(IDAReInit(mem_.get(), t, y_.get(), yp_.get()), "IDAReInit");
    detail::check_flag(IDAQuadReInit(mem_.get(), quad_.get()), "IDAQuadReInit");
    counted_ = {};  // IDAReInit restarts the integrator's counters
  }

  void collect_statistics() {
    long steps = 0, res = 0, jac = 0, nli = 0, ncf = 0, etf = 0;
    IDAGetNumSteps(mem_.get(), &steps);
    IDAGetNumResEvals(mem_.get(), &res);
    IDAGetNumJacEvals(mem_.get(), &jac);
    IDAGetNumNonlinSolvIters(mem_.get(), &nli);
    IDAGetNumNonlinSolvConvFails(mem_.get(), &ncf);
    IDAGetNumErrTestFails(mem_.get(), &etf);
    stats_.steps += steps - counted_.steps;
    stats_.residual_evaluations += res - counted_.residual_evaluations;
    stats_.jacobian_evaluations += jac - counted_.jacobian_evaluations;
    stats_.nonlinear_iterations += nli - counted_.nonlinear_iterations;
    stats_.nonlinear_failures += ncf - counted_.nonlinear_failures;
    stats_.error_test_failures += etf - counted_.error_test_failures;
    counted_ = {steps, res, jac, nli, ncf, etf, 0, 0};
  }

  void record(double t, ColumnRun& result) {
    const auto y = view(y_.get());
    const std::size_t n = model_.cells();
    ProfileSnapshot snap;
    snap.time_days = t;
    snap.head_cm.resize(n);
    snap.water_content.resize(n);
    snap.conductivity_cm_per_d.resize(n);
    snap.sink_rate_per_day.resize(n);
    snap.face_flux_cm_per_d.resize(n + 1);
    model_.cell_properties(y, snap.head_cm, snap.water_content, snap.conductivity_cm_per_d);
    model_.sink_rates(t, y, snap.sink_rate_per_day);
    model_.face_fluxes(t, y, snap.face_flux_cm_per_d);
    snap.ponded_depth_cm = y[0];

    double tq = t;
    if (t > problem_.start_day) detail::check_flag(IDAGetQuad(mem_.get(), &tq, quad_.get()), "IDAGetQuad");
    const auto q = view(quad_.get());
    CumulativeBalance b;
    b.time_days = t;
    b.water_input_cm = q[detail::q_water_input];
    b.potential_evaporation_cm = q[detail::q_potential_evaporation];
    b.actual_evaporation_cm = q[detail::q_actual_evaporation];
    b.runoff_cm = q[detail::q_runoff];
    b.infiltration_cm = q[detail::q_infiltration];
    b.transpiration_cm = q[detail::q_transpiration];
    b.bottom_flux_cm = q[detail::q_bottom];
    b.plane_flux_cm.assign(q.begin() + detail::q_first_plane, q.end());
    b.ponded_depth_cm = y[0];
    b.soil_storage_cm = soil_storage();
    const double change = b.soil_storage_cm - initial_storage_ + b.ponded_depth_cm;
    const double net_in =
        b.water_input_cm - b.actual_evaporation_cm - b.runoff_cm - b.transpiration_cm - b.bottom_flux_cm;
    b.balance_error_cm = change - net_in;
    result.profiles.push_back(std::move(snap));
    result.balances.push_back(std::move(b));
  }

  void fail(int flag, ColumnRun& result) {
    collect_statistics();
    result.statistics = stats_;
    result.complete = false;
    RunFailure f;
    double t = 0;
    IDAGetCurrentTime(mem_.get(), &t);
    f.time_days = t;
    auto weights = detail::make_vector(model_.unknowns(), ctx_.get());
    auto errors = detail::make_vector(model_.unknowns(), ctx_.get());
    if (IDAGetErrWeights(mem_.get(), weights.get()) == IDA_SUCCESS &&
        IDAGetEstLocalErrors(mem_.get(), errors.get()) == IDA_SUCCESS) {
      const auto w = view(weights.get());
      const auto e = view(errors.get());
      std::size_t worst = 0;
      double largest = -1;
      for (std::size_t k = 1; k < w.size(); ++k)
        if (std::abs(w[k] * e[k]) > largest) largest = std::abs(w[k] * e[k]), worst = k - 1;
      f.depth_cm = model_.grid().cell_depths_cm()[worst];
    }
    char* name = IDAGetReturnFlagName(flag);
    const auto y = view(y_.get());
    const std::size_t cell = static_cast<std::size_t>(
        std::lower_bound(result.cell_depths_cm.begin(), result.cell_depths_cm.end(), f.depth_cm) -
        result.cell_depths_cm.begin());
    f.reason = fmt::format("{} at {:.6g} d: the integrator could not continue (last head there {:.6g} cm)",
                           name ? name : "IDA failure", t,
                           model_.head_for_storage(std::min(cell, model_.cells() - 1),
                                                   y[ColumnModel::storage_index(std::min(cell, model_.cells() - 1))]));
    std::free(name);
    result.failure = f;
  }

  const ColumnProblem& problem_;
  ColumnModel& model_;
  detail::ContextHandle ctx_;
  detail::VectorHandle y_, yp_, quad_;
  detail::MatrixHandle matrix_;
  detail::SolverHandle solver_;
  detail::IdaHandle mem_;
  double initial_storage_ = 0;
  RunStatistics stats_, counted_;
};

}  // namespace

ColumnRun simulate(const ColumnProblem& problem) {
  validate(problem);
  ColumnModel model(problem);
  Integrator integrator(problem, model);
  return integrator.run();
}

}  // namespace wetfront::solver
