#include "column_model.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>
#include <sunmatrix/sunmatrix_band.h>

#include "face_flux.hpp"

namespace wetfront::solver::detail {

namespace {

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

// Head at which the model's effective saturation reaches one (0 cm, or the air-entry head).
double saturation_head(const soils::HydraulicModel& model) {
  if (const auto* ae = std::get_if<soils::VanGenuchtenAirEntry>(&model)) return ae->air_entry_head_cm;
  if (const auto* bc = std::get_if<soils::BrooksCorey>(&model)) return bc->bubbling_head_cm;
  return 0.0;
}

void check_series(const StepSeries& s, const char* what) {
  if (s.values.empty() || s.values.size() != s.start_days.size())
    throw std::invalid_argument(fmt::format("{}: a step series needs one value per start time", what));
  for (std::size_t i = 1; i < s.start_days.size(); ++i)
    if (!(s.start_days[i] > s.start_days[i - 1]))
      throw std::invalid_argument(fmt::format("{}: start times must increase", what));
}

}  // namespace

ColumnModel::ColumnModel(const ColumnProblem& problem)
    : grid_(problem.grid),
      top_(problem.top),
      bottom_boundary_(problem.bottom),
      sink_(problem.sink),
      specific_storage_(problem.specific_storage_per_cm),
      face_kind_(problem.face_conductivity),
      initial_(problem.initial) {
  if (std::abs(grid_.total_depth_cm() - problem.soil.total_depth_cm()) > 1e-9)
    throw std::invalid_argument(fmt::format("the grid ends at {} cm but the soil layers end at {} cm",
                                            grid_.total_depth_cm(), problem.soil.total_depth_cm()));
  if (!(specific_storage_ > 0)) throw std::invalid_argument("specific storage must be positive");
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t i = 0; i < cells(); ++i) {
    cell_model_.push_back(&problem.soil.model_at(centres[i]));
    saturation_head_.push_back(saturation_head(*cell_model_.back()));
  }
  for (double d : problem.flux_plane_depths_cm) plane_faces_.push_back(grid_.face_at(d));
  if (const auto* lf = std::get_if<LimitedFlux>(&top_)) {
    check_series(lf->water_input_cm_per_d, "water input");
    check_series(lf->potential_evaporation_cm_per_d, "potential evaporation");
    atmospheric_ = true;
    dry_limit_head_ = lf->dry_limit_head_cm;
    max_ponded_depth_ = lf->max_ponded_depth_cm;
    if (!(dry_limit_head_ < 0)) throw std::invalid_argument("the dry limit head must be negative");
    if (max_ponded_depth_ < 0) throw std::invalid_argument("the maximum ponded depth must not be negative");
  } else if (const auto* pf = std::get_if<PrescribedFlux>(&top_)) {
    check_series(pf->flux_cm_per_d, "surface flux");
  } else {
    check_series(std::get<PrescribedHead>(top_).head_cm, "surface head");
  }
  if (const auto* table = std::get_if<HeadTable>(&initial_)) {
    if (table->depth_cm.empty() || table->depth_cm.size() != table->head_cm.size())
      throw std::invalid_argument("initial head table needs matching, non-empty depth and head columns");
    for (std::size_t i = 1; i < table->depth_cm.size(); ++i)
      if (!(table->depth_cm[i] > table->depth_cm[i - 1]))
        throw std::invalid_argument("initial head table depths must increase");
  }
  if (std::holds_alternative<SeepageFace>(bottom_boundary_)) bottom_ = BottomMode::seepage_closed;
  const std::size_t n = cells();
  for (auto* v : {&head_, &conductivity_, &conductivity_slope_, &capacity_, &sink_rate_, &sink_slope_})
    v->assign(n, 0.0);
}

