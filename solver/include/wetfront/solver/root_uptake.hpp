// Root water uptake: a CellSink that removes water from the root zone at the rate the crop
// transpires, reduced where the soil is too wet or too dry.
//
//   S_i = alpha(h_i, Tp) * w_i / dz_i * Tp                      (1/d, per cell i)
//
// alpha is the water-stress response of Feddes, Kowalik & Zaradny (1978, Simulation of field
// water use and crop yield, Pudoc, Wageningen), w_i the fraction of the root system inside
// cell i (a normalised root-density distribution integrated exactly over the cell's overlap
// with the root zone, so that sum w_i = 1), dz_i the cell thickness and Tp the potential
// transpiration. Without stress the column loses exactly Tp; stress only reduces it (no
// compensation by less-stressed roots).
//
// Units: heads in cm of water (negative when unsaturated), depths in cm positive downward,
// time in days, transpiration in cm/d.
#pragma once

#include <span>
#include <variant>
#include <vector>

#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/grid.hpp"
#include "wetfront/solver/step_series.hpp"

namespace wetfront::solver {

// Feddes et al. (1978) stress response alpha(h), piecewise linear in the head:
//   0                                   h > too_wet                 (no air for the roots)
//   rising linearly from 0 to 1         wet_optimum < h <= too_wet
//   1                                   dry_optimum <= h <= wet_optimum
//   falling linearly from 1 to 0        wilting < h < dry_optimum
//   0                                   h <= wilting
// The dry optimum depends on the demand: roots keep up with a low demand down to a drier
// soil than with a high one. Between the two demands it is interpolated linearly in Tp and
// held at the end values outside them (the usual reading of Feddes et al. 1978; from memory).
// Heads must satisfy too_wet >= wet_optimum >= dry optimum (both) > wilting.
struct FeddesResponse {
  double too_wet_head_cm = -10.0;
  double wet_optimum_head_cm = -25.0;
  double dry_optimum_head_high_demand_cm = -320.0;
  double dry_optimum_head_low_demand_cm = -600.0;
  double wilting_head_cm = -16000.0;
  double high_demand_cm_per_d = 0.5;  // 5 mm/d
  double low_demand_cm_per_d = 0.1;   // 1 mm/d
};

// Crop parameter sets as commonly quoted from Wesseling, Elbers, Kabat & van den Broek (1991,
// Report 152, Winand Staring Centre, Wageningen), demands 5 and 1 mm/d. All values from
// memory, not checked against the report.
FeddesResponse feddes_potatoes();
FeddesResponse feddes_sugar_beet();
FeddesResponse feddes_wheat();
FeddesResponse feddes_grass();
FeddesResponse feddes_maize();

// Throws std::invalid_argument when the heads are out of order or the demands are not
// 0 <= low < high.
void check_feddes_response(const FeddesResponse& response);

// The dry-side optimum head at a potential transpiration, cm.
double dry_optimum_head_cm(const FeddesResponse& response, double potential_transpiration_cm_per_d);

struct StressFactor {
  double value = 0;         // alpha, in [0, 1]
  double slope_per_cm = 0;  // d alpha / d h (one-sided: the slope of the piece that holds h)
};
// alpha(h) and its slope. A head that is not a number (a cell emptied below residual water)
// gives no uptake.
StressFactor feddes_stress(const FeddesResponse& response, double head_cm, double potential_transpiration_cm_per_d);

// Root density shapes over the current root depth L (z depth below the surface, 0 <= z <= L);
// each is normalised so that its integral over [0, L] is one.
struct UniformRoots {};                  // 1 / L
struct LinearRoots {};                   // 2 (L - z) / L^2: falls linearly to zero at the root tip
struct ExponentialRoots {                // exp(-z / length) / (length (1 - exp(-L / length)))
  double length_scale_cm = 10.0;
};
// Relative density at fractions of the root depth (0 at the surface, 1 at the root tip),
// linear in between; the fractions increase and run from 0 to 1, densities are >= 0 and not
// all zero. The shape stretches with the root depth.
struct RootDensityTable {
  std::vector<double> depth_fraction;
  std::vector<double> relative_density;
};
using RootDistribution = std::variant<UniformRoots, LinearRoots, ExponentialRoots, RootDensityTable>;

// Throws std::invalid_argument for an unusable shape (non-positive length, bad table).
void check_root_distribution(const RootDistribution& distribution);

// Fraction of the root system between the surface and depth_cm for a root depth
// root_depth_cm: 0 at the surface, 1 at and below the root tip.
double root_fraction_above(const RootDistribution& distribution, double root_depth_cm, double depth_cm);

// Fraction of the root system in each cell of the grid (face depths, surface first); sums to
// one when 0 < root depth <= column depth, and is all zero for a root depth of zero.
std::vector<double> root_fractions_per_cell(const RootDistribution& distribution, double root_depth_cm,
                                            std::span<const double> face_depths_cm);

struct RootUptakeSettings {
  FeddesResponse response;
  RootDistribution distribution = UniformRoots{};
  StepSeries root_depth_cm = StepSeries::constant(30.0);              // constant over each period
  StepSeries potential_transpiration_cm_per_d = StepSeries::constant(0.0);
};

class RootUptake final : public CellSink {
 public:
  // The grid is the column's: its faces bound the cells over which the roots are integrated.
  // A root depth below the column bottom is held at the bottom. Throws std::invalid_argument
  // for bad settings (see the check functions; negative depths or transpiration).
  RootUptake(RootUptakeSettings settings, const Grid& grid);

  void evaluate(double t_days, std::span<const double> cell_depths_cm, std::span<const double> head_cm,
                std::span<double> rate_per_day, std::span<double> rate_slope) const override;
  // Root depth and potential transpiration are taken at t as StepSeries::at does: a period
  // start belongs to the period it begins (the solver evaluates sinks at the start of the
  // forcing period in progress).
  // The start times of the root depth and potential transpiration series.
  std::vector<double> breakpoints_days() const override;
  // The deepest root depth of the season (held at the column bottom).
  double deepest_depth_cm() const override;

 private:
  RootUptakeSettings settings_;
  std::vector<double> face_depths_cm_;
  std::vector<double> cell_thickness_cm_;
  std::vector<std::vector<double>> fractions_per_depth_period_;  // one per root depth value
};

}  // namespace wetfront::solver
