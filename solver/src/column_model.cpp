#include "column_model.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>
#include <sunmatrix/sunmatrix_band.h>

#include "face_flux.hpp"
#include "series_checks.hpp"

namespace wetfront::solver::detail {

namespace {

constexpr double sink_cutoff = 1e-3;  // cm3/cm3 above the driest table node

double initial_head(const InitialCondition& initial, double depth) {
  if (const auto* wt = std::get_if<Hydrostatic>(&initial)) return depth - wt->water_table_depth_cm;
  if (const auto* u = std::get_if<UniformHead>(&initial)) return u->head_cm;
  const auto& table = std::get<HeadTable>(initial);
  const auto& d = table.depth_cm;
  if (depth <= d.front()) return table.head_cm.front();
  if (depth >= d.back()) return table.head_cm.back();
  const auto it = std::upper_bound(d.begin(), d.end(), depth);
  const auto k = static_cast<std::size_t>(it - d.begin());
  const double w = (depth - d[k - 1]) / (d[k] - d[k - 1]);
  return table.head_cm[k - 1] + w * (table.head_cm[k] - table.head_cm[k - 1]);
}

// A side of a face held at a fixed head (surface or bottom boundary): the slopes are those with
// respect to that head.
FaceSide boundary_side(const soils::HydraulicModel& model, double head_cm) {
  const auto s = soils::evaluate(model, head_cm);
  return {head_cm, s.conductivity, 1.0, s.conductivity_slope, s.conductivity};
}

}  // namespace

ColumnModel::ColumnModel(const ColumnProblem& problem)
    : grid_(problem.grid),
      top_(problem.top),
      bottom_boundary_(problem.bottom),
      sink_(problem.sink),
      face_kind_(problem.face_conductivity),
      initial_(problem.initial),
      settings_(problem.settings) {
  if (std::abs(grid_.total_depth_cm() - problem.soil.total_depth_cm()) > 1e-9)
    throw std::invalid_argument(fmt::format("the grid ends at {} cm but the soil layers end at {} cm",
                                            grid_.total_depth_cm(), problem.soil.total_depth_cm()));
  if (!(problem.specific_storage_per_cm > 0)) throw std::invalid_argument("specific storage must be positive");
  const auto& layers = problem.soil.layers();
  tables_.reserve(layers.size());
  for (const auto& layer : layers) tables_.emplace_back(layer.model, problem.specific_storage_per_cm);
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t i = 0; i < cells(); ++i) {
    const std::size_t layer = problem.soil.layer_index_at(centres[i]);
    cell_table_.push_back(&tables_[layer]);
    cell_model_.push_back(&layers[layer].model);
    saturated_conductivity_.push_back(soils::saturated_conductivity(layers[layer].model));
    inverse_thickness_.push_back(1.0 / grid_.cell_thickness_cm(i));
    centre_distance_.push_back(i == 0 ? centres[0] : centres[i] - centres[i - 1]);
  }
  for (double d : problem.flux_plane_depths_cm) grid_.face_at(d);  // each plane must lie on a face
  if (const auto* lf = std::get_if<LimitedFlux>(&top_)) {
    check_step_series(lf->water_input_cm_per_d, "water input", false);
    check_step_series(lf->potential_evaporation_cm_per_d, "potential evaporation", false);
    atmospheric_ = true;
    dry_limit_head_ = lf->dry_limit_head_cm;
    max_ponded_depth_ = lf->max_ponded_depth_cm;
    if (!(dry_limit_head_ < 0)) throw std::invalid_argument("the dry limit head must be negative");
    if (!(max_ponded_depth_ >= 0)) throw std::invalid_argument("the maximum ponded depth must not be negative");
  } else if (const auto* pf = std::get_if<PrescribedFlux>(&top_)) {
    check_step_series(pf->flux_cm_per_d, "surface flux", false);
  } else {
    check_step_series(std::get<PrescribedHead>(top_).head_cm, "surface head", false);
  }
  if (const auto* table = std::get_if<HeadTable>(&initial_)) {
    if (table->depth_cm.empty() || table->depth_cm.size() != table->head_cm.size())
      throw std::invalid_argument("initial head table needs matching, non-empty depth and head columns");
    for (std::size_t i = 1; i < table->depth_cm.size(); ++i)
      if (!(table->depth_cm[i] > table->depth_cm[i - 1]))
        throw std::invalid_argument("initial head table depths must increase");
  }
  if (std::holds_alternative<SeepageFace>(bottom_boundary_)) bottom_ = BottomMode::seepage_closed;
  if (sink_) {
    // Uptake unknowns only for the cells the sink can ever reach.
    const double deepest = sink_->deepest_depth_cm();
    const auto faces = grid_.face_depths_cm();
    while (uptake_cells_ < cells() && faces[uptake_cells_] < deepest) ++uptake_cells_;
  }
  const std::size_t n = cells();
  for (auto* v : {&potential_, &potential_per_storage_, &head_, &head_per_storage_, &conductivity_,
                  &conductivity_per_storage_, &base_storage_})
    v->assign(n, 0.0);
  interval_hint_.assign(n, 0);
  sink_rate_.assign(uptake_cells_, 0.0);
  sink_slope_.assign(uptake_cells_, 0.0);
  totals_.face.assign(n + 1, 0.0);
}