void ColumnModel::begin_period(double t) {
  period_start_ = t;
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

double ColumnModel::stored_water(std::size_t cell, double h) const {
  const double over = std::max(h - saturation_head_[cell], 0.0);
  return grid_.cell_thickness_cm(cell) * (soils::water_content(*cell_model_[cell], h) + specific_storage_ * over);
}

double ColumnModel::head_for_storage(std::size_t cell, double stored) const {
  const auto& model = *cell_model_[cell];
  const double theta = stored / grid_.cell_thickness_cm(cell);
  const double theta_s = soils::saturated_water_content(model);
  if (theta >= theta_s) return saturation_head_[cell] + (theta - theta_s) / specific_storage_;
  const double theta_r = soils::residual_water_content(model);
  if (!(theta > theta_r)) return std::numeric_limits<double>::quiet_NaN();
  return soils::pressure_head_at(model, theta);
}

double ColumnModel::capacity_total(std::size_t cell) const {
  return capacity_[cell] + (head_[cell] > saturation_head_[cell] ? specific_storage_ : 0.0);
}

void ColumnModel::initial_state(std::span<double> y) const {
  y[0] = 0.0;
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t i = 0; i < cells(); ++i) {
    y[storage_index(i)] = stored_water(i, initial_head(initial_, centres[i]));
  }
}

// Heads, conductivities and sink of every cell at state y. IDA asks for the residual, the
// roots and the quadrature rates at the same state, so the last evaluation is kept.
void ColumnModel::evaluate_cells(double, std::span<const double> y) {
  const bool same_state = evaluated_state_.size() == y.size() && evaluated_period_ == period_start_ &&
                          std::equal(y.begin(), y.end(), evaluated_state_.begin());
  if (same_state) return;
  for (std::size_t i = 0; i < cells(); ++i) {
    const double h = head_for_storage(i, y[storage_index(i)]);
    head_[i] = h;
    const auto s = soils::evaluate(*cell_model_[i], h);
    conductivity_[i] = s.conductivity;
    conductivity_slope_[i] = s.conductivity_slope;
    capacity_[i] = s.moisture_capacity;
  }
  // Sinks are constant in time over a forcing period (their changes are breakpoints), so they
  // see the period start: a residual evaluated exactly at the period end keeps this period's values.
  if (sink_) sink_->evaluate(period_start_, grid_.cell_depths_cm(), head_, sink_rate_, sink_slope_);
  evaluated_state_.assign(y.begin(), y.end());
  evaluated_period_ = period_start_;
}

double ColumnModel::surface_head(std::span<const double> y) const {
  switch (surface_) {
    case SurfaceMode::ponded: return y[0];
    case SurfaceMode::full: return max_ponded_depth_;
    case SurfaceMode::dry: return dry_limit_head_;
    case SurfaceMode::head: return prescribed_head_;
    case SurfaceMode::flux: break;
  }
  return 0.0;
}

// Flux from a surface held at a head into the top cell: Darcy over half the top cell.
ColumnModel::SurfaceFlux ColumnModel::head_limited_flux(double hs) const {
  const auto s = soils::evaluate(*cell_model_[0], hs);
  const auto f = darcy_face(face_kind_, hs, s.conductivity, s.conductivity_slope, head_[0], conductivity_[0],
                            conductivity_slope_[0], grid_.cell_depths_cm()[0]);
  return {f.flux, f.slope_lower, f.slope_upper};
}

ColumnModel::SurfaceFlux ColumnModel::surface_flux(std::span<const double> y) const {
  if (surface_ == SurfaceMode::flux) return {atmospheric_ ? net_input() : prescribed_flux_, 0.0, 0.0};
  auto f = head_limited_flux(surface_head(y));
  if (surface_ != SurfaceMode::ponded) f.slope_pond = 0.0;
  return f;
}

