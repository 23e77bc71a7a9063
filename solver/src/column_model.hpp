// The semi-discrete Richards equation on the column, as a DAE for IDA(S).
//
// Unknowns (the Jacobian is tridiagonal):
//   y[0]       ponded depth P on the surface (cm)
//   y[1 + i]   stored water S_i of cell i (cm)
// Residuals:
//   ponding:  P' - (water input - evaporation - q_0)   while water is ponded, else P' = 0
//   storage:  S_i' - (q_i - q_(i+1) - r_i dz_i) = 0    finite-volume balance of cell i
// with q_j the Darcy flux on face j (face 0 the surface) and r_i the sink rate. The head of
// each cell is the inverse of its storage function,
//   S_i = dz_i [theta(h_i) + Ss max(h_i - h_sat, 0)],
// in closed form (h(theta) of the soil model; linear above saturation, where the specific
// storage Ss keeps it one-to-one). Because the S_i are the integrated variables, BDF
// conserves the total of S_i plus the integrated boundary fluxes exactly up to the
// nonlinear-solver tolerance.
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

// Quadrature (cumulative amount) slots.
enum Quadrature : int {
  q_water_input, q_potential_evaporation, q_actual_evaporation, q_runoff, q_infiltration, q_transpiration,
  q_bottom, q_first_plane
};

class ColumnModel {
 public:
  explicit ColumnModel(const ColumnProblem& problem);

  std::size_t cells() const { return grid_.cell_count(); }
  std::size_t unknowns() const { return 1 + cells(); }
  std::size_t quadratures() const { return q_first_plane + plane_faces_.size(); }
  static std::size_t storage_index(std::size_t cell) { return 1 + cell; }

  // Holds the forcing of the period that starts at t (piecewise-constant series).
  void begin_period(double t_days);
  std::vector<double> breakpoints() const;

  void initial_state(std::span<double> y) const;
  // y' consistent with y under the current modes.
  void consistent_rates(double t, std::span<const double> y, std::span<double> yp);
  void residual(double t, std::span<const double> y, std::span<const double> yp, std::span<double> r);
  void jacobian(double t, double cj, std::span<const double> y, SUNMatrix band);
  void quadrature_rates(double t, std::span<const double> y, std::span<double> rates);

  // Events: one root function per possible switch, used in the current modes.
  int root_count() const { return 3; }
  void roots(double t, std::span<const double> y, std::span<double> g);
  std::vector<int> root_directions() const;
  // After a root in slot k: move to the next mode. Returns true for a surface switch.
  bool switch_mode(int root_slot, std::span<const double> y);
  // At a period start: choose the modes that fit the state (new forcing may change them).
  void choose_modes(std::span<const double> y);
  SurfaceMode surface_mode() const { return surface_; }
  BottomMode bottom_mode() const { return bottom_; }

  // Diagnostics at a state.
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
  void evaluate_cells(double t, std::span<const double> y);
  SurfaceFlux surface_flux(std::span<const double> y) const;
  SurfaceFlux head_limited_flux(double surface_head_cm) const;
  BottomFlux bottom_flux() const;
  double surface_head(std::span<const double> y) const;
  double net_input() const { return water_input_ - potential_evaporation_; }
  double pond_rate(std::span<const double> y, const SurfaceFlux& top) const;
  double capacity_total(std::size_t cell) const;

  Grid grid_;
  std::vector<const soils::HydraulicModel*> cell_model_;
  std::vector<double> saturation_head_;   // head at which each cell's Se reaches 1
  TopBoundary top_;
  BottomBoundary bottom_boundary_;
  std::shared_ptr<const CellSink> sink_;
  std::vector<std::size_t> plane_faces_;
  double specific_storage_;
  FaceConductivity face_kind_;
  double dry_limit_head_ = -15000.0;
  double max_ponded_depth_ = 0.0;
  bool atmospheric_ = false;
  InitialCondition initial_;

  // Forcing held over the current period.
  double water_input_ = 0, potential_evaporation_ = 0, prescribed_flux_ = 0, prescribed_head_ = 0;
  SurfaceMode surface_ = SurfaceMode::flux;
  BottomMode bottom_ = BottomMode::normal;

  // Workspace, refreshed by evaluate_cells().
  std::vector<double> head_, conductivity_, conductivity_slope_, capacity_, sink_rate_, sink_slope_;
  std::vector<double> head_per_storage_;  // dh/dS per cell in jacobian()
  std::vector<double> evaluated_state_;   // the y of the cached cell evaluation
  double evaluated_period_ = 0;
  double period_start_ = 0;
};

}  // namespace wetfront::solver::detail