void ColumnModel::begin_period(double t) {
  period_start_ = t;
  switch_margin_ = kSwitchMargin;
  if (const auto* lf = std::get_if<LimitedFlux>(&top_)) {
    water_input_ = lf->water_input_cm_per_d.at(t);
    potential_evaporation_ = lf->potential_evaporation_cm_per_d.at(t);
  } else if (const auto* pf = std::get_if<PrescribedFlux>(&top_)) {
    prescribed_flux_ = pf->flux_cm_per_d.at(t);
    surface_ = SurfaceMode::flux;
  } else {
    prescribed_head_ = std::get<PrescribedHead>(top_).head_cm.at(t);
    surface_ = SurfaceMode::head;
  }
}

std::vector<double> ColumnModel::breakpoints() const {
  std::vector<double> t;
  auto add = [&t](const StepSeries& s) { t.insert(t.end(), s.start_days.begin(), s.start_days.end()); };
  if (const auto* lf = std::get_if<LimitedFlux>(&top_)) {
    add(lf->water_input_cm_per_d);
    add(lf->potential_evaporation_cm_per_d);
  } else if (const auto* pf = std::get_if<PrescribedFlux>(&top_)) {
    add(pf->flux_cm_per_d);
  } else {
    add(std::get<PrescribedHead>(top_).head_cm);
  }
  if (sink_) {
    const auto s = sink_->breakpoints_days();
    t.insert(t.end(), s.begin(), s.end());
  }
  std::sort(t.begin(), t.end());
  t.erase(std::unique(t.begin(), t.end()), t.end());
  return t;
}

void ColumnModel::initial_state(std::span<double> y) {
  std::fill(y.begin(), y.end(), 0.0);
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t i = 0; i < cells(); ++i)
    base_storage_[i] = grid_.cell_thickness_cm(i) * cell_table_[i]->storage_at(initial_head(initial_, centres[i]));
}

double ColumnModel::soil_storage(std::span<const double> y) const {
  double total = 0;
  for (std::size_t i = 0; i < cells(); ++i) total += cell_storage(i, y);
  return total;
}

SurfaceAccounts ColumnModel::surface_accounts(double t, std::span<const double> y) const {
  const double elapsed = t - restart_time_;
  const double infiltrated = infiltration(y);
  SurfaceAccounts a;
  if (atmospheric_) {
    a.water_input = water_input_ * elapsed;
    a.potential_evaporation = potential_evaporation_ * elapsed;
  } else if (surface_ == SurfaceMode::head) {
    a.water_input = infiltrated;  // a prescribed head's net inflow counts as water input
  } else {
    a.water_input = std::max(prescribed_flux_, 0.0) * elapsed;
    a.potential_evaporation = std::max(-prescribed_flux_, 0.0) * elapsed;
  }
  const double spare = a.water_input - a.potential_evaporation - infiltrated;  // left at the surface
  a.actual_evaporation = surface_ == SurfaceMode::dry ? a.water_input - infiltrated : a.potential_evaporation;
  a.runoff = surface_ == SurfaceMode::full ? spare : 0.0;
  a.ponded_depth = restart_pond_ + (surface_ == SurfaceMode::ponded ? spare : 0.0);
  return a;
}

