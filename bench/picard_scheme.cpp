// Mixed-form modified Picard scheme of Celia, Bouloutas & Zarba (1990, WRR 26(7):1483).
//
// Richards' equation in mixed form, depth d positive downward, flux q positive downward:
//   d theta(h)/dt = -dq/dd,   q = -K(h) (dh/dd - 1).
// Space: nodes i = 0..N at the grid's face depths d_i (uniform spacing dz). Node i stores the water
// of its control volume [d_i - dz/2, d_i + dz/2], cut to the column (half length at both ends):
// length L_i. Between nodes i and i+1 the flux is
//   q_{i+1/2} = -K_{i+1/2} ((h_{i+1} - h_i)/dz - 1),   K_{i+1/2} = (K_i + K_{i+1})/2   (arithmetic mean).
// Time: backward Euler. The node balance of one step from t^n to t^{n+1} = t^n + dt is
//   R_i(h) = q_{i-1/2}(h) - q_{i+1/2}(h) - L_i (theta_i(h) - theta_i^n)/dt = 0,
// with q_{-1/2} the surface flux. Because the storage term is the change of theta itself (the
// mixed form) and not C dh/dt, the sum of the node balances telescopes to
//   storage change = dt (surface flux - bottom flux) + dt sum_i R_i,
// so the water balance closes to the residual left when the iteration stops.
//
// Modified Picard (Celia et al. 1990; the form is from memory, equation numbers not checked):
// at iteration m, with K and C = d theta/dh lagged at h^{n+1,m}, expand
//   theta(h^{n+1,m+1}) ~ theta(h^{n+1,m}) + C(h^{n+1,m}) delta^m,   h^{n+1,m+1} = h^{n+1,m} + delta^m,
// which gives one tridiagonal system per iteration,
//   L_i C_i delta_i/dt - K_{i-1/2} (delta_{i-1} - delta_i)/dz + K_{i+1/2} (delta_i - delta_{i+1})/dz
//     = R_i(h^{n+1,m})   (K, C and theta evaluated at h^{n+1,m}),
// solved by the Thomas algorithm. Iterate until max_i |delta_i| < head tolerance.
//
// Boundaries: fixed head at the bottom node; at the surface node the flux input - evaporation,
// or, when evaporation would pull the surface node below the dry limit, that head held fixed
// (switched within an iteration, no event location). A step on the dry limit switches back to
// the flux at the start of the next step when the flux the soil delivered (from the surface node
// balance) exceeds the evaporation demand, or rain falls.
//
// Soil: the water content, capacity and conductivity of a node are the means of the layer values
// over its control volume, weighted by length. The 60 cm node of year200 thus uses the mean of the
// sandy loam and loam properties: its storage is then exact for its control volume, half in each
// layer. No specific storage: year200 never saturates (a saturated surface stops the run).
#include "picard_scheme.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <utility>
#include <variant>

#include "wetfront/soils/hydraulic_models.hpp"

namespace wetfront::bench {
namespace {

// One layer's share of a node's control volume.
struct LayerShare {
  const soils::HydraulicModel* model;
  double weight;  // fraction of the control volume length
};

// Water content (cm3/cm3), moisture capacity d theta/dh (1/cm) and conductivity (cm/d) at every node.
struct NodeProperties {
  std::vector<double> water_content;
  std::vector<double> moisture_capacity;
  std::vector<double> conductivity;
};

enum class SurfaceMode { flux, dry_limit };

struct Column {
  std::vector<double> node_depth_cm;
  double node_spacing_cm = 0.0;
  std::vector<double> control_length_cm;
  std::vector<std::vector<LayerShare>> node_soil;

  std::size_t node_count() const { return node_depth_cm.size(); }

