// Runs of one site under many parameter sets: the field records are read once, each set
// builds its own season (no shared mutable state), and every run is scored against the
// sensor readings by the objective of adjustable_parameters.hpp.
#pragma once

#include <functional>
#include <optional>
#include <string>
#include <vector>

#include <Eigen/Dense>

#include "wetfront/site/adjustable_parameters.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/observations/fit_metrics.hpp"
#include "wetfront/studies/parameter_calibration.hpp"
#include "wetfront/studies/task_runner.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::site {

// One scored run.
struct ScoredRun {
  studies::ParameterSet values;
  bool complete = false;
  std::string failure;                                     // why not complete (solver failure or unphysical set)
  Eigen::VectorXd residuals;                               // weighted, one per compared reading
  double objective = 0;                                    // sum of squared weighted residuals; +inf when !complete
  observations::FitMetrics heads;                          // tensiometer readings used, cm
  std::optional<observations::FitMetrics> water_contents;  // probe and core readings, when they count
  double season_recharge_cm = 0;                           // across the recharge plane, positive downward
  std::vector<double> visit_recharge_cm;                   // per visit interval
};

class SeasonModel {
 public:
  // Reads the site's field records; throws base::InputError for bad records or a study whose
  // objective has no readings to compare.
  SeasonModel(SiteSetup site, ParameterStudy study);

  const SiteSetup& site() const { return site_; }
  const ParameterStudy& study() const { return study_; }
  const FieldRecords& records() const { return records_; }
  std::size_t compared_heads() const { return head_readings_; }
  std::size_t compared_water_contents() const { return water_content_readings_; }
  // Interval ends (days since the run start) of the per-visit recharge.
  const std::vector<double>& interval_end_days() const { return interval_ends_; }

  // One run; `record` (optional) receives the full record for output files. Never throws for a
  // failed run or an unphysical set: the result says so.
  ScoredRun run(const studies::ParameterSet& values, profiles::RunRecord* record = nullptr) const;

  // run() as a task of a studies::TaskRunner: an encoded parameter set in, an encoded scored
  // run out. Every process that holds the same model answers a request with the same bytes.
  studies::TaskHandler handler() const;

  // Every set on `threads` threads (0: all cores), or by `runner` (tasks from handler());
  // results in the order of `sets`, the same whatever runs them. finished(done) is called after
  // each run.
  std::vector<ScoredRun> run_all(const std::vector<studies::ParameterSet>& sets, unsigned threads,
                                 const std::function<void(std::size_t)>& finished = {}) const;
  std::vector<ScoredRun> run_all(const std::vector<studies::ParameterSet>& sets, studies::TaskRunner& runner,
                                 const std::function<void(std::size_t)>& finished = {}) const;

  // The model as the calibration sees it: residuals, and outputs = season recharge followed
  // by the per-visit recharge (cm). The runner must outlive the batch.
  studies::ModelBatch batch(studies::TaskRunner& runner, const std::function<void(std::size_t)>& finished = {}) const;

 private:
  SiteSetup site_;
  ParameterStudy study_;
  FieldRecords records_;
  std::size_t head_readings_ = 0;
  std::size_t water_content_readings_ = 0;
  std::vector<double> interval_ends_;
};

}  // namespace wetfront::site