void ColumnModel::rebase(double t, std::span<double> y) {
  const auto a = surface_accounts(t, y);
  totals_.water_input += a.water_input;
  totals_.potential_evaporation += a.potential_evaporation;
  totals_.actual_evaporation += a.actual_evaporation;
  totals_.runoff += a.runoff;
  restart_pond_ = a.ponded_depth;
  for (std::size_t i = 0; i < cells(); ++i) base_storage_[i] = cell_storage(i, y);
  for (std::size_t j = 0; j <= cells(); ++j) totals_.face[j] += y[face_index(j)];
  for (std::size_t i = 0; i < uptake_cells_; ++i) totals_.transpiration += y[uptake_index(i)];
  std::fill(y.begin(), y.end(), 0.0);
  restart_time_ = t;
}

double ColumnModel::transpiration(std::span<const double> y) const {
  double total = totals_.transpiration;
  for (std::size_t i = 0; i < uptake_cells_; ++i) total += y[uptake_index(i)];
  return total;
}

// Head, conductivity and their slopes with respect to the cell's stored water S = dz s. Inline,
// so that the residual, which reads only the flux, does not pay for the slopes.
inline FaceFlux ColumnModel::interior_face(std::size_t j) const {
  auto side = [&](std::size_t i) {
    return FaceSide{head_[i], conductivity_[i], head_per_storage_[i], conductivity_per_storage_[i],
                    potential_per_storage_[i]};
  };
  if (face_kind_ != FaceConductivity::integral || cell_table_[j - 1] != cell_table_[j])
    return darcy_face(face_kind_ == FaceConductivity::integral ? FaceConductivity::arithmetic : face_kind_, side(j - 1),
                      side(j), centre_distance_[j]);
  return integral_face(side(j - 1), potential_[j - 1], side(j), potential_[j], centre_distance_[j]);
}

FaceFlux ColumnModel::boundary_face(const FaceSide& upper, double upper_potential, const FaceSide& lower,
                                    double lower_potential, double distance_cm) const {
  if (face_kind_ == FaceConductivity::integral)
    return integral_face(upper, upper_potential, lower, lower_potential, distance_cm);
  return darcy_face(FaceConductivity::arithmetic, upper, lower, distance_cm);
}

// Phi of a boundary cell's soil at the boundary head. The boundary heads of a run are few (the
// dry limit, a prescribed head, the water table), and a head below saturation needs the table's
// inverse, so the last two are kept.
double ColumnModel::boundary_potential(std::size_t cell, double head_cm) const {
  if (face_kind_ != FaceConductivity::integral) return 0.0;
  const StorageTable* table = cell_table_[cell];
  for (const auto& kept : boundary_potentials_)
    if (kept.table == table && kept.head_cm == head_cm) return kept.potential;
  const double potential = table->potential_at_head(head_cm);
  boundary_potentials_[next_kept_potential_] = {table, head_cm, potential};
  next_kept_potential_ = (next_kept_potential_ + 1) % boundary_potentials_.size();
  return potential;
}

StoragePoint ColumnModel::cell_point(std::size_t i, std::span<const double> y) const {
  auto p = cell_table_[i]->at(cell_storage(i, y) * inverse_thickness_[i], interval_hint_[i]);
  p.head_per_storage *= inverse_thickness_[i];
  p.conductivity_per_storage *= inverse_thickness_[i];
  p.potential_per_storage *= inverse_thickness_[i];
  return p;
}

// Cell i as the last evaluate_cells left it, slopes per stored water S.
StoragePoint ColumnModel::evaluated_point(std::size_t i) const {
  return {head_[i],      head_per_storage_[i],     conductivity_[i], conductivity_per_storage_[i],
          potential_[i], potential_per_storage_[i]};
}

double ColumnModel::cell_head(std::size_t i, std::span<const double> y) const { return cell_point(i, y).head_cm; }

double ColumnModel::cell_water_content(std::size_t i, std::span<const double> y) const {
  const double s = cell_storage(i, y) * inverse_thickness_[i];
  return cell_table_[i]->water_content(s, cell_table_[i]->at(s).head_cm);
}