ColumnModel::BottomFlux ColumnModel::bottom_flux() const {
  const std::size_t last = cells() - 1;
  const double distance = grid_.total_depth_cm() - grid_.cell_depths_cm()[last];
  auto fixed = [&](double hb) {
    const auto s = soils::evaluate(*cell_model_[last], hb);
    const auto f = darcy_face(face_kind_, head_[last], conductivity_[last], conductivity_slope_[last], hb,
                              s.conductivity, s.conductivity_slope, distance);
    return BottomFlux{f.flux, f.slope_upper};
  };
  if (std::holds_alternative<FreeDrainage>(bottom_boundary_)) return {conductivity_[last], conductivity_slope_[last]};
  if (const auto* fh = std::get_if<FixedHead>(&bottom_boundary_)) return fixed(fh->head_cm);
  if (bottom_ == BottomMode::seepage_open) return fixed(0.0);
  return {0.0, 0.0};
}

double ColumnModel::pond_rate(std::span<const double>, const SurfaceFlux& top) const {
  return surface_ == SurfaceMode::ponded ? net_input() - top.flux : 0.0;
}

void ColumnModel::residual(double t, std::span<const double> y, std::span<const double> yp, std::span<double> r) {
  evaluate_cells(t, y);
  const auto top = surface_flux(y);
  const auto bottom = bottom_flux();
  r[0] = yp[0] - pond_rate(y, top);
  const auto centres = grid_.cell_depths_cm();
  double q_in = top.flux;
  for (std::size_t i = 0; i < cells(); ++i) {
    const double q_out =
        i + 1 < cells()
            ? darcy_face(face_kind_, head_[i], conductivity_[i], 0.0, head_[i + 1], conductivity_[i + 1], 0.0,
                         centres[i + 1] - centres[i]).flux
            : bottom.flux;
    const double dz = grid_.cell_thickness_cm(i);
    r[storage_index(i)] = yp[storage_index(i)] - (q_in - q_out - sink_rate_[i] * dz);
    q_in = q_out;
  }
}

// dF/dy + cj dF/dy'. The flux slopes with respect to heads are carried to storage by
// dh/dS = 1 / (dz C), C the total capacity (moisture capacity plus specific storage).
void ColumnModel::jacobian(double t, double cj, std::span<const double> y, SUNMatrix band) {
  evaluate_cells(t, y);
  SUNMatZero(band);
  const auto top = surface_flux(y);
  const auto bottom = bottom_flux();
  std::vector<double>& dh_ds = head_per_storage_;
  dh_ds.resize(cells());
  for (std::size_t i = 0; i < cells(); ++i) dh_ds[i] = 1.0 / (grid_.cell_thickness_cm(i) * capacity_total(i));
  auto at = [band](std::size_t row, std::size_t col) -> double& {
    return SM_ELEMENT_B(band, static_cast<sunindextype>(row), static_cast<sunindextype>(col));
  };
  // Ponding row: P' - (net input - q_0(P, h_0)).
  at(0, 0) = cj;
  if (surface_ == SurfaceMode::ponded) {
    at(0, 0) += top.slope_pond;
    at(0, storage_index(0)) = top.slope_head * dh_ds[0];
  }
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t i = 0; i < cells(); ++i) {
    const std::size_t row = storage_index(i);
    const double dz = grid_.cell_thickness_cm(i);
    double self = sink_slope_[i] * dz;  // d(-f_i)/dh_i, collected below
    // Inflow through the upper face.
    if (i == 0) {
      self -= top.slope_head;
      if (surface_ == SurfaceMode::ponded) at(row, 0) -= top.slope_pond;
    } else {
      const auto f = darcy_face(face_kind_, head_[i - 1], conductivity_[i - 1], conductivity_slope_[i - 1], head_[i],
                                conductivity_[i], conductivity_slope_[i], centres[i] - centres[i - 1]);
      at(row, storage_index(i - 1)) -= f.slope_upper * dh_ds[i - 1];
      self -= f.slope_lower;
    }
    // Outflow through the lower face.
    if (i + 1 < cells()) {
      const auto f = darcy_face(face_kind_, head_[i], conductivity_[i], conductivity_slope_[i], head_[i + 1],
                                conductivity_[i + 1], conductivity_slope_[i + 1], centres[i + 1] - centres[i]);
      self += f.slope_upper;
      at(row, storage_index(i + 1)) += f.slope_lower * dh_ds[i + 1];
    } else {
      self += bottom.slope_head;
    }
    at(row, row) = cj + self * dh_ds[i];
  }
}

