// Time integration of the column DAE with IDA (BDF, variable order and step), a banded
// analytic Jacobian, exact stops at forcing breakpoints and located boundary switches.
//
// IDA takes one step per call (IDA_ONE_STEP); output times are read from its interpolant
// (IDAGetDky) between steps, so the steps, and therefore the results, do not depend on how often
// the run writes. Every restart (new forcing period or boundary mode) moves the cumulative
// unknowns into running totals, so they stay small and the error test sees per-period amounts.
#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <span>
#include <stdexcept>

#include <fmt/format.h>

#include "column_model.hpp"
#include "compiled_kernels.hpp"
#include "condensed_solver.hpp"
#include "failure_report.hpp"
#include "ida_handles.hpp"
#include "newton_solver.hpp"
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
  model->residual(t, view(y), view(yp), view(r));
  return all_finite(view(r)) ? 0 : 1;  // a non-finite flux is a recoverable error: IDA shortens the step
}

int jacobian_fn(double t, double cj, N_Vector y, N_Vector, N_Vector, SUNMatrix J, void* user, N_Vector, N_Vector,
                N_Vector) {
  static_cast<ColumnModel*>(user)->jacobian(t, cj, view(y), J);
  return 0;
}

int error_weights_fn(N_Vector y, N_Vector weights, void* user) {
  static_cast<ColumnModel*>(user)->error_weights(view(y), view(weights));
  return all_finite(view(weights)) ? 0 : -1;
}

// IDA's own messages would go to stderr; a failed run is reported through RunFailure instead.
void quiet_errors(int, const char*, const char*, char*, void*) {}

int event_fn(double t, N_Vector y, N_Vector, double* g, void* user) {
  static_cast<const ColumnModel*>(user)->events(t, view(y), {g, static_cast<std::size_t>(detail::event_count)});
  return 0;
}

// Two times closer than this are one time (output times and breakpoints built by different
// arithmetic differ by round-off).
double same_time_tolerance(double t) { return 1e-9 * std::max(1.0, std::abs(t)); }

void validate(const ColumnProblem& p) {
  if (!(p.end_day > p.start_day)) throw std::invalid_argument("the run must end after it starts");
  for (std::size_t i = 0; i < p.output_days.size(); ++i) {
    const double t = p.output_days[i];
    const double tol = same_time_tolerance(t);
    if (t < p.start_day - tol || t > p.end_day + tol)
      throw std::invalid_argument(
          fmt::format("output time {} d lies outside the run ({} to {} d)", t, p.start_day, p.end_day));
    if (i > 0 && !(t > p.output_days[i - 1])) throw std::invalid_argument("output times must increase");
  }
}