void ColumnModel::evaluate_cells(std::span<const double> y) {
  evaluated_state_.clear();  // set again by residual()
  // The potential only for the integral mean: without it the compiler drops its two cubics.
  auto evaluate = [&](auto with_potential) {
    for (std::size_t i = 0; i < cells(); ++i) {
      const double per_thickness = inverse_thickness_[i];
      const auto p = cell_table_[i]->at(cell_storage(i, y) * per_thickness, interval_hint_[i]);
      head_[i] = p.head_cm;
      head_per_storage_[i] = p.head_per_storage * per_thickness;
      conductivity_[i] = p.conductivity;
      conductivity_per_storage_[i] = p.conductivity_per_storage * per_thickness;
      if constexpr (with_potential) {
        potential_[i] = p.potential;
        potential_per_storage_[i] = p.potential_per_storage * per_thickness;
      }
    }
  };
  if (face_kind_ == FaceConductivity::integral)
    evaluate(std::true_type{});
  else
    evaluate(std::false_type{});
  // Sinks are constant in time over a forcing period (their changes are breakpoints), so they
  // see the period start: a residual evaluated exactly at the period end keeps this period's values.
  if (uptake_cells_ > 0) {
    sink_->evaluate(period_start_, grid_.cell_depths_cm().first(uptake_cells_), std::span(head_).first(uptake_cells_),
                    sink_rate_, sink_slope_);
    // A sink cannot take water the cell does not hold: within sink_cutoff of the driest table
    // node (theta_r to within round-off) the rate falls linearly to zero. Soils whose water is
    // nearly all gone at moderate suction (a Gardner soil with a large sorptive number) would
    // otherwise be emptied below theta_r at the Feddes rate until the head reached wilting.
    for (std::size_t i = 0; i < uptake_cells_; ++i) {
      const double above_dry = cell_storage(i, y) * inverse_thickness_[i] - cell_table_[i]->dry_storage();
      if (above_dry >= sink_cutoff) continue;
      const double share = std::max(above_dry, 0.0) / sink_cutoff;
      // d(rate share)/dh = rate' share + rate d(share)/dS / (dh/dS)
      const double share_per_head = above_dry > 0 ? inverse_thickness_[i] / (sink_cutoff * head_per_storage_[i]) : 0.0;
      sink_slope_[i] = sink_slope_[i] * share + sink_rate_[i] * share_per_head;
      sink_rate_[i] *= share;
    }
  }
}

double ColumnModel::surface_head(double t, std::span<const double> y) const {
  switch (surface_) {
    case SurfaceMode::ponded: return surface_accounts(t, y).ponded_depth;
    case SurfaceMode::full: return max_ponded_depth_;
    case SurfaceMode::dry: return dry_limit_head_;
    case SurfaceMode::head: return prescribed_head_;
    case SurfaceMode::flux: break;
  }
  return 0.0;
}

// Flux from a surface held at a head into the top cell: Darcy over half the top cell. Boundary
// half-cells take the integral mean under the integral default and the arithmetic mean
// otherwise: a harmonic or geometric mean with a dry top cell would shut the surface to rain
// (the surface value is a boundary condition, not a cell).
ColumnModel::SurfaceFlux ColumnModel::head_limited_flux(double hs, const StoragePoint& top) const {
  const FaceSide cell{top.head_cm, top.conductivity, top.head_per_storage, top.conductivity_per_storage,
                      top.potential_per_storage};
  const auto f = boundary_face(boundary_side(*cell_model_[0], hs), boundary_potential(0, hs), cell, top.potential,
                               centre_distance_[0]);
  return {f.flux, f.slope_lower, f.slope_upper};
}

ColumnModel::SurfaceFlux ColumnModel::surface_flux(double t, std::span<const double> y, const StoragePoint& top) const {
  if (surface_ == SurfaceMode::flux) return {atmospheric_ ? net_input() : prescribed_flux_, 0.0, 0.0};
  auto f = head_limited_flux(surface_head(t, y), top);
  if (surface_ != SurfaceMode::ponded) f.slope_pond = 0.0;
  return f;
}

