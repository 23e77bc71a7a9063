// A reference scheme for the benchmark: the mixed-form modified Picard iteration of
// Celia, Bouloutas & Zarba (1990, Water Resources Research 26(7):1483), backward Euler in time
// and node-centred finite differences in space, one tridiagonal (Thomas) solve per iteration.
// It runs the same ColumnProblem as wetfront's IDA solver so that both can be compared on
// identical work. Units: cm and days; depth and fluxes positive downward.
#pragma once

#include <span>
#include <string>
#include <vector>

#include "wetfront/solver/column_problem.hpp"

namespace wetfront::bench {

struct PicardSettings {
  double head_tolerance_cm = 0.01;   // converged when the largest head change of an iteration is below this
  double initial_step_days = 1e-3;
  double min_step_days = 1e-8;       // the run stops (incomplete) when a step would have to be shorter
  double max_step_days = 0.5;
  int fast_iterations = 3;           // a step converged in at most this many iterations: grow the next step
  int slow_iterations = 8;           // a step that needed at least this many: shrink the next step
  int max_iterations = 20;           // not converged after this many: reject, cut the step, redo
  double growth_factor = 1.25;
  double shrink_factor = 0.8;
  double rejection_factor = 0.5;
};

struct PicardRun {
  std::vector<double> output_days;                 // the problem's output days reached
  std::vector<std::vector<double>> head_cm;        // [output day][report depth], heads at the nodes there
  long steps = 0;                                  // accepted time steps
  long iterations = 0;                             // Picard iterations, rejected attempts included
  long rejected_steps = 0;
  long surface_switches = 0;                       // changes between the flux and the dry-limit surface
  double surface_flux_cm = 0.0;                    // cumulative, positive down (infiltration)
  double bottom_flux_cm = 0.0;                     // cumulative, positive down (drainage)
  double storage_change_cm = 0.0;
  double balance_error_cm = 0.0;                   // storage change - (surface flux - bottom flux)
  double end_day = 0.0;                            // time reached
  bool complete = false;
  std::string stop_reason;                         // set when complete is false
};

// Supports exactly: top LimitedFlux without ponding, bottom FixedHead, initial Hydrostatic, a
// uniform grid (its face depths are the node depths), van Genuchten-Mualem layers, no sink, no
// flux planes, arithmetic face conductivity. Throws std::invalid_argument for anything else and
// for a report depth that is not a node.
PicardRun run_picard(const solver::ColumnProblem& problem, std::span<const double> report_depths_cm,
                     const PicardSettings& settings = {});

}  // namespace wetfront::bench
