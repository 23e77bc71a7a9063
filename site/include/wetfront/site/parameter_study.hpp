// The two parameter studies of a site: a sweep over many parameter sets, and a calibration
// with the uncertainty of recharge that follows from it.
#pragma once

#include <cstdint>
#include <functional>
#include <string>
#include <vector>

#include "wetfront/site/parameter_runs.hpp"
#include "wetfront/studies/parameter_calibration.hpp"
#include "wetfront/studies/parameter_uncertainty.hpp"

namespace wetfront::site {

// Called after each model run with the runs done and the runs planned (planned may be an upper
// bound for a calibration).
using StudyProgress = std::function<void(std::size_t done, std::size_t planned)>;

struct SweepSettings {
  bool full_grid = false;  // else a Latin hypercube sample
  std::size_t sample_size = 50;
  std::uint64_t seed = 1;
  unsigned threads = 0;  // 0: all cores
  std::size_t max_grid_sets = 10000;
  studies::TaskRunner* runner = nullptr;  // runs the sets instead of the threads (tasks of SeasonModel::handler)
};

struct SweepResult {
  std::string method;                // "full grid" or "Latin hypercube sample (seed N)"
  std::vector<ScoredRun> runs;       // in the order the sets were made
  std::vector<std::size_t> ranking;  // run indices, best objective first, failed runs last
};

// Throws base::InputError for a study without adjustable parameters or a grid too large.
SweepResult run_sweep(const SeasonModel& model, const SweepSettings& settings, const StudyProgress& progress = {});

struct CalibrationSettings {
  studies::CalibrationOptions options;
  unsigned threads = 0;
  std::size_t band_runs = 40;  // parameter sets drawn for the sampled band; 0: none
  std::uint64_t seed = 1;
  studies::TaskRunner* runner = nullptr;  // runs the sets instead of the threads (tasks of SeasonModel::handler)
};

// Percentiles of an output over the sampled runs: the central 95 %, like the first-order
// interval beside it, and the median.
struct SampledBand {
  double low = 0, median = 0, high = 0;  // 2.5, 50 and 97.5 %
};

struct CalibrationStudy {
  studies::CalibrationResult fit;
  ScoredRun before;  // the run at the starting values
  ScoredRun after;   // the run at the calibrated values
  // Season recharge first, then one per visit interval. Empty without a covariance.
  std::vector<studies::FirstOrderInterval> first_order;
  std::vector<SampledBand> band;  // same order; empty when no band was run
  std::size_t band_runs_complete = 0;
  std::size_t band_runs_failed = 0;
  std::string band_note;  // why there is no band, if there is none
};

// Throws base::InputError for a study without adjustable parameters or one the model
// fails at the start of; std::runtime_error when differences cannot be taken.
CalibrationStudy run_calibration(const SeasonModel& model, const CalibrationSettings& settings,
                                 const StudyProgress& progress = {});

}  // namespace wetfront::site