ColumnModel::BottomFlux ColumnModel::bottom_flux(const StoragePoint& last) const {
  const std::size_t n = cells();
  const FaceSide cell{last.head_cm, last.conductivity, last.head_per_storage, last.conductivity_per_storage,
                      last.potential_per_storage};
  auto fixed = [&](double hb) {
    const double distance = grid_.total_depth_cm() - grid_.cell_depths_cm()[n - 1];
    const auto f = boundary_face(cell, last.potential, boundary_side(*cell_model_[n - 1], hb),
                                 boundary_potential(n - 1, hb), distance);
    return BottomFlux{f.flux, f.slope_upper};
  };
  if (std::holds_alternative<FreeDrainage>(bottom_boundary_)) return {last.conductivity, last.conductivity_per_storage};
  if (const auto* fh = std::get_if<FixedHead>(&bottom_boundary_)) return fixed(fh->head_cm);
  if (bottom_ == BottomMode::seepage_open) return fixed(0.0);
  return {0.0, 0.0};
}

void ColumnModel::residual(double t, std::span<const double> y, std::span<const double> yp, std::span<double> r) {
  evaluate_cells(y);
  evaluated_state_.assign(y.begin(), y.end());
  const std::size_t n = cells();
  const StoragePoint top = evaluated_point(0), last = evaluated_point(n - 1);
  r[face_index(0)] = yp[face_index(0)] - surface_flux(t, y, top).flux;
  for (std::size_t j = 1; j < n; ++j) {
    if (face_kind_ == FaceConductivity::integral) {
      r[face_index(j)] = yp[face_index(j)] - interior_face(j).flux;
      continue;
    }
    const double gradient = 1.0 - (head_[j] - head_[j - 1]) / centre_distance_[j];
    r[face_index(j)] =
        yp[face_index(j)] - face_mean(face_kind_, conductivity_[j - 1], conductivity_[j]).mean * gradient;
  }
  r[face_index(n)] = yp[face_index(n)] - bottom_flux(last).flux;
  for (std::size_t i = 0; i < uptake_cells_; ++i)
    r[uptake_index(i)] = yp[uptake_index(i)] - sink_rate_[i] * grid_.cell_thickness_cm(i);
}

// dF/dy + cj dF/dy'. A head and a conductivity depend on their cell's stored water,
// S_i = base + F_i - F_(i+1) - U_i, with the slopes read from the storage table.
void ColumnModel::jacobian(double t, double cj, std::span<const double> y, SUNMatrix band) {
  // IDA sets up the linear system right after a residual at the same state (ours, or its own
  // first call of a step); the cells are evaluated again only if the state differs.
  if (!std::equal(y.begin(), y.end(), evaluated_state_.begin(), evaluated_state_.end())) evaluate_cells(y);
  // The matrix comes zeroed: IDA zeroes it before it asks for the Jacobian.
  auto at = [band](std::size_t row, std::size_t col) -> double& {
    return SM_ELEMENT_B(band, static_cast<sunindextype>(row), static_cast<sunindextype>(col));
  };
  // d(row)/d(S_cell), spread over the unknowns that make up S_cell.
  auto add_storage_slope = [&](std::size_t row, std::size_t cell, double slope) {
    at(row, face_index(cell)) += slope;
    at(row, face_index(cell + 1)) -= slope;
    if (cell < uptake_cells_) at(row, uptake_index(cell)) -= slope;
  };
  const std::size_t n = cells();
  const std::size_t f0 = face_index(0);
  const auto top = surface_flux(t, y, evaluated_point(0));
  at(f0, f0) += cj;
  add_storage_slope(f0, 0, -top.slope_storage);
  at(f0, f0) += top.slope_pond;  // the pond depth falls as F_0 grows: dP/dF_0 = -1
  for (std::size_t j = 1; j < n; ++j) {
    const std::size_t row = face_index(j);
    const auto f = interior_face(j);
    at(row, row) += cj;
    add_storage_slope(row, j - 1, -f.slope_upper);
    add_storage_slope(row, j, -f.slope_lower);
  }
  const std::size_t last = face_index(n);
  at(last, last) += cj;
  add_storage_slope(last, n - 1, -bottom_flux(evaluated_point(n - 1)).slope_storage);
  for (std::size_t i = 0; i < uptake_cells_; ++i) {
    at(uptake_index(i), uptake_index(i)) += cj;
    add_storage_slope(uptake_index(i), i, -sink_slope_[i] * head_per_storage_[i] * grid_.cell_thickness_cm(i));
  }
}

void ColumnModel::consistent_rates(double t, std::span<const double> y, std::span<double> yp) {
  std::fill(yp.begin(), yp.end(), 0.0);
  std::vector<double> r(yp.size());
  residual(t, y, yp, r);
  for (std::size_t k = 0; k < yp.size(); ++k) yp[k] = -r[k];
}