class Integrator {
 public:
  Integrator(const ColumnProblem& problem, ColumnModel& model, const OutputObserver* observe)
      : problem_(problem), model_(model), observe_(observe), ctx_(detail::make_context()) {
    for (double d : problem.flux_plane_depths_cm) plane_faces_.push_back(model.grid().face_at(d));
    const std::size_t n = model.unknowns();
    y_ = detail::make_vector(n, ctx_.get());
    yp_ = detail::make_vector(n, ctx_.get());
    detail::use_compiled_vector_ops(y_.get());  // IDA's own vectors are clones of these
    detail::use_compiled_vector_ops(yp_.get());
    output_y_ = detail::make_vector(n, ctx_.get());
    model.initial_state(view(y_.get()));
    model.rebase(problem.start_day, view(y_.get()));
    model.begin_period(problem.start_day);
    model.choose_modes(problem.start_day, view(y_.get()));
    model.consistent_rates(problem.start_day, view(y_.get()), view(yp_.get()));
    initial_storage_ = model.soil_storage(view(y_.get()));

    mem_.reset(detail::check_ptr(IDACreate(ctx_.get()), "IDACreate"));
    void* mem = mem_.get();
    detail::check_flag(IDAInit(mem, residual_fn, problem.start_day, y_.get(), yp_.get()), "IDAInit");
    detail::check_flag(IDASetUserData(mem, &model), "IDASetUserData");
    detail::check_flag(IDASetErrHandlerFn(mem, quiet_errors, nullptr), "IDASetErrHandlerFn");
    const auto& s = problem.settings;
    detail::check_flag(IDAWFtolerances(mem, error_weights_fn), "IDAWFtolerances");
    detail::check_flag(IDASetMaxStep(mem, s.max_step_days), "IDASetMaxStep");
    const auto bandwidth = static_cast<sunindextype>(model.bandwidth());
    matrix_.reset(detail::check_ptr(
        SUNBandMatrixStorage(static_cast<sunindextype>(n), bandwidth, bandwidth, 2 * bandwidth, ctx_.get()),
        "SUNBandMatrixStorage"));
    detail::use_compiled_zero(matrix_.get());
    solver_.reset(detail::check_ptr(detail::make_condensed_column_solver(y_.get(), ctx_.get(), model.uptake_cells()),
                                    "linear solver"));
    detail::check_flag(IDASetLinearSolver(mem, solver_.get(), matrix_.get()), "IDASetLinearSolver");
    newton_.reset(detail::check_ptr(detail::make_refreshing_newton(y_.get(), ctx_.get()), "Newton solver"));
    detail::check_flag(IDASetNonlinearSolver(mem, newton_.get()), "IDASetNonlinearSolver");
    detail::check_flag(IDASetJacFn(mem, jacobian_fn), "IDASetJacFn");
    detail::check_flag(IDASetNonlinConvCoef(mem, s.nonlinear_convergence_factor), "IDASetNonlinConvCoef");
    detail::check_flag(IDASetMaxNonlinIters(mem, s.max_nonlinear_iterations), "IDASetMaxNonlinIters");
    // IDA gives up on a step after 10 Newton failures by default (each quarters the step); where a
    // thin surface cell wets after rain a step can need more (the demo on 0.1 cm surface cells
    // needed up to 30). The run's work limit still bounds the total.
    detail::check_flag(IDASetMaxConvFails(mem, 50), "IDASetMaxConvFails");
    detail::check_flag(IDARootInit(mem, detail::event_count, event_fn), "IDARootInit");
    const int directions[detail::event_count] = {-1, -1, -1};
    detail::check_flag(IDASetRootDirection(mem, const_cast<int*>(directions)), "IDASetRootDirection");
    // Short runs of hard cases (ponding on dry clay) may need many steps in their first hours:
    // the limit never falls below ten days' worth.
    step_budget_ = static_cast<long>(std::max(10.0, problem.end_day - problem.start_day) *
                                     static_cast<double>(s.max_steps_per_day));
  }

