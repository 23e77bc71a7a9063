// The semi-discrete Richards equation on the column, as a DAE for IDA.
//
// Unknowns, cumulative amounts in cm since the last restart:
//   F_j  water that crossed face j (face 0 the surface, face N the bottom), positive down
//   U_i  water taken by the sink from cell i, only for the cells the sink can reach (i < M)
// ordered F_0 U_0 F_1 U_1 ... F_(M-1) U_(M-1) F_M F_(M+1) ... F_N, so the Jacobian is banded
// with two diagonals on either side (one without a sink: tridiagonal).
// The stored water of cell i is a linear function of the unknowns,
//   S_i = S_i(restart) + F_i - F_(i+1) - U_i,
// so conservation holds exactly, whatever the accuracy of the nonlinear solve. Residuals:
//   F_j' - q_j(h) = 0          Darcy-Buckingham flux on face j, q = K (1 - dh/dd)
//   U_i' - r_i(h_i) dz_i = 0   sink
// Each head and conductivity is read from its soil's storage table, h(S_i / dz_i) and
// K(h) (storage_table.hpp): no transcendental function in the residual.
//
// The surface accounts need no unknowns: over one restart interval the forcing rates w (water
// input) and v (potential evaporation) and the surface mode are fixed, so with tau = t - t_restart
//   water input W = w tau, potential evaporation V = v tau, and by mode
//   flux, full, ponded: actual evaporation E = V;   dry limit: E = W - F_0
//   full: runoff R = W - V - F_0;   ponded: pond P = P_restart + W - V - F_0
// which closes the surface balance W - E - R - F_0 - (P - P_restart) = 0 exactly.
#pragma once

#include <array>
#include <span>
#include <vector>

#include <sundials/sundials_matrix.h>

#include "face_flux.hpp"
#include "storage_table.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver::detail {

enum class SurfaceMode {
  flux,    // prescribed or atmospheric flux taken in full
  ponded,  // water stored on the surface below the maximum depth; surface head = P
  full,    // surface storage full (or zero capacity), surface head = max depth, runoff
  dry,     // surface held at the dry limit head
  head,    // prescribed surface head
};
enum class BottomMode { normal, seepage_closed, seepage_open };

// Event functions (IDARootInit), one slot each; a switch fires when its function falls
// through zero.
enum EventSlot : int {
  surface_limit_event = 0,  // flux: soil can no longer take or give it; ponded: storage full;
                            // full: runoff stops; dry: soil can supply the demand again
  pond_emptied_event = 1,   // ponded: the pond is empty
  seepage_event = 2,        // seepage face: bottom saturates (closed) or outflow stops (open)
  event_count = 3,
};

// Amounts at the surface since the last restart (the pond: its depth now).
struct SurfaceAccounts {
  double water_input = 0, potential_evaporation = 0, actual_evaporation = 0, runoff = 0, ponded_depth = 0;
};

// Cumulative totals carried across restarts (the unknowns restart from zero).
struct Totals {
  double water_input = 0, potential_evaporation = 0, actual_evaporation = 0, runoff = 0, transpiration = 0;
  std::vector<double> face;  // per face
};

class ColumnModel {
 public:
  explicit ColumnModel(const ColumnProblem& problem);

  std::size_t cells() const { return grid_.cell_count(); }
  std::size_t uptake_cells() const { return uptake_cells_; }
  std::size_t face_index(std::size_t face) const { return face + std::min(face, uptake_cells_); }
  static std::size_t uptake_index(std::size_t cell) { return 2 * cell + 1; }  // cell < uptake_cells()
  std::size_t unknowns() const { return cells() + 1 + uptake_cells_; }
  int bandwidth() const { return uptake_cells_ > 0 ? 2 : 1; }

  // Holds the forcing of the period that starts at t (piecewise-constant series).
  void begin_period(double t_days);
  std::vector<double> breakpoints() const;

  void initial_state(std::span<double> y);
  // Moves the cumulative unknowns and surface accounts into the totals and the cell storages,
  // zeroes them, and starts a restart interval at t.
  void rebase(double t_days, std::span<double> y);
  // y' consistent with y under the current modes.
  void consistent_rates(double t, std::span<const double> y, std::span<double> yp);
  void residual(double t, std::span<const double> y, std::span<const double> yp, std::span<double> r);
  void jacobian(double t, double cj, std::span<const double> y, SUNMatrix band);

  // IDA's error weights (1 / tolerance) for a state. Each cell's stored water may err by the
  // relative tolerance of it plus the absolute tolerance; where the cell conducts (K at least
  // 1 % of Ks, so its head drives real flow) also by no more than the head tolerance's worth of
  // storage, dS = dh / (dh/dS). Near saturation dh/dS is 1 / (Ss dz), so without that cap a
  // storage tolerance lets heads err by metres when Ss is small. Every cell's head may also err
  // by no more than the relative head tolerance of |h| + 1 cm: in dry cells dh/dS is so large
  // that a storage tolerance alone lets heads err by orders of magnitude. A face or sink amount
  // takes the tighter tolerance of the cells it changes, a cell below the surface cell counting
  // as no thinner than kToleranceLayerCm for its storage and conducting-head tolerances. Each
  // cell's own weight is kept for step_norm.
  void error_weights(std::span<const double> y, std::span<double> weights) const;
  // The norm of IDA's error and Newton tests for a change x of the unknowns under the weights of
  // error_weights: their weighted RMS, but never less than the largest change of one cell's
  // stored water in its own tolerances divided by kLocalShare.
  double step_norm(std::span<const double> x, std::span<const double> weights) const;