ProfileSnapshot ColumnModel::snapshot(double t, std::span<const double> y) {
  // An output must not change what the next step sees (the error weights read the cells as the
  // last residual left them), so the workspace is put back when the snapshot is taken.
  auto kept = std::tie(head_, head_per_storage_, conductivity_, conductivity_per_storage_, potential_,
                       potential_per_storage_, sink_rate_, sink_slope_, evaluated_state_);
  const auto saved = std::make_tuple(head_, head_per_storage_, conductivity_, conductivity_per_storage_, potential_,
                                     potential_per_storage_, sink_rate_, sink_slope_, evaluated_state_);
  const ProfileSnapshot snap = snapshot_here(t, y);
  kept = saved;
  return snap;
}

ProfileSnapshot ColumnModel::snapshot_here(double t, std::span<const double> y) {
  evaluate_cells(y);
  const std::size_t n = cells();
  ProfileSnapshot snap;
  snap.time_days = t;
  snap.head_cm = head_;
  snap.conductivity_cm_per_d = conductivity_;
  snap.water_content.resize(n);
  for (std::size_t i = 0; i < n; ++i)
    snap.water_content[i] = cell_table_[i]->water_content(cell_storage(i, y) * inverse_thickness_[i], head_[i]);
  snap.sink_rate_per_day.assign(n, 0.0);
  std::copy(sink_rate_.begin(), sink_rate_.end(), snap.sink_rate_per_day.begin());
  // Face fluxes are the rates of the face unknowns: the residual with y' = 0 is -q.
  std::vector<double> zero(y.size(), 0.0), r(y.size());
  residual(t, y, zero, r);
  snap.face_flux_cm_per_d.resize(n + 1);
  for (std::size_t j = 0; j <= n; ++j) snap.face_flux_cm_per_d[j] = -r[face_index(j)];
  snap.ponded_depth_cm = surface_accounts(t, y).ponded_depth;
  return snap;
}

void ColumnModel::error_weights(std::span<const double> y, std::span<double> weights) const {
  const std::size_t n = cells();
  // 1 / tolerance on the stored water of cell i, the tolerance being the smallest of the storage
  // tolerance and of the head tolerances divided by dh/dS.
  //
  // For the faces, a cell below the surface cell counts as no thinner than kToleranceLayerCm in
  // its storage and conducting-head tolerances: a cell's tolerance shrinks with its thickness
  // while the water crossing a face does not, so without that floor every halving of the cells
  // halved each face's tolerance, and year200's time-stepping error fell from 0.037 cm RMS on
  // 2 cm cells to 0.005 cm on 0.125 cm cells at 2.3 times the steps (bench/README.md). The
  // surface cell keeps its own tolerances (the surface switches read its state: loosened, they
  // chattered), and so does every dry cell's relative head tolerance (loosened, thin dry cells
  // drifted far below the dry limit). step_norm holds each cell to its own tolerances.
  const double per_head_tolerance = 1.0 / settings_.head_tolerance_cm;
  cell_weights_.resize(n);
  auto face_side_weight = [&](std::size_t i) {
    const double layer = i == 0 ? 1.0 : std::min(1.0, grid_.cell_thickness_cm(i) / kToleranceLayerCm);
    const double storage_tolerance =
        settings_.absolute_tolerance_storage_cm + settings_.relative_tolerance * std::abs(cell_storage(i, y));
    // The head, dh/dS and K as the last residual left them (the Newton iterate before this
    // step's last correction: near enough for a tolerance, and no table lookup), or looked up
    // when an output or a Jacobian elsewhere has moved the workspace.
    const StoragePoint p = evaluated_state_.empty()
                               ? cell_point(i, y)
                               : StoragePoint{head_[i], head_per_storage_[i], conductivity_[i], 0.0};
    if (!(p.head_per_storage > 0)) {
      cell_weights_[i] = 1.0 / storage_tolerance;
      return layer * cell_weights_[i];
    }
    // Any cell: its head may err by a fraction of itself (binds in dry cells, where dh/dS is so
    // large that a storage tolerance alone let thin surface cells reach -1e7 cm); a conducting
    // cell by head_tolerance at most. One division gives both reciprocals.
    const double head_tolerance = settings_.head_relative_tolerance * (std::abs(p.head_cm) + 1.0);
    const double reciprocal = 1.0 / (storage_tolerance * head_tolerance);
    const double storage = head_tolerance * reciprocal;
    const double relative = p.head_per_storage * storage_tolerance * reciprocal;
    if (p.conductivity >= 0.01 * saturated_conductivity_[i]) {
      cell_weights_[i] = std::max({storage, relative, p.head_per_storage * per_head_tolerance});
      return layer * cell_weights_[i];
    }
    cell_weights_[i] = std::max(storage, relative);
    return std::max(layer * storage, relative);
  };
  // A face or sink amount moves water between cells: it takes the tighter of their tolerances.
  double above = face_side_weight(0);
  weights[face_index(0)] = above;
  for (std::size_t i = 0; i < n; ++i) {
    const double below = i + 1 < n ? face_side_weight(i + 1) : above;
    weights[face_index(i + 1)] = std::max(above, below);
    if (i < uptake_cells_) weights[uptake_index(i)] = above;
    above = below;
  }
}