  void evaluate(std::span<const double> pressure_head_cm, NodeProperties& out) const {
    const std::size_t count = node_count();
    out.water_content.assign(count, 0.0);
    out.moisture_capacity.assign(count, 0.0);
    out.conductivity.assign(count, 0.0);
    for (std::size_t node = 0; node < count; ++node) {
      for (const auto& share : node_soil[node]) {
        // soils::evaluate returns water_content, moisture_capacity and conductivity (and the
        // unused conductivity slope) from one shared evaluation, equal to the last bit to the
        // three single functions, each of which repeats that whole evaluation.
        const soils::HydraulicState soil = soils::evaluate(*share.model, pressure_head_cm[node]);
        out.water_content[node] += share.weight * soil.water_content;
        out.moisture_capacity[node] += share.weight * soil.moisture_capacity;
        out.conductivity[node] += share.weight * soil.conductivity;
      }
    }
  }

  double storage_cm(const NodeProperties& properties) const {
    double total = 0.0;
    for (std::size_t node = 0; node < node_count(); ++node)
      total += control_length_cm[node] * properties.water_content[node];
    return total;
  }

  // Downward flux between node and node + 1, cm/d.
  double flux_below(std::size_t node, std::span<const double> pressure_head_cm, const NodeProperties& properties) const {
    const double face_conductivity = 0.5 * (properties.conductivity[node] + properties.conductivity[node + 1]);
    return -face_conductivity * ((pressure_head_cm[node + 1] - pressure_head_cm[node]) / node_spacing_cm - 1.0);
  }
};

Column build_column(const solver::ColumnProblem& problem) {
  Column column;
  const auto faces = problem.grid.face_depths_cm();
  column.node_depth_cm.assign(faces.begin(), faces.end());
  column.node_spacing_cm = faces[1] - faces[0];
  for (std::size_t cell = 0; cell < problem.grid.cell_count(); ++cell)
    if (std::abs(problem.grid.cell_thickness_cm(cell) - column.node_spacing_cm) > 1e-9 * column.node_spacing_cm)
      throw std::invalid_argument("Picard scheme: the grid must be uniform");
  if (problem.soil.total_depth_cm() < problem.grid.total_depth_cm() - 1e-9)
    throw std::invalid_argument("Picard scheme: the soil profile is shallower than the grid");

  const std::size_t count = column.node_count();
  for (std::size_t node = 0; node < count; ++node) {
    const double top = std::max(0.0, column.node_depth_cm[node] - 0.5 * column.node_spacing_cm);
    const double bottom =
        std::min(problem.grid.total_depth_cm(), column.node_depth_cm[node] + 0.5 * column.node_spacing_cm);
    column.control_length_cm.push_back(bottom - top);
    std::vector<LayerShare> shares;
    for (const auto& layer : problem.soil.layers()) {
      const double overlap = std::min(bottom, layer.bottom_depth_cm) - std::max(top, layer.top_depth_cm);
      if (overlap > 1e-12) shares.push_back({&layer.model, overlap / (bottom - top)});
    }
    column.node_soil.push_back(std::move(shares));
  }
  return column;
}

void check_supported(const solver::ColumnProblem& problem) {
  const auto* top = std::get_if<solver::LimitedFlux>(&problem.top);
  if (top == nullptr) throw std::invalid_argument("Picard scheme: the top boundary must be LimitedFlux");
  if (top->max_ponded_depth_cm != 0.0) throw std::invalid_argument("Picard scheme: ponding is not modelled");
  if (!std::holds_alternative<solver::FixedHead>(problem.bottom))
    throw std::invalid_argument("Picard scheme: the bottom boundary must be FixedHead");
  if (!std::holds_alternative<solver::Hydrostatic>(problem.initial))
    throw std::invalid_argument("Picard scheme: the initial condition must be Hydrostatic");
  if (problem.sink) throw std::invalid_argument("Picard scheme: sinks are not supported");
  if (!problem.flux_plane_depths_cm.empty()) throw std::invalid_argument("Picard scheme: flux planes are not supported");
  if (problem.face_conductivity != solver::FaceConductivity::arithmetic)
    throw std::invalid_argument("Picard scheme: only the arithmetic face conductivity is supported");
  for (const auto& layer : problem.soil.layers())
    if (!std::holds_alternative<soils::VanGenuchtenMualem>(layer.model))
      throw std::invalid_argument("Picard scheme: layer '" + layer.name + "' is not van Genuchten-Mualem");
  if (!(problem.end_day > problem.start_day)) throw std::invalid_argument("Picard scheme: end_day must follow start_day");
  if (!std::is_sorted(problem.output_days.begin(), problem.output_days.end()) ||
      (!problem.output_days.empty() &&
       (problem.output_days.front() < problem.start_day || problem.output_days.back() > problem.end_day)))
    throw std::invalid_argument("Picard scheme: output days must be increasing and within the run");
}

// Thomas algorithm for lower[i] x[i-1] + diagonal[i] x[i] + upper[i] x[i+1] = rhs[i]; no pivoting,
// which is stable here because the Picard matrix is diagonally dominant. Overwrites diagonal and
// leaves the solution in rhs.
void solve_tridiagonal(std::span<const double> lower, std::span<double> diagonal, std::span<const double> upper,
                       std::span<double> rhs) {
  const std::size_t size = rhs.size();
  for (std::size_t i = 1; i < size; ++i) {
    const double factor = lower[i] / diagonal[i - 1];
    diagonal[i] -= factor * upper[i - 1];
    rhs[i] -= factor * rhs[i - 1];
  }
  rhs[size - 1] /= diagonal[size - 1];
  for (std::size_t i = size - 1; i-- > 0;) rhs[i] = (rhs[i] - upper[i] * rhs[i + 1]) / diagonal[i];
}

// The Picard iteration for one backward-Euler step from (head_cm, at_step_start).
class PicardStep {
 public:
  PicardStep(const Column& column, const PicardSettings& settings, double dry_limit_head_cm)
      : column_(column), settings_(settings), dry_limit_head_cm_(dry_limit_head_cm) {
    const std::size_t count = column.node_count();
    conductance_.resize(count - 1);
    face_flux_.resize(count - 1);
    lower_.resize(count);
    diagonal_.resize(count);
    upper_.resize(count);
    change_.resize(count);
  }