void ColumnModel::consistent_rates(double t, std::span<const double> y, std::span<double> yp) {
  std::vector<double> zero(yp.size(), 0.0), r(yp.size());
  residual(t, y, zero, r);
  // With y' = 0 the residual of each differential row is minus its rate.
  yp[0] = -r[0];
  for (std::size_t i = 0; i < cells(); ++i) yp[storage_index(i)] = -r[storage_index(i)];
}

void ColumnModel::quadrature_rates(double t, std::span<const double> y, std::span<double> rates) {
  evaluate_cells(t, y);
  const auto top = surface_flux(y);
  const auto bottom = bottom_flux();
  double input = 0, potential = 0, actual = 0, runoff = 0;
  if (atmospheric_) {
    input = water_input_;
    potential = potential_evaporation_;
    actual = surface_ == SurfaceMode::dry ? water_input_ - top.flux : potential_evaporation_;
    if (surface_ == SurfaceMode::full) runoff = net_input() - top.flux;
  } else {
    // A prescribed flux or head: inflow counts as water input, outflow as evaporation.
    input = std::max(top.flux, 0.0);
    potential = actual = std::max(-top.flux, 0.0);
  }
  rates[q_water_input] = input;
  rates[q_potential_evaporation] = potential;
  rates[q_actual_evaporation] = actual;
  rates[q_runoff] = runoff;
  rates[q_infiltration] = top.flux;
  double uptake = 0;
  for (std::size_t i = 0; i < cells(); ++i) uptake += sink_rate_[i] * grid_.cell_thickness_cm(i);
  rates[q_transpiration] = uptake;
  rates[q_bottom] = bottom.flux;
  std::vector<double> flux(cells() + 1);
  face_fluxes(t, y, flux);
  for (std::size_t k = 0; k < plane_faces_.size(); ++k) rates[q_first_plane + k] = flux[plane_faces_[k]];
}

void ColumnModel::face_fluxes(double t, std::span<const double> y, std::span<double> flux) {
  evaluate_cells(t, y);
  flux[0] = surface_flux(y).flux;
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t j = 1; j < cells(); ++j)
    flux[j] = darcy_face(face_kind_, head_[j - 1], conductivity_[j - 1], 0.0, head_[j], conductivity_[j], 0.0,
                         centres[j] - centres[j - 1]).flux;
  flux[cells()] = bottom_flux().flux;
}

void ColumnModel::cell_properties(std::span<const double> y, std::span<double> head, std::span<double> theta,
                                  std::span<double> k) const {
  for (std::size_t i = 0; i < cells(); ++i) {
    const double h = head_for_storage(i, y[storage_index(i)]);
    head[i] = h;
    theta[i] = soils::water_content(*cell_model_[i], h);
    k[i] = soils::conductivity(*cell_model_[i], h);
  }
}

void ColumnModel::sink_rates(double t, std::span<const double> y, std::span<double> rate) {
  evaluate_cells(t, y);
  std::copy(sink_rate_.begin(), sink_rate_.end(), rate.begin());
}