// IDA's weighted RMS of n components lets one component alone reach sqrt(n) times its
// tolerance, and with the face tolerances of error_weights floored at a 1 cm layer's that was
// enough, on 800 and 1600 cells, to accept steps that emptied one thin cell at a wetting front
// (-1140 cm between -111 and -48 cm; -3e5 cm between -119 and -46 cm). The change of each cell's
// stored water, x_i - x_(i+1) - U_i, is therefore also measured in that cell's own tolerance,
// and the largest of them, divided by kLocalShare, bounds the norm from below. kLocalShare 30:
// with 10 the bound held every front cell so tightly that ponded infiltration took more steps
// than before the floor; with 30 no such step on year200's 800 and 1600 cells read every
// 0.002 d (bench/front_outliers), nor with 60 on 1600 cells (bench/README.md).
double ColumnModel::step_norm(std::span<const double> x, std::span<const double> weights) const {
  const std::size_t n = cells();
  const double* c = cell_weights_.data();
  const double* xs = x.data();
  const double* ws = weights.data();
  double sum[4] = {}, largest[4] = {};
  const bool own_weights = cell_weights_.size() == n && x.size() == unknowns();  // else the plain RMS
  if (own_weights && uptake_cells_ == 0) {  // unknowns are the faces 0..n: cell i lies between x_i and x_(i+1)
    std::size_t i = 0;
    for (; i + 4 <= n; i += 4)  // four running sums and maxima: one alone waits on each addition
      for (std::size_t k = 0; k < 4; ++k) {
        const double face = xs[i + k] * ws[i + k];
        const double cell = (xs[i + k] - xs[i + k + 1]) * c[i + k];
        sum[k] += face * face;
        largest[k] = std::max(largest[k], cell * cell);
      }
    for (; i < n; ++i) {
      const double cell = (xs[i] - xs[i + 1]) * c[i];
      sum[0] += (xs[i] * ws[i]) * (xs[i] * ws[i]);
      largest[0] = std::max(largest[0], cell * cell);
    }
    sum[1] += (xs[n] * ws[n]) * (xs[n] * ws[n]);
  } else {
    for (std::size_t i = 0; i < x.size(); ++i) sum[0] += (xs[i] * ws[i]) * (xs[i] * ws[i]);
    for (std::size_t i = 0; own_weights && i < n; ++i) {
      const double uptake = i < uptake_cells_ ? xs[uptake_index(i)] : 0.0;
      const double cell = (xs[face_index(i)] - xs[face_index(i + 1)] - uptake) * c[i];
      largest[0] = std::max(largest[0], cell * cell);
    }
  }
  // Squares throughout: the largest cell term is compared as (largest / kLocalShare)^2.
  const double square_sum = (sum[0] + sum[1]) + (sum[2] + sum[3]);
  const double largest_square = std::max(std::max(largest[0], largest[1]), std::max(largest[2], largest[3]));
  return std::sqrt(std::max(square_sum / static_cast<double>(x.size()), largest_square / (kLocalShare * kLocalShare)));
}