  // Events: needs only the surface cell (and the bottom cell for a seepage face).
  void events(double t, std::span<const double> y, std::span<double> g) const;
  // After an event in this slot: move to the next mode. Returns true for a surface switch.
  bool switch_mode(EventSlot slot, double t, std::span<const double> y);
  // At a period start: choose the modes that fit the state (new forcing may change them).
  void choose_modes(double t, std::span<const double> y);
  SurfaceMode surface_mode() const { return surface_; }
  // After a surface switch undone at once (the limit only touched its threshold, or the soil
  // holds the surface right at it), the switch thresholds widen from 1e-10 to 1e-4 of the flux
  // scale until the next forcing period: the surface keeps its mode until the flux has clearly
  // crossed, instead of switching back and forth without end.
  void widen_switch_margins() { switch_margin_ = 1e-4; }

  // Diagnostics at a state.
  double cell_storage(std::size_t cell, std::span<const double> y) const {
    const double uptake = cell < uptake_cells_ ? y[uptake_index(cell)] : 0.0;
    return base_storage_[cell] + y[face_index(cell)] - y[face_index(cell + 1)] - uptake;
  }
  double soil_storage(std::span<const double> y) const;
  SurfaceAccounts surface_accounts(double t, std::span<const double> y) const;
  const Totals& totals() const { return totals_; }
  double transpiration(std::span<const double> y) const;  // since the run start
  ProfileSnapshot snapshot(double t, std::span<const double> y);
  // The head in a cell at a state (for failure reports).
  double cell_head(std::size_t cell, std::span<const double> y) const;
  double cell_water_content(std::size_t cell, std::span<const double> y) const;
  const StorageTable& cell_table(std::size_t cell) const { return *cell_table_[cell]; }
  const soils::HydraulicModel& cell_model(std::size_t cell) const { return *cell_model_[cell]; }
  const Grid& grid() const { return grid_; }

 private:
  struct SurfaceFlux {
    double flux;           // q_0, cm/d positive down
    double slope_storage;  // dq_0 / dS_0
    double slope_pond;     // dq_0 / dP (only while ponded)
  };
  struct BottomFlux {
    double flux;           // q_N, cm/d positive down
    double slope_storage;  // dq_N / dS_(N-1)
  };
  void evaluate_cells(std::span<const double> y);
  FaceFlux interior_face(std::size_t face) const;  // from the workspace
  FaceFlux boundary_face(const FaceSide& upper, double upper_potential, const FaceSide& lower, double lower_potential,
                         double distance_cm) const;
  double boundary_potential(std::size_t cell, double head_cm) const;
  StoragePoint cell_point(std::size_t cell, std::span<const double> y) const;
  StoragePoint evaluated_point(std::size_t cell) const;
  ProfileSnapshot snapshot_here(double t, std::span<const double> y);  // snapshot() without putting back
  SurfaceFlux surface_flux(double t, std::span<const double> y, const StoragePoint& top) const;
  SurfaceFlux head_limited_flux(double surface_head_cm, const StoragePoint& top) const;
  BottomFlux bottom_flux(const StoragePoint& last) const;
  double surface_head(double t, std::span<const double> y) const;
  double net_input() const { return water_input_ - potential_evaporation_; }
  double infiltration(std::span<const double> y) const { return y[face_index(0)]; }

  Grid grid_;
  std::vector<StorageTable> tables_;  // one per soil layer
  std::vector<const StorageTable*> cell_table_;
  std::vector<const soils::HydraulicModel*> cell_model_;
  std::vector<double> inverse_thickness_;
  std::vector<double> centre_distance_;  // between cell j-1 and j, for faces 1..N-1
  std::size_t uptake_cells_ = 0;
  TopBoundary top_;
  BottomBoundary bottom_boundary_;
  std::shared_ptr<const CellSink> sink_;
  FaceConductivity face_kind_;
  double dry_limit_head_ = -15000.0;
  double max_ponded_depth_ = 0.0;
  bool atmospheric_ = false;
  InitialCondition initial_;
  SolverSettings settings_;
  std::vector<double> saturated_conductivity_;  // per cell

  // Forcing held over the current period.
  double water_input_ = 0, potential_evaporation_ = 0, prescribed_flux_ = 0, prescribed_head_ = 0;
  double period_start_ = 0;
  static constexpr double kSwitchMargin = 1e-10;  // of the flux scale 1 + |net input| (cm/d)
  double switch_margin_ = kSwitchMargin;
  SurfaceMode surface_ = SurfaceMode::flux;
  BottomMode bottom_ = BottomMode::normal;

  double restart_time_ = 0;
  double restart_pond_ = 0;
  std::vector<double> base_storage_;  // S_i at the last restart
  Totals totals_;

  // Workspace, refreshed by evaluate_cells(): per cell Phi, dPhi/dS (integral mean only), head,
  // dh/dS, K, dK/dS, sink and its slope.
  std::vector<double> potential_, potential_per_storage_, head_, head_per_storage_, conductivity_,
      conductivity_per_storage_, sink_rate_, sink_slope_;
  std::vector<double> evaluated_state_;  // the state of the last residual, while the workspace holds it
  // Per cell, the storage-table interval of its last lookup (where the next one starts).
  mutable std::vector<unsigned> interval_hint_;
  mutable std::vector<double> cell_weights_;  // error_weights: 1 / each cell's own storage tolerance
  static constexpr double kToleranceLayerCm = 1.0;  // error_weights: thinner cells count as this
  static constexpr double kLocalShare = 30.0;       // step_norm: one cell's error against the RMS
  // Phi at the last two boundary heads asked for (boundary_potential).
  struct KeptPotential {
    const StorageTable* table = nullptr;
    double head_cm = 0, potential = 0;
  };
  mutable std::array<KeptPotential, 2> boundary_potentials_{};
  mutable std::size_t next_kept_potential_ = 0;
};

}  // namespace wetfront::solver::detail
