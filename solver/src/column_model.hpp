// The semi-discrete Richards equation on the column, as a DAE for IDA.
//
// Unknowns, all cumulative amounts in cm since the last restart (the Jacobian is banded,
// 2 lower and 5 upper diagonals):
//   y[0] W  water input        y[1] V  potential evaporation   y[2] E  actual evaporation
//   y[3] R  runoff             y[4] P  ponded depth
//   y[5 + 2j] F_j  water that crossed face j (face 0 the surface, face N the bottom), down +
//   y[6 + 2i] U_i  water taken from cell i by the sink
// The stored water of cell i is then a linear function of the unknowns,
//   S_i = S_i(restart) + F_i - F_(i+1) - U_i,
// so conservation holds exactly, whatever the accuracy of the nonlinear solve. Residuals:
//   F_j' - q_j(h) = 0        Darcy flux on face j (Darcy-Buckingham, q = K (1 - dh/dd))
//   U_i' - r_i(h_i) dz_i = 0 sink
//   surface rows, linear in the rates: W' = rain + irrigation, V' = potential evaporation,
//   and per mode E' = V' or W' - F_0', R' = 0 or W' - V' - F_0', P' = 0 or W' - V' - F_0'.
// Each cell's head is the inverse of its storage function,
//   S_i = dz_i [theta(h_i) + Ss max(h_i - h_sat, 0)],
// in closed form (h(theta) of the soil model; linear above saturation, where the specific
// storage Ss keeps it one-to-one).
#pragma once

#include <span>
#include <vector>

#include <sundials/sundials_matrix.h>

#include "wetfront/solver/column_problem.hpp"

namespace wetfront::solver::detail {

enum class SurfaceMode {
  flux,     // prescribed or atmospheric flux taken in full
  ponded,   // water stored on the surface below the maximum depth; surface head = P
  full,     // surface storage full (or zero capacity), surface head = max depth, runoff
  dry,      // surface held at the dry limit head
  head,     // prescribed surface head
};
enum class BottomMode { normal, seepage_closed, seepage_open };

// Cumulative totals carried across restarts (the unknowns restart from zero).
struct Totals {
  double water_input = 0, potential_evaporation = 0, actual_evaporation = 0, runoff = 0, transpiration = 0;
  std::vector<double> face;  // per face
};

class ColumnModel {
 public:
  explicit ColumnModel(const ColumnProblem& problem);

  static constexpr std::size_t water_input_index = 0, potential_index = 1, evaporation_index = 2, runoff_index = 3,
                               pond_index = 4;
  static std::size_t face_index(std::size_t face) { return 5 + 2 * face; }
  static std::size_t uptake_index(std::size_t cell) { return 6 + 2 * cell; }
  static constexpr int lower_bandwidth = 2, upper_bandwidth = 5;

  std::size_t cells() const { return grid_.cell_count(); }
  std::size_t unknowns() const { return 6 + 2 * cells(); }

  // Holds the forcing of the period that starts at t (piecewise-constant series).
  void begin_period(double t_days);
  std::vector<double> breakpoints() const;

  void initial_state(std::span<double> y);
  // Moves the cumulative unknowns into the totals and the cell storages, and zeroes them.
  void rebase(std::span<double> y);
  // y' consistent with y under the current modes.
  void consistent_rates(double t, std::span<const double> y, std::span<double> yp);
  void residual(double t, std::span<const double> y, std::span<const double> yp, std::span<double> r);
  void jacobian(double t, double cj, std::span<const double> y, SUNMatrix band);

  // Events: one root function per possible switch, used in the current modes.
  int root_count() const { return 3; }
  void roots(double t, std::span<const double> y, std::span<double> g);
  std::vector<int> root_directions() const { return {-1, -1, -1}; }
  // After a root in slot k: move to the next mode. Returns true for a surface switch.
  bool switch_mode(int root_slot);
  // At a period start: choose the modes that fit the state (new forcing may change them).
  void choose_modes(std::span<const double> y);
  SurfaceMode surface_mode() const { return surface_; }

  // Diagnostics at a state.
  double cell_storage(std::size_t cell, std::span<const double> y) const;
  const Totals& totals() const { return totals_; }
  void face_fluxes(double t, std::span<const double> y, std::span<double> flux);
  void cell_properties(std::span<const double> y, std::span<double> head, std::span<double> theta,
                       std::span<double> k) const;
  void sink_rates(double t, std::span<const double> y, std::span<double> rate);
  double stored_water(std::size_t cell, double head_cm) const;
  // Inverse of stored_water; NaN when the storage is at or below the residual water content.
  double head_for_storage(std::size_t cell, double stored_cm) const;
  const Grid& grid() const { return grid_; }

 private:
  struct SurfaceFlux {
    double flux;        // q_0, cm/d positive down
    double slope_head;  // dq_0 / dh_0
    double slope_pond;  // dq_0 / dP (only while ponded)
  };
  struct BottomFlux {
    double flux;        // q_N, cm/d positive down
    double slope_head;  // dq_N / dh_(N-1)
  };
  void evaluate_cells(std::span<const double> y);
  SurfaceFlux surface_flux(std::span<const double> y) const;
  SurfaceFlux head_limited_flux(double surface_head_cm) const;
  BottomFlux bottom_flux() const;
  double surface_head(std::span<const double> y) const;
  double net_input() const { return water_input_ - potential_evaporation_; }
  double capacity_total(std::size_t cell) const;
  void surface_residuals(std::span<const double> yp, std::span<double> r) const;

  Grid grid_;
  std::vector<const soils::HydraulicModel*> cell_model_;
  std::vector<double> saturation_head_;   // head at which each cell's Se reaches 1
  TopBoundary top_;
  BottomBoundary bottom_boundary_;
  std::shared_ptr<const CellSink> sink_;
  double specific_storage_;
  FaceConductivity face_kind_;
  double dry_limit_head_ = -15000.0;
  double max_ponded_depth_ = 0.0;
  bool atmospheric_ = false;
  InitialCondition initial_;

  // Forcing held over the current period.
  double water_input_ = 0, potential_evaporation_ = 0, prescribed_flux_ = 0, prescribed_head_ = 0;
  double period_start_ = 0;
  SurfaceMode surface_ = SurfaceMode::flux;
  BottomMode bottom_ = BottomMode::normal;

  std::vector<double> base_storage_;      // S_i at the last restart
  Totals totals_;

  // Workspace, refreshed by evaluate_cells() (kept while the state is unchanged).
  std::vector<double> head_, conductivity_, conductivity_slope_, capacity_, sink_rate_, sink_slope_;
  std::vector<double> head_per_storage_;  // dh/dS per cell in jacobian()
  std::vector<double> evaluated_state_;
  double evaluated_period_ = -1;
  std::vector<double> faces_scratch_;
};

}  // namespace wetfront::solver::detail
