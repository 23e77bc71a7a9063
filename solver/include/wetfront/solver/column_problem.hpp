// Everything that defines one run of the Richards equation on a vertical column.
//
// Units: cm and days. Depth d is positive downward; fluxes are positive downward
// (infiltration and drainage positive, evaporation and capillary rise negative).
#pragma once

#include <limits>
#include <memory>
#include <span>
#include <variant>
#include <vector>

#include "wetfront/soils/layers.hpp"
#include "wetfront/solver/grid.hpp"
#include "wetfront/solver/step_series.hpp"

namespace wetfront::solver {

// Top boundary, one of:
struct PrescribedFlux {
  StepSeries flux_cm_per_d;  // positive downward
};
struct PrescribedHead {
  StepSeries head_cm;  // pressure head at the soil surface
};
// Atmospheric surface: the flux is water_input - potential_evaporation while the soil can
// take or supply it. When the surface saturates, water is held on the surface up to
// max_ponded_depth_cm and the rest runs off; when it dries to dry_limit_head_cm the surface is
// held at that head. Switches are events located in time.
struct LimitedFlux {
  StepSeries water_input_cm_per_d;            // rain + irrigation, >= 0
  StepSeries potential_evaporation_cm_per_d;  // >= 0
  double dry_limit_head_cm = -15000.0;
  double max_ponded_depth_cm = 0.0;
};
using TopBoundary = std::variant<PrescribedFlux, PrescribedHead, LimitedFlux>;

// Bottom boundary, one of:
struct FreeDrainage {};  // unit gradient: q = K(h) downward
struct FixedHead {       // water table or a fixed head at the column bottom
  double head_cm = 0.0;
};
struct ZeroFlux {};
struct SeepageFace {};  // outflow at h = 0 when the bottom saturates, no flow otherwise
using BottomBoundary = std::variant<FreeDrainage, FixedHead, ZeroFlux, SeepageFace>;

// Initial condition, one of:
struct Hydrostatic {
  double water_table_depth_cm = 0.0;  // h(d) = d - water_table_depth
};
struct UniformHead {
  double head_cm = 0.0;
};
struct HeadTable {  // linear interpolation, constant beyond the ends
  std::vector<double> depth_cm;
  std::vector<double> head_cm;
};
using InitialCondition = std::variant<Hydrostatic, UniformHead, HeadTable>;

// Water taken out of cells (root uptake): a volumetric rate per cell, 1/d.
class CellSink {
 public:
  virtual ~CellSink() = default;
  // rate_per_day[i] >= 0 is the volume removed per unit cell volume per day from cell i with
  // heads head_cm; rate_slope[i] = d rate_per_day[i] / d head_cm[i]. A sink is constant in
  // time between its breakpoints: t_days is the start of the current forcing period.
  virtual void evaluate(double t_days, std::span<const double> cell_depths_cm, std::span<const double> head_cm,
                        std::span<double> rate_per_day, std::span<double> rate_slope) const = 0;
  // Times at which the sink changes abruptly (the integrator stops there).
  virtual std::vector<double> breakpoints_days() const { return {}; }
  // The sink never takes water from cells whose top face lies at or below this depth; evaluate()
  // is then given only the cells above it (the leading cells of the column).
  virtual double deepest_depth_cm() const { return std::numeric_limits<double>::infinity(); }
};

// How the conductivity on a face between two cells is formed from the cell values.
// - integral (the default): the mean of K over the heads between the two sides,
//   K_face = (Phi_u - Phi_l) / (h_u - h_l) with the Kirchhoff potential Phi = integral of K dh
//   (exact for steady flow without gravity; Warrick 1991, WRR 27:1215, from memory). Into dry
//   soil the arithmetic mean lets a cell next to a wet one draw about K_wet dh / (2 dz), orders
//   of magnitude more than the soil can conduct, so coarse cells over-dry a topsoil under
//   evaporation and wet it too fast under rain. On the demo site's grid (1 cm cells at the
//   surface, 128 cells) the heads at 30 cm change by 3.4 cm RMS when every cell is cut in two
//   with this mean, by 68 cm with the arithmetic mean (bench/README.md); a sandy loam drying
//   on 2 cm cells has its topsoil heads within 0.2 % of 0.125 cm cells, against 24 % with the
//   arithmetic mean (tests/solver/face_conductivity_interface_test.cpp). Between two soils (a layer interface) and
//   where the heads agree within 1e-4 cm it falls back to the arithmetic mean; the surface and bottom half-cells use it
//   with the boundary head.
// - arithmetic, geometric, harmonic: the usual means of the two cell values (the boundary
//   half-cells then use the arithmetic mean). tests/solver/face_conductivity_interface_test.cpp
//   compares them: the harmonic mean converges at second order across a layer interface but
//   holds a wetting front into dry loam back by about a third of its depth even on 1 cm cells;
//   the arithmetic mean is first order at interfaces and second order in smooth soil
//   (Belfort & Lehmann 2005 compare the options).
enum class FaceConductivity { arithmetic, geometric, harmonic, integral };

struct SolverSettings {
  // Defaults measured on year200 (bench/README.md, tolerance_study): the daily heads'
  // time-stepping error is about 0.018 cm RMS, a third of the 0.05 cm allowed, at half the steps
  // of 1e-4 / 1e-6 cm.
  double relative_tolerance = 2e-3;
  double absolute_tolerance_storage_cm = 1e-5;  // per cell stored water
  // Largest error of a conducting cell's head per step that the storage tolerance may imply
  // (ColumnModel::error_weights); binds near saturation, where Ss sets dh/dS.
  double head_tolerance_cm = 1.0;
  // Largest error of any cell's head per step, as a fraction of |h| + 1 cm. Binds in dry cells:
  // with the storage tolerance alone a 0.05 cm surface cell under roots and evaporation drifted
  // to -1e7 cm where a tight run stays at -8000 cm.
  double head_relative_tolerance = 0.05;
  // Newton stops when its correction is below this fraction of the error-test tolerance
  // (IDA's default is 0.33). The balance is exact whatever this is (column_model.hpp); it sets
  // how closely each step's fluxes match the heads.
  double nonlinear_convergence_factor = 0.2;
  int max_nonlinear_iterations = 4;  // Newton iterations per step (IDA's default 4)
  double max_step_days = 1.0;
  // Work limit: a run that needs more steps than this per simulated day (over the whole run,
  // at least ten days) stops and says so. Output times do not count: they cost no steps. The
  // hardest cases in tests/solver need about 250 a day over a season; a stuck run reaches the
  // limit of a 200-day season within a minute.
  long max_steps_per_day = 5000;
};

struct ColumnProblem {
  soils::LayeredProfile soil;
  Grid grid;
  TopBoundary top = PrescribedFlux{StepSeries::constant(0.0)};
  BottomBoundary bottom = FreeDrainage{};
  InitialCondition initial = UniformHead{-100.0};
  std::shared_ptr<const CellSink> sink{};      // optional
  std::vector<double> flux_plane_depths_cm{};  // each on a grid face; cumulative flux recorded
  // Ss (1/cm): compressibility storage above saturation, fading below it (storage_table.hpp).
  // Any value from 1e-6 to 1e-3 runs; 1e-5 and 1e-4 cost the same on ponded loam and 1e-6
  // 1.5 times more (bench/README.md). 1e-5 is within the usual range for soils (common practice).
  double specific_storage_per_cm = 1e-5;
  FaceConductivity face_conductivity = FaceConductivity::integral;
  double start_day = 0.0;
  double end_day = 1.0;
  std::vector<double> output_days{};  // increasing, within [start_day, end_day]
  SolverSettings settings{};
};

}  // namespace wetfront::solver
