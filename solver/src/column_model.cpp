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
  for (double d : problem.flux_plane_depths_cm) grid_.face_at(d);  // each plane must lie on a face
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
  for (auto* v : {&head_, &conductivity_, &conductivity_slope_, &capacity_, &sink_rate_, &sink_slope_,
                  &head_per_storage_, &base_storage_})
    v->assign(n, 0.0);
  totals_.face.assign(n + 1, 0.0);
  faces_scratch_.assign(n + 1, 0.0);
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

// Specific storage Ss acts in full above saturation and fades below it as exp((h - h_sat)/w):
//   S/dz = theta(h) + Ss e(h - h_sat),  e(u) = u + w for u >= 0,  w exp(u/w) for u < 0.
// The capacity C(h) + Ss e'(h) is then continuous and at least about Ss near saturation,
// where the van Genuchten C(h) alone tends to zero, so h(S) has bounded slope there; far below
// saturation the term vanishes and the storage is the water content alone.
namespace {
constexpr double storage_fade_cm = 1.0;  // w
double storage_excess(double u) { return u >= 0 ? u + storage_fade_cm : storage_fade_cm * std::exp(u / storage_fade_cm); }
double storage_excess_slope(double u) { return u >= 0 ? 1.0 : std::exp(u / storage_fade_cm); }
}  // namespace

double ColumnModel::stored_water(std::size_t cell, double h) const {
  return grid_.cell_thickness_cm(cell) *
         (soils::water_content(*cell_model_[cell], h) + specific_storage_ * storage_excess(h - saturation_head_[cell]));
}

double ColumnModel::head_for_storage(std::size_t cell, double stored) const {
  const auto& model = *cell_model_[cell];
  const double h_sat = saturation_head_[cell];
  const double theta = stored / grid_.cell_thickness_cm(cell);
  const double theta_s = soils::saturated_water_content(model);
  const double theta_r = soils::residual_water_content(model);
  const double full = theta_s + specific_storage_ * storage_fade_cm;  // storage per cm at h_sat
  if (theta >= full) return h_sat + (theta - full) / specific_storage_;
  if (!(theta > theta_r)) return std::numeric_limits<double>::quiet_NaN();
  // The excess is positive, so the head lies below theta^-1(theta); far below saturation the
  // excess is zero to double precision and that is the head.
  const double high = std::min(h_sat, theta < theta_s ? soils::pressure_head_at(model, theta) : h_sat);
  if ((high - h_sat) / storage_fade_cm < -40.0) return high;
  auto mismatch = [&](double h) {
    return soils::water_content(model, h) + specific_storage_ * storage_excess(h - h_sat) - theta;
  };
  double low = high - storage_fade_cm;
  while (mismatch(low) > 0) low -= 2.0 * (high - low);
  // Safeguarded Newton on theta(h) + Ss e(h - h_sat) = theta within [low, high].
  double lo = low, hi = high, h = high;
  for (int iteration = 0; iteration < 60; ++iteration) {
    const auto s = soils::evaluate(model, h);
    const double g = s.water_content + specific_storage_ * storage_excess(h - h_sat) - theta;
    if (g == 0.0) return h;
    (g > 0 ? hi : lo) = h;
    const double slope = s.moisture_capacity + specific_storage_ * storage_excess_slope(h - h_sat);
    double next = h - g / slope;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (std::abs(next - h) <= 1e-13 * (1.0 + std::abs(h))) return next;
    h = next;
  }
  return h;
}

double ColumnModel::capacity_total(std::size_t cell) const {
  return capacity_[cell] + specific_storage_ * storage_excess_slope(head_[cell] - saturation_head_[cell]);
}

void ColumnModel::initial_state(std::span<double> y) {
  std::fill(y.begin(), y.end(), 0.0);
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t i = 0; i < cells(); ++i) base_storage_[i] = stored_water(i, initial_head(initial_, centres[i]));
}

double ColumnModel::cell_storage(std::size_t i, std::span<const double> y) const {
  return base_storage_[i] + y[face_index(i)] - y[face_index(i + 1)] - y[uptake_index(i)];
}

void ColumnModel::rebase(std::span<double> y) {
  for (std::size_t i = 0; i < cells(); ++i) base_storage_[i] = cell_storage(i, y);
  totals_.water_input += y[water_input_index];
  totals_.potential_evaporation += y[potential_index];
  totals_.actual_evaporation += y[evaporation_index];
  totals_.runoff += y[runoff_index];
  for (std::size_t j = 0; j <= cells(); ++j) totals_.face[j] += y[face_index(j)];
  for (std::size_t i = 0; i < cells(); ++i) totals_.transpiration += y[uptake_index(i)];
  const double pond = y[pond_index];
  std::fill(y.begin(), y.end(), 0.0);
  y[pond_index] = pond;
  evaluated_state_.clear();
}