// Root functions; each mode's switch fires when its function falls through zero.
//  slot 0, 1: surface;  slot 2: seepage face.
// Right after a switch the new mode's function starts at zero and moves away from it; the
// margins (1e-10 of the flux scale, 1e-12 cm of depth) keep round-off from reading as a crossing.
void ColumnModel::roots(double t, std::span<const double> y, std::span<double> g) {
  evaluate_cells(t, y);
  g[0] = g[1] = g[2] = 1.0;
  if (atmospheric_) {
    const double net = net_input();
    const double flux_margin = 1e-10 * (1.0 + std::abs(net));
    const double depth_margin = 1e-12;
    switch (surface_) {
      case SurfaceMode::flux:
        if (net > 0) g[0] = head_limited_flux(0.0).flux - net;               // capacity falls below supply
        if (net < 0) g[0] = net - head_limited_flux(dry_limit_head_).flux;   // demand exceeds what soil gives
        break;
      case SurfaceMode::ponded:
        g[0] = max_ponded_depth_ - y[0] + depth_margin;  // storage full
        g[1] = y[0] + depth_margin;                      // pond emptied
        break;
      case SurfaceMode::full:
        g[0] = net - surface_flux(y).flux + flux_margin;  // runoff rate reaches zero
        break;
      case SurfaceMode::dry:
        g[0] = surface_flux(y).flux - net + flux_margin;  // soil can again supply the demand
        break;
      case SurfaceMode::head: break;
    }
  }
  if (bottom_ == BottomMode::seepage_closed) {
    const std::size_t last = cells() - 1;
    g[2] = -(head_[last] + (grid_.total_depth_cm() - grid_.cell_depths_cm()[last])) + 1e-12;  // bottom saturates
  } else if (bottom_ == BottomMode::seepage_open) {
    g[2] = bottom_flux().flux + 1e-12;  // outflow stops
  }
}

std::vector<int> ColumnModel::root_directions() const { return {-1, -1, -1}; }

bool ColumnModel::switch_mode(int slot, std::span<const double>) {
  if (slot == 2) {
    bottom_ = bottom_ == BottomMode::seepage_closed ? BottomMode::seepage_open : BottomMode::seepage_closed;
    return false;
  }
  const bool can_pond = max_ponded_depth_ > 0;
  switch (surface_) {
    case SurfaceMode::flux:
      surface_ = net_input() > 0 ? (can_pond ? SurfaceMode::ponded : SurfaceMode::full) : SurfaceMode::dry;
      break;
    case SurfaceMode::ponded: surface_ = slot == 0 ? SurfaceMode::full : SurfaceMode::flux; break;
    case SurfaceMode::full: surface_ = can_pond ? SurfaceMode::ponded : SurfaceMode::flux; break;
    case SurfaceMode::dry: surface_ = SurfaceMode::flux; break;
    case SurfaceMode::head: break;
  }
  return true;
}

void ColumnModel::choose_modes(std::span<const double> y) {
  evaluate_cells(0.0, y);
  if (bottom_ != BottomMode::normal) {
    const std::size_t last = cells() - 1;
    const bool saturated = head_[last] + (grid_.total_depth_cm() - grid_.cell_depths_cm()[last]) >= 0;
    if (bottom_ == BottomMode::seepage_closed && saturated) bottom_ = BottomMode::seepage_open;
    if (bottom_ == BottomMode::seepage_open && bottom_flux().flux <= 0) bottom_ = BottomMode::seepage_closed;
  }
  if (!atmospheric_) return;
  const double net = net_input();
  const double pond = y[0];
  if (pond > 0 && max_ponded_depth_ > 0) {
    const bool at_max = pond >= max_ponded_depth_ * (1 - 1e-12);
    surface_ = at_max && net - head_limited_flux(max_ponded_depth_).flux > 0 ? SurfaceMode::full : SurfaceMode::ponded;
    return;
  }
  if (net > 0 && head_limited_flux(0.0).flux < net)
    surface_ = max_ponded_depth_ > 0 ? SurfaceMode::ponded : SurfaceMode::full;
  else if (net < 0 && head_limited_flux(dry_limit_head_).flux > net)
    surface_ = SurfaceMode::dry;
  else
    surface_ = SurfaceMode::flux;
}

}  // namespace wetfront::solver::detail
