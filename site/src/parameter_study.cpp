#include "wetfront/site/parameter_study.hpp"

#include <algorithm>
#include <atomic>
#include <optional>
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/studies/parameter_sampling.hpp"

namespace wetfront::site {
namespace {

namespace obs = observations;

std::vector<studies::AdjustableParameter> checked_ranges(const SeasonModel& model) {
  auto ranges = model.study().ranges();
  if (ranges.empty())
    throw base::InputError(
        "the site file marks no parameter as adjustable: add [[adjustable]] entries (docs/site-file.md)");
  return ranges;
}

// The settings' runner, or the machine's threads.
class ChosenRunner {
 public:
  ChosenRunner(const SeasonModel& model, studies::TaskRunner* given, unsigned threads)
      : runner_(given ? *given : own_.emplace(model.handler(), threads)) {}
  studies::TaskRunner& operator*() { return runner_; }

 private:
  std::optional<studies::ThreadTaskRunner> own_;
  studies::TaskRunner& runner_;
};

}  // namespace

SweepResult run_sweep(const SeasonModel& model, const SweepSettings& settings, const StudyProgress& progress) {
  const auto ranges = checked_ranges(model);
  SweepResult result;
  std::vector<studies::ParameterSet> sets;
  if (settings.full_grid) {
    sets = studies::full_grid(ranges, settings.max_grid_sets);
    result.method = "full grid";
  } else {
    sets = studies::latin_hypercube(ranges, settings.sample_size, settings.seed);
    result.method = fmt::format("Latin hypercube sample (seed {})", settings.seed);
  }
  ChosenRunner runner(model, settings.runner, settings.threads);
  result.runs = model.run_all(sets, *runner, [&](std::size_t done) {
    if (progress) progress(done, sets.size());
  });
  result.ranking.resize(result.runs.size());
  for (std::size_t i = 0; i < result.ranking.size(); ++i) result.ranking[i] = i;
  // Ties keep the order of the sets, so the ranking is the same on every run.
  std::stable_sort(result.ranking.begin(), result.ranking.end(),
                   [&](std::size_t a, std::size_t b) { return result.runs[a].objective < result.runs[b].objective; });
  return result;
}

CalibrationStudy run_calibration(const SeasonModel& model, const CalibrationSettings& settings,
                                 const StudyProgress& progress) {
  const auto ranges = checked_ranges(model);
  CalibrationStudy study;
  std::atomic<std::size_t> done{0};
  const std::size_t planned = static_cast<std::size_t>(settings.options.max_runs) + settings.band_runs;
  const auto tick = [&](std::size_t) {
    if (progress) progress(++done, planned);
  };
  ChosenRunner runner(model, settings.runner, settings.threads);
  study.fit = studies::calibrate(ranges, model.batch(*runner, tick), settings.options);
  if (!study.fit.converged)
    study.fit.warnings.push_back(
        fmt::format("the fit did not converge ({}): the values, standard errors and bands describe the "
                    "point where it stopped, not an optimum; raise --max-runs or start nearer",
                    study.fit.stop_reason));
  // The runs at the start and at the optimum again, with their metrics (cheap next to the fit).
  const std::vector<studies::ParameterSet> ends{study.fit.start, study.fit.best};
  auto end_runs = model.run_all(ends, *runner);
  study.before = std::move(end_runs[0]);
  study.after = std::move(end_runs[1]);

  const Eigen::VectorXd& outputs = study.fit.at_best.outputs;
  if (study.fit.covariance.size() == 0) {
    study.band_note =
        "no uncertainty band: " +
        (study.fit.covariance_note.empty() ? std::string("the covariance is unavailable") : study.fit.covariance_note);
    return study;
  }
  study.first_order = studies::first_order_intervals(outputs, study.fit.output_sensitivity, study.fit.covariance);
  if (settings.band_runs == 0) {
    study.band_note = "no sampled band was asked for";
    return study;
  }
  std::vector<studies::ParameterSet> sets;
  try {
    sets = studies::draw_parameter_sets(ranges, study.fit.best_search, study.fit.covariance, settings.band_runs,
                                        settings.seed);
  } catch (const base::InputError& error) {  // the fit stands; only the band is missing
    study.band_note = fmt::format("no sampled band: {}", error.what());
    return study;
  }
  const auto runs = model.run_all(sets, *runner, tick);
  std::vector<std::vector<double>> values(static_cast<std::size_t>(outputs.size()));
  for (const auto& run : runs) {
    if (!run.complete) {
      ++study.band_runs_failed;
      continue;
    }
    ++study.band_runs_complete;
    values[0].push_back(run.season_recharge_cm);
    for (std::size_t i = 0; i < run.visit_recharge_cm.size() && i + 1 < values.size(); ++i)
      values[i + 1].push_back(run.visit_recharge_cm[i]);
  }
  if (study.band_runs_complete < 2) {
    study.band_note = "no sampled band: fewer than two of the drawn parameter sets ran to the end";
    return study;
  }
  for (const auto& v : values)
    study.band.push_back({studies::percentile(v, 0.025), studies::percentile(v, 0.5), studies::percentile(v, 0.975)});
  return study;
}

}  // namespace wetfront::site