  ColumnRun run() {
    ColumnRun result;
    // IDA's error and Newton tests measure with the column's own norm (ColumnModel::step_norm).
    const detail::ScopedStepNorm use_column_norm(
        {[](const void* model, std::span<const double> x, std::span<const double> weights) {
           return static_cast<const ColumnModel*>(model)->step_norm(x, weights);
         },
         &model_});
    const auto& grid = model_.grid();
    result.cell_depths_cm.assign(grid.cell_depths_cm().begin(), grid.cell_depths_cm().end());
    result.face_depths_cm.assign(grid.face_depths_cm().begin(), grid.face_depths_cm().end());

    // Breakpoints inside the run, with any that coincide to round-off (with each other or with
    // the end) taken as one.
    std::vector<double> stops;
    for (double b : model_.breakpoints())
      if (b > problem_.start_day + same_time_tolerance(b) && b < problem_.end_day - same_time_tolerance(b) &&
          (stops.empty() || b - stops.back() > same_time_tolerance(b)))
        stops.push_back(b);
    stops.push_back(problem_.end_day);

    double t = problem_.start_day;
    record_outputs_until(t, result);
    for (double stop : stops) {
      detail::check_flag(IDASetStopTime(mem_.get(), stop), "IDASetStopTime");
      while (t < stop) {
        double reached = t;
        const int flag = IDASolve(mem_.get(), stop, &reached, y_.get(), yp_.get(), IDA_ONE_STEP);
        if (flag < 0) {
          fail(flag, result);
          return result;
        }
        ++steps_;
        if (flag == IDA_TSTOP_RETURN) reached = stop;
        record_outputs_until(reached, result);
        t = reached;
        if (flag == IDA_TSTOP_RETURN) break;
        if (flag == IDA_ROOT_RETURN) {
          switch_modes(t);
          detail::check_flag(IDASetStopTime(mem_.get(), stop), "IDASetStopTime");
        }
        if (steps_ > step_budget_) {
          fail(detail::step_budget_exceeded, result);
          return result;
        }
      }
      if (stop < problem_.end_day) {  // a new forcing period starts at `stop`
        const auto before = model_.surface_mode();
        model_.rebase(stop, view(y_.get()));
        model_.begin_period(stop);
        model_.choose_modes(stop, view(y_.get()));
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
  // A root moves the boundary to its next mode. A switch undone at the same instant (the
  // event function only touched zero: a tangency that the step's interpolant showed as a
  // crossing) leaves the mode as it was and is not counted.
  void switch_modes(double t) {
    int found[detail::event_count] = {};
    detail::check_flag(IDAGetRootInfo(mem_.get(), found), "IDAGetRootInfo");
    for (int k = 0; k < detail::event_count; ++k) {
      if (found[k] == 0) continue;
      const auto slot = static_cast<detail::EventSlot>(k);
      const auto before = model_.surface_mode();
      model_.rebase(t, view(y_.get()));  // the surface accounts close under the old mode
      if (model_.switch_mode(slot, t, view(y_.get()))) {
        const bool reversed = model_.surface_mode() == mode_before_last_switch_ && t - last_switch_time_ <= 1e-6;
        const bool undone = reversed && t - last_switch_time_ <= 1e-9;
        stats_.surface_switches += undone ? -1 : 1;
        if (reversed) model_.widen_switch_margins();  // back within 0.1 s: the surface sits at the threshold
        mode_before_last_switch_ = before;
        last_switch_time_ = undone ? kNever : t;
      } else {
        ++stats_.bottom_switches;
      }
      restart(t);
      return;  // one switch at a time; a second one is found again at once if still due
    }
  }

  // Starts a new integration from the current (rebased) state: the forcing or the boundary
  // mode changed, so the rates are discontinuous and the BDF history is dropped.
  void restart(double t) {
    collect_statistics();
    model_.consistent_rates(t, view(y_.get()), view(yp_.get()));
    // The new interval starts with the step the last one ended with (IDA's own first step is
    // a cautious estimate, and a day's change of forcing rarely needs it).
    double last_step = 0;
    IDAGetLastStep(mem_.get(), &last_step);
    detail::check_flag(IDAReInit(mem_.get(), t, y_.get(), yp_.get()), "IDAReInit");
    if (last_step > 0) detail::check_flag(IDASetInitStep(mem_.get(), last_step), "IDASetInitStep");
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

  // Records every output time up to `reached`: the state itself at (or within round-off of)
  // `reached`, IDA's interpolant before it.
  void record_outputs_until(double reached, ColumnRun& result) {
    const auto& outputs = problem_.output_days;
    while (next_output_ < outputs.size() && outputs[next_output_] <= reached + same_time_tolerance(reached)) {
      const double t = outputs[next_output_++];
      if (std::abs(t - reached) <= same_time_tolerance(reached)) {
        record(reached, view(y_.get()), result);
      } else {
        detail::check_flag(IDAGetDky(mem_.get(), t, 0, output_y_.get()), "IDAGetDky");
        record(t, view(output_y_.get()), result);
      }
    }
  }

  void record(double t, std::span<const double> y, ColumnRun& result) {
    ProfileSnapshot snapshot = model_.snapshot(t, y);
    const auto& totals = model_.totals();
    const auto surface = model_.surface_accounts(t, y);
    auto face_total = [&](std::size_t face) { return totals.face[face] + y[model_.face_index(face)]; };
    CumulativeBalance b;
    b.time_days = t;
    b.water_input_cm = totals.water_input + surface.water_input;
    b.potential_evaporation_cm = totals.potential_evaporation + surface.potential_evaporation;
    b.actual_evaporation_cm = totals.actual_evaporation + surface.actual_evaporation;
    b.runoff_cm = totals.runoff + surface.runoff;
    b.infiltration_cm = face_total(0);
    b.transpiration_cm = model_.transpiration(y);
    b.bottom_flux_cm = face_total(model_.cells());
    for (std::size_t face : plane_faces_) b.plane_flux_cm.push_back(face_total(face));
    b.ponded_depth_cm = surface.ponded_depth;
    b.soil_storage_cm = model_.soil_storage(y);
    const double change = b.soil_storage_cm - initial_storage_ + b.ponded_depth_cm;  // no pond at the start
    const double net_in =
        b.water_input_cm - b.actual_evaporation_cm - b.runoff_cm - b.transpiration_cm - b.bottom_flux_cm;
    b.balance_error_cm = change - net_in;
    if (observe_ != nullptr)
      (*observe_)(snapshot, b);
    else
      result.profiles.push_back(std::move(snapshot));
    result.balances.push_back(std::move(b));
  }

  void fail(int flag, ColumnRun& result) {
    collect_statistics();
    result.statistics = stats_;
    result.complete = false;
    double t = 0, step = 0;
    IDAGetCurrentTime(mem_.get(), &t);
    IDAGetLastStep(mem_.get(), &step);
    // The cell with the largest weighted local error, where IDA can tell; else the surface.
    std::size_t worst = 0;
    auto weights = detail::make_vector(model_.unknowns(), ctx_.get());
    auto errors = detail::make_vector(model_.unknowns(), ctx_.get());
    if (IDAGetErrWeights(mem_.get(), weights.get()) == IDA_SUCCESS &&
        IDAGetEstLocalErrors(mem_.get(), errors.get()) == IDA_SUCCESS) {
      const auto w = view(weights.get());
      const auto e = view(errors.get());
      double largest = -1;
      for (std::size_t j = 0; j <= model_.cells(); ++j) {
        const std::size_t k = model_.face_index(j);
        if (std::abs(w[k] * e[k]) > largest) largest = std::abs(w[k] * e[k]), worst = std::min(j, model_.cells() - 1);
      }
    }
    result.failure = detail::describe_failure(flag, t, step, step_budget_, worst, model_, view(y_.get()));
  }

  const ColumnProblem& problem_;
  ColumnModel& model_;
  const OutputObserver* observe_;  // null: the run keeps every profile
  detail::ContextHandle ctx_;
  detail::VectorHandle y_, yp_, output_y_;
  std::vector<std::size_t> plane_faces_;
  detail::MatrixHandle matrix_;
  detail::SolverHandle solver_;
  detail::NonlinearSolverHandle newton_;  // destroyed after mem_
  detail::IdaHandle mem_;
  double initial_storage_ = 0;
  std::size_t next_output_ = 0;
  long steps_ = 0, step_budget_ = 0;
  static constexpr double kNever = -1e300;
  double last_switch_time_ = kNever;
  detail::SurfaceMode mode_before_last_switch_ = detail::SurfaceMode::flux;
  RunStatistics stats_, counted_;
};

ColumnRun run_column(const ColumnProblem& problem, const OutputObserver* observe) {
  validate(problem);
  ColumnModel model(problem);
  Integrator integrator(problem, model, observe);
  return integrator.run();
}

}  // namespace

ColumnRun simulate(const ColumnProblem& problem) { return run_column(problem, nullptr); }

ColumnRun simulate(const ColumnProblem& problem, const OutputObserver& observe) {
  return run_column(problem, &observe);
}

}  // namespace wetfront::solver