// Heads, conductivities and sink of every cell at state y. IDA asks for the residual and the
// roots at the same state, so the last evaluation is kept.
void ColumnModel::evaluate_cells(std::span<const double> y) {
  const bool same_state = evaluated_state_.size() == y.size() && evaluated_period_ == period_start_ &&
                          std::equal(y.begin(), y.end(), evaluated_state_.begin());
  if (same_state) return;
  for (std::size_t i = 0; i < cells(); ++i) {
    const double h = head_for_storage(i, cell_storage(i, y));
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
    case SurfaceMode::ponded: return y[pond_index];
    case SurfaceMode::full: return max_ponded_depth_;
    case SurfaceMode::dry: return dry_limit_head_;
    case SurfaceMode::head: return prescribed_head_;
    case SurfaceMode::flux: break;
  }
  return 0.0;
}

// Flux from a surface held at a head into the top cell: Darcy over half the top cell. Boundary
// half-cells always take the arithmetic mean: a harmonic or geometric mean with a dry top cell
// would shut the surface to rain (the surface value is a boundary condition, not a cell).
ColumnModel::SurfaceFlux ColumnModel::head_limited_flux(double hs) const {
  const auto s = soils::evaluate(*cell_model_[0], hs);
  const auto f = darcy_face(FaceConductivity::arithmetic, hs, s.conductivity, s.conductivity_slope, head_[0], conductivity_[0],
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
    const auto f = darcy_face(FaceConductivity::arithmetic, head_[last], conductivity_[last], conductivity_slope_[last], hb,
                              s.conductivity, s.conductivity_slope, distance);
    return BottomFlux{f.flux, f.slope_upper};
  };
  if (std::holds_alternative<FreeDrainage>(bottom_boundary_)) return {conductivity_[last], conductivity_slope_[last]};
  if (const auto* fh = std::get_if<FixedHead>(&bottom_boundary_)) return fixed(fh->head_cm);
  if (bottom_ == BottomMode::seepage_open) return fixed(0.0);
  return {0.0, 0.0};
}


// Surface rows, each linear in the rates so that the surface balance
// W - E - R - F_0 - P = 0 holds exactly.
void ColumnModel::surface_residuals(std::span<const double> yp, std::span<double> r) const {
  const double infiltration_rate = yp[face_index(0)];
  double input = water_input_, potential = potential_evaporation_;
  if (!atmospheric_) {
    // A prescribed flux splits by its sign into input and evaporation; a prescribed head's
    // net inflow counts as water input.
    input = surface_ == SurfaceMode::head ? infiltration_rate : std::max(prescribed_flux_, 0.0);
    potential = surface_ == SurfaceMode::head ? 0.0 : std::max(-prescribed_flux_, 0.0);
  }
  r[water_input_index] = yp[water_input_index] - input;
  r[potential_index] = yp[potential_index] - potential;
  const double spare = yp[water_input_index] - yp[potential_index] - infiltration_rate;  // left at the surface
  r[evaporation_index] = yp[evaporation_index] -
                         (surface_ == SurfaceMode::dry ? yp[water_input_index] - infiltration_rate : yp[potential_index]);
  r[runoff_index] = yp[runoff_index] - (surface_ == SurfaceMode::full ? spare : 0.0);
  r[pond_index] = yp[pond_index] - (surface_ == SurfaceMode::ponded ? spare : 0.0);
}

void ColumnModel::residual(double, std::span<const double> y, std::span<const double> yp, std::span<double> r) {
  evaluate_cells(y);
  surface_residuals(yp, r);
  face_fluxes(0.0, y, faces_scratch_);
  for (std::size_t j = 0; j <= cells(); ++j) r[face_index(j)] = yp[face_index(j)] - faces_scratch_[j];
  for (std::size_t i = 0; i < cells(); ++i)
    r[uptake_index(i)] = yp[uptake_index(i)] - sink_rate_[i] * grid_.cell_thickness_cm(i);
}