// Event functions. Right after a switch the new mode's function starts at zero and moves away
// from it; the margins (1e-10 of the flux scale, 1e-12 cm of depth) keep round-off from reading
// as a crossing.
void ColumnModel::events(double t, std::span<const double> y, std::span<double> g) const {
  std::fill(g.begin(), g.end(), 1.0);
  if (atmospheric_ && surface_ != SurfaceMode::head) {
    const auto top = cell_point(0, y);
    const double net = net_input();
    const double flux_margin = switch_margin_ * (1.0 + std::abs(net));
    const double depth_margin = 1e-12;
    const double widened = switch_margin_ > kSwitchMargin ? flux_margin : 0.0;  // flux mode: no margin unless widened
    double& limit = g[surface_limit_event];
    switch (surface_) {
      case SurfaceMode::flux:
        if (net > 0) limit = head_limited_flux(0.0, top).flux - net + widened;  // capacity below supply
        if (net < 0)
          limit = net - head_limited_flux(dry_limit_head_, top).flux + widened;  // demand above what soil gives
        break;
      case SurfaceMode::ponded: {
        const double pond = surface_accounts(t, y).ponded_depth;
        limit = max_ponded_depth_ - pond + depth_margin;  // storage full
        g[pond_emptied_event] = pond + depth_margin;
        break;
      }
      case SurfaceMode::full: limit = net - head_limited_flux(max_ponded_depth_, top).flux + flux_margin; break;
      case SurfaceMode::dry: limit = head_limited_flux(dry_limit_head_, top).flux - net + flux_margin; break;
      case SurfaceMode::head: break;
    }
  }
  if (bottom_ != BottomMode::normal) {
    const std::size_t n = cells();
    const auto last = cell_point(n - 1, y);
    if (bottom_ == BottomMode::seepage_closed)  // bottom saturates
      g[seepage_event] = -(last.head_cm + (grid_.total_depth_cm() - grid_.cell_depths_cm()[n - 1])) + 1e-12;
    else  // outflow stops
      g[seepage_event] = bottom_flux(last).flux + 1e-12;
  }
}

bool ColumnModel::switch_mode(EventSlot slot, double, std::span<const double>) {
  if (slot == seepage_event) {
    bottom_ = bottom_ == BottomMode::seepage_closed ? BottomMode::seepage_open : BottomMode::seepage_closed;
    return false;
  }
  const bool can_pond = max_ponded_depth_ > 0;
  switch (surface_) {
    case SurfaceMode::flux:
      surface_ = net_input() > 0 ? (can_pond ? SurfaceMode::ponded : SurfaceMode::full) : SurfaceMode::dry;
      break;
    case SurfaceMode::ponded: surface_ = slot == surface_limit_event ? SurfaceMode::full : SurfaceMode::flux; break;
    case SurfaceMode::full: surface_ = can_pond ? SurfaceMode::ponded : SurfaceMode::flux; break;
    case SurfaceMode::dry: surface_ = SurfaceMode::flux; break;
    case SurfaceMode::head: break;
  }
  return true;
}

void ColumnModel::choose_modes(double t, std::span<const double> y) {
  if (bottom_ != BottomMode::normal) {
    const std::size_t n = cells();
    const auto last = cell_point(n - 1, y);
    const bool saturated = last.head_cm + (grid_.total_depth_cm() - grid_.cell_depths_cm()[n - 1]) >= 0;
    if (bottom_ == BottomMode::seepage_closed && saturated) bottom_ = BottomMode::seepage_open;
    if (bottom_ == BottomMode::seepage_open && bottom_flux(last).flux <= 0) bottom_ = BottomMode::seepage_closed;
  }
  if (!atmospheric_) return;
  const auto top = cell_point(0, y);
  const double net = net_input();
  const double pond = surface_accounts(t, y).ponded_depth;
  if (pond > 0 && max_ponded_depth_ > 0) {
    const bool at_max = pond >= max_ponded_depth_ * (1 - 1e-12);
    surface_ =
        at_max && net - head_limited_flux(max_ponded_depth_, top).flux > 0 ? SurfaceMode::full : SurfaceMode::ponded;
    return;
  }
  if (net > 0 && head_limited_flux(0.0, top).flux < net)
    surface_ = max_ponded_depth_ > 0 ? SurfaceMode::ponded : SurfaceMode::full;
  else if (net < 0 && head_limited_flux(dry_limit_head_, top).flux > net)
    surface_ = SurfaceMode::dry;
  else
    surface_ = SurfaceMode::flux;
}

}  // namespace wetfront::solver::detail