  struct Outcome {
    bool converged = false;
    int iterations = 0;
    SurfaceMode surface_mode = SurfaceMode::flux;
  };

  // head_cm holds h^n on entry and h^{n+1} on return (when converged). at_step_start are the node
  // properties at h^n; at_iterate receives those of the last iterate.
  Outcome solve(std::vector<double>& head_cm, const NodeProperties& at_step_start, NodeProperties& at_iterate,
                double step_days, double potential_surface_flux, SurfaceMode surface_mode) {
    const std::size_t last = column_.node_count() - 1;
    const double dz = column_.node_spacing_cm;
    Outcome outcome{.surface_mode = surface_mode};
    at_iterate = at_step_start;
    for (int iteration = 1; iteration <= settings_.max_iterations; ++iteration) {
      outcome.iterations = iteration;
      if (iteration > 1) column_.evaluate(head_cm, at_iterate);

      // Face terms at the iterate: conductance K_{i+1/2}/dz and flux q_{i+1/2}.
      for (std::size_t face = 0; face < last; ++face) {
        conductance_[face] = 0.5 * (at_iterate.conductivity[face] + at_iterate.conductivity[face + 1]) / dz;
        face_flux_[face] = -conductance_[face] * (head_cm[face + 1] - head_cm[face] - dz);
      }
      // Rows of the Picard system of the file comment, right-hand side R_i(h^{n+1,m}). The surface
      // node has the surface flux above it (its row is replaced below when held at the dry limit).
      for (std::size_t node = 0; node < last; ++node) {
        const double flux_above = node == 0 ? potential_surface_flux : face_flux_[node - 1];
        const double conductance_above = node == 0 ? 0.0 : conductance_[node - 1];
        const double storage_rate = column_.control_length_cm[node] / step_days;
        const double water_content_change = at_iterate.water_content[node] - at_step_start.water_content[node];
        lower_[node] = -conductance_above;
        upper_[node] = -conductance_[node];
        diagonal_[node] = storage_rate * at_iterate.moisture_capacity[node] + conductance_above + conductance_[node];
        change_[node] = flux_above - face_flux_[node] - storage_rate * water_content_change;
      }
      // Fixed heads: identity rows, no change.
      lower_[last] = 0.0;
      upper_[last] = 0.0;
      diagonal_[last] = 1.0;
      change_[last] = 0.0;
      if (outcome.surface_mode == SurfaceMode::dry_limit) {
        diagonal_[0] = 1.0;
        upper_[0] = 0.0;
        change_[0] = 0.0;
      }

      solve_tridiagonal(lower_, diagonal_, upper_, change_);

      double largest_change = 0.0;
      bool finite = true;
      for (std::size_t node = 0; node <= last; ++node) {
        head_cm[node] += change_[node];
        largest_change = std::max(largest_change, std::abs(change_[node]));
        finite = finite && std::isfinite(change_[node]);
      }
      if (!finite) return outcome;  // not converged: the step is cut and redone
      if (outcome.surface_mode == SurfaceMode::flux && potential_surface_flux < 0.0 &&
          head_cm[0] < dry_limit_head_cm_) {
        // Evaporation demand the soil cannot meet: hold the surface at the dry limit and iterate on.
        outcome.surface_mode = SurfaceMode::dry_limit;
        head_cm[0] = dry_limit_head_cm_;
        continue;
      }
      if (largest_change < settings_.head_tolerance_cm) {
        outcome.converged = true;
        return outcome;
      }
    }
    return outcome;
  }

