// Time integration of the column DAE with IDA (BDF, variable order and step), a banded
// analytic Jacobian, exact stops at forcing breakpoints and located boundary switches.
// Every restart (new forcing period or boundary mode) moves the cumulative unknowns into
// running totals, so they stay small and the error test sees per-period amounts.
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
    for (double d : problem.flux_plane_depths_cm) plane_faces_.push_back(model.grid().face_at(d));
    const std::size_t n = model.unknowns();
    y_ = detail::make_vector(n, ctx_.get());
    yp_ = detail::make_vector(n, ctx_.get());
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
    // The unknowns are water amounts moved since the last restart; what the error test should
    // guard is each cell's stored water, so a face or sink amount may err by the relative
    // tolerance of the stored water next to it (plus the absolute tolerance).
    auto weights = detail::make_vector(n, ctx_.get());
    N_VConst(s.absolute_tolerance_storage_cm, weights.get());
    auto w = view(weights.get());
    const auto y0 = view(y_.get());
    for (std::size_t i = 0; i < model.cells(); ++i) {
      const double local = s.relative_tolerance * model.cell_storage(i, y0);
      w[ColumnModel::uptake_index(i)] += local;
      w[ColumnModel::face_index(i)] += local;
      if (i + 1 == model.cells()) w[ColumnModel::face_index(i + 1)] += local;
    }
    detail::check_flag(IDASVtolerances(mem, s.relative_tolerance, weights.get()), "IDASVtolerances");
    detail::check_flag(IDASetMaxStep(mem, s.max_step_days), "IDASetMaxStep");
    detail::check_flag(IDASetMaxNumSteps(mem, s.max_steps_per_output), "IDASetMaxNumSteps");
    matrix_.reset(detail::check_ptr(SUNBandMatrix(static_cast<sunindextype>(n), ColumnModel::upper_bandwidth, ColumnModel::lower_bandwidth, ctx_.get()), "SUNBandMatrix"));
    solver_.reset(detail::check_ptr(SUNLinSol_Band(y_.get(), matrix_.get(), ctx_.get()), "SUNLinSol_Band"));
    detail::check_flag(IDASetLinearSolver(mem, solver_.get(), matrix_.get()), "IDASetLinearSolver");
    detail::check_flag(IDASetJacFn(mem, jacobian_fn), "IDASetJacFn");
    detail::check_flag(IDASetNonlinConvCoef(mem, s.nonlinear_convergence_factor), "IDASetNonlinConvCoef");
    detail::check_flag(IDASetMaxNonlinIters(mem, s.max_nonlinear_iterations), "IDASetMaxNonlinIters");
    detail::check_flag(IDARootInit(mem, model.root_count(), root_fn), "IDARootInit");
    auto directions = model.root_directions();
    detail::check_flag(IDASetRootDirection(mem, directions.data()), "IDASetRootDirection");
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
          switch_modes(t);
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
    for (std::size_t i = 0; i < model_.cells(); ++i) total += model_.cell_storage(i, y);
    return total;
  }

  // A root moves the boundary to its next mode. A switch undone at the same instant (the
  // root function only touched zero: a tangency that the step's interpolant showed as a
  // crossing) leaves the mode as it was and is not counted.
  void switch_modes(double t) {
    std::vector<int> found(static_cast<std::size_t>(model_.root_count()));
    detail::check_flag(IDAGetRootInfo(mem_.get(), found.data()), "IDAGetRootInfo");
    for (int k = 0; k < model_.root_count(); ++k) {
      if (found[static_cast<std::size_t>(k)] == 0) continue;
      const auto before = model_.surface_mode();
      if (model_.switch_mode(k)) {
        const bool undone = std::abs(t - last_switch_time_) <= 1e-9 && model_.surface_mode() == mode_before_last_switch_;
        stats_.surface_switches += undone ? -1 : 1;
        mode_before_last_switch_ = before;
        last_switch_time_ = undone ? -1.0 : t;
      } else {
        ++stats_.bottom_switches;
      }
      break;  // one switch at a time; a second one is found again at once if still due
    }
  }

  // Starts a new integration from the current state: the forcing or the boundary mode changed,
  // so the rates are discontinuous and the BDF history is dropped.
  void restart(double t) {
    collect_statistics();
    model_.rebase(view(y_.get()));
    model_.consistent_rates(t, view(y_.get()), view(yp_.get()));
    detail::check_flag(IDAReInit(mem_.get(), t, y_.get(), yp_.get()), "IDAReInit");
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
    snap.ponded_depth_cm = y[ColumnModel::pond_index];

    const auto& totals = model_.totals();
    auto face_total = [&](std::size_t face) { return totals.face[face] + y[ColumnModel::face_index(face)]; };
    CumulativeBalance b;
    b.time_days = t;
    b.water_input_cm = totals.water_input + y[ColumnModel::water_input_index];
    b.potential_evaporation_cm = totals.potential_evaporation + y[ColumnModel::potential_index];
    b.actual_evaporation_cm = totals.actual_evaporation + y[ColumnModel::evaporation_index];
    b.runoff_cm = totals.runoff + y[ColumnModel::runoff_index];
    b.infiltration_cm = face_total(0);
    b.transpiration_cm = totals.transpiration;
    for (std::size_t i = 0; i < n; ++i) b.transpiration_cm += y[ColumnModel::uptake_index(i)];
    b.bottom_flux_cm = face_total(n);
    for (std::size_t face : plane_faces_) b.plane_flux_cm.push_back(face_total(face));
    b.ponded_depth_cm = y[ColumnModel::pond_index];
    b.soil_storage_cm = soil_storage();
    const double change = b.soil_storage_cm - initial_storage_ + b.ponded_depth_cm;  // no pond at the start
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
      // The unknown with the largest weighted error: a face or a cell's uptake; name the cell.
      for (std::size_t k = ColumnModel::face_index(0); k < w.size(); ++k)
        if (std::abs(w[k] * e[k]) > largest)
          largest = std::abs(w[k] * e[k]), worst = std::min((k - ColumnModel::face_index(0)) / 2, model_.cells() - 1);
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
                                                   model_.cell_storage(std::min(cell, model_.cells() - 1), y)));
    std::free(name);
    result.failure = f;
  }

  const ColumnProblem& problem_;
  ColumnModel& model_;
  detail::ContextHandle ctx_;
  detail::VectorHandle y_, yp_;
  std::vector<std::size_t> plane_faces_;
  detail::MatrixHandle matrix_;
  detail::SolverHandle solver_;
  detail::IdaHandle mem_;
  double initial_storage_ = 0;
  double last_switch_time_ = -1.0;
  detail::SurfaceMode mode_before_last_switch_ = detail::SurfaceMode::flux;
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
