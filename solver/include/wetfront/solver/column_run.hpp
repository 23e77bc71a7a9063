// What a run returns: profiles and cumulative water-balance terms at the output times.
#pragma once

#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "wetfront/solver/column_problem.hpp"

namespace wetfront::solver {

// Profile state at one output time. Per cell: head, water content, conductivity, sink.
// Per face (N + 1, surface first): Darcy flux, positive downward.
struct ProfileSnapshot {
  double time_days = 0;
  std::vector<double> head_cm;
  std::vector<double> water_content;
  std::vector<double> conductivity_cm_per_d;
  std::vector<double> sink_rate_per_day;
  std::vector<double> face_flux_cm_per_d;
  double ponded_depth_cm = 0;
};

// Cumulative amounts from the run start to time_days, in cm of water.
struct CumulativeBalance {
  double time_days = 0;
  double water_input_cm = 0;            // rain + irrigation reaching the surface
  double potential_evaporation_cm = 0;
  double actual_evaporation_cm = 0;     // leaving the surface, positive
  double runoff_cm = 0;
  double infiltration_cm = 0;           // net flux across the soil surface, positive down
  double transpiration_cm = 0;          // removed by the sink
  double bottom_flux_cm = 0;            // positive down (out of the column)
  std::vector<double> plane_flux_cm;    // one per flux plane, positive down
  double ponded_depth_cm = 0;           // water stored on the surface now
  double soil_storage_cm = 0;           // water in the column now
  // storage change - (infiltration - transpiration - bottom flux): zero up to solver accuracy
  double balance_error_cm = 0;
};

struct RunStatistics {
  long steps = 0;
  long residual_evaluations = 0;
  long jacobian_evaluations = 0;
  long nonlinear_iterations = 0;
  long nonlinear_failures = 0;
  long error_test_failures = 0;
  long surface_switches = 0;            // changes between flux, ponded and dry-limit surface
  long bottom_switches = 0;             // seepage face on/off
};

struct RunFailure {
  double time_days = 0;
  double depth_cm = 0;                  // cell with the largest weighted local error
  std::string reason;
};

struct ColumnRun {
  std::vector<double> cell_depths_cm;
  std::vector<double> face_depths_cm;
  std::vector<ProfileSnapshot> profiles;      // at the output times reached
  std::vector<CumulativeBalance> balances;    // same times
  RunStatistics statistics;
  bool complete = false;
  std::optional<RunFailure> failure;
};

// Runs the column. Never throws for a solver failure: the run comes back incomplete with
// what it computed. Throws std::invalid_argument for an inconsistent problem.
ColumnRun simulate(const ColumnProblem& problem);

// Receives each output time as the run reaches it, in time order: the profile and the
// cumulative balance there.
using OutputObserver = std::function<void(const ProfileSnapshot&, const CumulativeBalance&)>;

// As simulate(problem), but each profile goes to `observe` instead of into the run, whose
// `profiles` stay empty (its `balances`, a few numbers per output time, are kept): memory does
// not grow with the number of cells times output times. An exception from `observe` ends the
// run and leaves simulate.
ColumnRun simulate(const ColumnProblem& problem, const OutputObserver& observe);

}  // namespace wetfront::solver