 private:
  const Column& column_;
  const PicardSettings& settings_;
  double dry_limit_head_cm_;
  std::vector<double> conductance_, face_flux_;          // per face i+1/2
  std::vector<double> lower_, diagonal_, upper_, change_;  // per node; change_ becomes delta
};

std::vector<double> breakpoints(const solver::ColumnProblem& problem, const solver::LimitedFlux& top) {
  std::vector<double> times(problem.output_days);
  times.insert(times.end(), top.water_input_cm_per_d.start_days.begin(), top.water_input_cm_per_d.start_days.end());
  times.insert(times.end(), top.potential_evaporation_cm_per_d.start_days.begin(),
               top.potential_evaporation_cm_per_d.start_days.end());
  times.push_back(problem.end_day);
  std::erase_if(times, [&](double t) { return t <= problem.start_day || t > problem.end_day; });
  std::sort(times.begin(), times.end());
  times.erase(std::unique(times.begin(), times.end()), times.end());
  return times;
}

}  // namespace

PicardRun run_picard(const solver::ColumnProblem& problem, std::span<const double> report_depths_cm,
                     const PicardSettings& settings) {
  check_supported(problem);
  const auto& top = std::get<solver::LimitedFlux>(problem.top);
  const double bottom_head_cm = std::get<solver::FixedHead>(problem.bottom).head_cm;
  const double water_table_depth_cm = std::get<solver::Hydrostatic>(problem.initial).water_table_depth_cm;
  const Column column = build_column(problem);
  std::vector<std::size_t> report_nodes;
  for (double depth : report_depths_cm) report_nodes.push_back(problem.grid.face_at(depth));

  const std::size_t last = column.node_count() - 1;
  std::vector<double> head_cm(column.node_count());
  for (std::size_t node = 0; node <= last; ++node) head_cm[node] = column.node_depth_cm[node] - water_table_depth_cm;
  head_cm[last] = bottom_head_cm;

  NodeProperties at_step_start, at_iterate;
  column.evaluate(head_cm, at_step_start);
  const double initial_storage_cm = column.storage_cm(at_step_start);

  PicardRun run;
  std::size_t next_output = 0;
  auto record_outputs = [&](double t) {
    for (; next_output < problem.output_days.size() && problem.output_days[next_output] <= t; ++next_output) {
      run.output_days.push_back(problem.output_days[next_output]);
      std::vector<double> row;
      for (std::size_t node : report_nodes) row.push_back(head_cm[node]);
      run.head_cm.push_back(std::move(row));
    }
  };
  auto finish = [&](double t, std::string reason) {
    run.end_day = t;
    run.complete = reason.empty();
    run.stop_reason = std::move(reason);
    run.storage_change_cm = column.storage_cm(at_step_start) - initial_storage_cm;
    run.balance_error_cm = run.storage_change_cm - (run.surface_flux_cm - run.bottom_flux_cm);
    return run;
  };

  const std::vector<double> stops = breakpoints(problem, top);
  PicardStep picard(column, settings, top.dry_limit_head_cm);
  std::vector<double> trial_head_cm;
  SurfaceMode surface_mode = SurfaceMode::flux;
  double last_surface_flux = 0.0;  // cm/d, of the last accepted step
  double step_days = settings.initial_step_days;  // the controller's step; a step may be cut shorter to end on a stop
  double t = problem.start_day;
  record_outputs(t);

  while (t < problem.end_day) {
    // Never step over a forcing breakpoint or an output time: end the step on it when it would cross it.
    const double next_stop = *std::upper_bound(stops.begin(), stops.end(), t);
    double this_step = std::min(step_days, settings.max_step_days);
    double t_new = t + this_step;
    if (t_new >= next_stop - settings.min_step_days) {
      t_new = next_stop;
      this_step = next_stop - t;
    }
    const double potential_surface_flux =
        top.water_input_cm_per_d.at(t) - top.potential_evaporation_cm_per_d.at(t);
    SurfaceMode start_mode = surface_mode;
    if (start_mode == SurfaceMode::dry_limit && last_surface_flux < potential_surface_flux)
      start_mode = SurfaceMode::flux;  // the soil delivers more than the demand (or it rains): back to the flux

    trial_head_cm = head_cm;
    const auto outcome =
        picard.solve(trial_head_cm, at_step_start, at_iterate, this_step, potential_surface_flux, start_mode);
    run.iterations += outcome.iterations;
    if (!outcome.converged) {
      ++run.rejected_steps;
      step_days = settings.rejection_factor * this_step;
      if (step_days < settings.min_step_days) return finish(t, "step below the minimum");
      continue;
    }

    // Accept: fluxes of the step from the converged heads.
    head_cm.swap(trial_head_cm);
    column.evaluate(head_cm, at_iterate);
    // On the dry limit the surface flux is what the surface node's balance needs:
    // q_surface = q_{1/2} + L_0 (theta_0^{n+1} - theta_0^n)/dt.
    const double surface_flux =
        outcome.surface_mode == SurfaceMode::flux
            ? potential_surface_flux
            : column.flux_below(0, head_cm, at_iterate) +
                  column.control_length_cm[0] * (at_iterate.water_content[0] - at_step_start.water_content[0]) /
                      this_step;
    const double bottom_flux = column.flux_below(last - 1, head_cm, at_iterate);
    run.surface_flux_cm += surface_flux * this_step;
    run.bottom_flux_cm += bottom_flux * this_step;
    if (outcome.surface_mode != surface_mode) ++run.surface_switches;
    surface_mode = outcome.surface_mode;
    last_surface_flux = surface_flux;
    std::swap(at_step_start, at_iterate);
    ++run.steps;
    t = t_new;
    record_outputs(t);
    if (head_cm[0] > 0.0) return finish(t, "surface saturated: ponding is not modelled");

    if (outcome.iterations <= settings.fast_iterations)
      step_days = std::min(settings.growth_factor * step_days, settings.max_step_days);
    else if (outcome.iterations >= settings.slow_iterations)
      step_days = std::max(settings.shrink_factor * step_days, settings.min_step_days);
  }
  return finish(t, "");
}

}  // namespace wetfront::bench