// dF/dy + cj dF/dy'. A head depends on its cell's storage, S_i = base + F_i - F_(i+1) - U_i,
// through dh/dS = 1 / (dz C), C the total capacity (moisture capacity plus specific storage).
void ColumnModel::jacobian(double, double cj, std::span<const double> y, SUNMatrix band) {
  evaluate_cells(y);
  SUNMatZero(band);
  for (std::size_t i = 0; i < cells(); ++i)
    head_per_storage_[i] = 1.0 / (grid_.cell_thickness_cm(i) * capacity_total(i));
  auto at = [band](std::size_t row, std::size_t col) -> double& {
    return SM_ELEMENT_B(band, static_cast<sunindextype>(row), static_cast<sunindextype>(col));
  };
  // d(row)/d(head of cell i), spread over the unknowns that make up S_i.
  auto add_head_slope = [&](std::size_t row, std::size_t cell, double slope) {
    const double d = slope * head_per_storage_[cell];
    at(row, face_index(cell)) += d;
    at(row, face_index(cell + 1)) -= d;
    at(row, uptake_index(cell)) -= d;
  };
  // Surface rows (linear in the rates).
  const std::size_t f0 = face_index(0);
  for (std::size_t k = 0; k <= pond_index; ++k) at(k, k) = cj;
  if (!atmospheric_ && surface_ == SurfaceMode::head) at(water_input_index, f0) = -cj;
  if (surface_ == SurfaceMode::dry) {
    at(evaporation_index, water_input_index) = -cj;
    at(evaporation_index, f0) = cj;
  } else {
    at(evaporation_index, potential_index) = -cj;
  }
  const std::size_t spare_row = surface_ == SurfaceMode::full ? runoff_index
                                : surface_ == SurfaceMode::ponded ? pond_index
                                                                  : std::size_t(-1);
  if (spare_row != std::size_t(-1)) {
    at(spare_row, water_input_index) = -cj;
    at(spare_row, potential_index) = cj;
    at(spare_row, f0) = cj;
  }
  // Face rows: F_j' - q_j(h_(j-1), h_j).
  const auto top = surface_flux(y);
  at(f0, f0) += cj;
  add_head_slope(f0, 0, -top.slope_head);
  if (surface_ == SurfaceMode::ponded) at(f0, pond_index) -= top.slope_pond;
  const auto centres = grid_.cell_depths_cm();
  for (std::size_t j = 1; j < cells(); ++j) {
    const std::size_t row = face_index(j);
    const auto f = darcy_face(face_kind_, head_[j - 1], conductivity_[j - 1], conductivity_slope_[j - 1], head_[j],
                              conductivity_[j], conductivity_slope_[j], centres[j] - centres[j - 1]);
    at(row, row) += cj;
    add_head_slope(row, j - 1, -f.slope_upper);
    add_head_slope(row, j, -f.slope_lower);
  }
  const std::size_t last = face_index(cells());
  at(last, last) += cj;
  add_head_slope(last, cells() - 1, -bottom_flux().slope_head);
  // Sink rows: U_i' - r_i(h_i) dz_i.
  for (std::size_t i = 0; i < cells(); ++i) {
    at(uptake_index(i), uptake_index(i)) += cj;
    add_head_slope(uptake_index(i), i, -sink_slope_[i] * grid_.cell_thickness_cm(i));
  }
}

void ColumnModel::consistent_rates(double t, std::span<const double> y, std::span<double> yp) {
  // Fluxes and sink first, then the surface rows, which depend on the infiltration rate.
  std::fill(yp.begin(), yp.end(), 0.0);
  std::vector<double> r(yp.size());
  residual(t, y, yp, r);
  for (std::size_t j = 0; j <= cells(); ++j) yp[face_index(j)] = -r[face_index(j)];
  for (std::size_t i = 0; i < cells(); ++i) yp[uptake_index(i)] = -r[uptake_index(i)];
  for (std::size_t k : {water_input_index, potential_index}) yp[k] = -r[k];
  surface_residuals(yp, r);
  for (std::size_t k : {water_input_index, potential_index, evaporation_index, runoff_index, pond_index}) yp[k] -= r[k];
}

void ColumnModel::face_fluxes(double, std::span<const double> y, std::span<double> flux) {
  evaluate_cells(y);
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
    const double h = head_for_storage(i, cell_storage(i, y));
    head[i] = h;
    theta[i] = soils::water_content(*cell_model_[i], h);
    k[i] = soils::conductivity(*cell_model_[i], h);
  }
}

void ColumnModel::sink_rates(double, std::span<const double> y, std::span<double> rate) {
  evaluate_cells(y);
  std::copy(sink_rate_.begin(), sink_rate_.end(), rate.begin());
}

// Root functions; each mode's switch fires when its function falls through zero.
//  slot 0, 1: surface;  slot 2: seepage face.
// Right after a switch the new mode's function starts at zero and moves away from it; the
// margins (1e-10 of the flux scale, 1e-12 cm of depth) keep round-off from reading as a crossing.
void ColumnModel::roots(double, std::span<const double> y, std::span<double> g) {
  evaluate_cells(y);
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
        g[0] = max_ponded_depth_ - y[pond_index] + depth_margin;  // storage full
        g[1] = y[pond_index] + depth_margin;                      // pond emptied
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

bool ColumnModel::switch_mode(int slot) {
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
  evaluate_cells(y);
  if (bottom_ != BottomMode::normal) {
    const std::size_t last = cells() - 1;
    const bool saturated = head_[last] + (grid_.total_depth_cm() - grid_.cell_depths_cm()[last]) >= 0;
    if (bottom_ == BottomMode::seepage_closed && saturated) bottom_ = BottomMode::seepage_open;
    if (bottom_ == BottomMode::seepage_open && bottom_flux().flux <= 0) bottom_ = BottomMode::seepage_closed;
  }
  if (!atmospheric_) return;
  const double net = net_input();
  const double pond = y[pond_index];
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
