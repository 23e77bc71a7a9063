#include "wetfront/site/parameter_runs.hpp"

#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "fit_readings.hpp"
#include "scored_run_bytes.hpp"
#include "wetfront/site/simulated_profiles.hpp"
#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {

namespace obs = observations;
using detail::compared;
using detail::is_head;

SeasonModel::SeasonModel(SiteSetup site, ParameterStudy study)
    : site_(std::move(site)), study_(std::move(study)), records_(read_field_records(site_)) {
  const Season base = build_season(site_, records_);
  const double end_day = base.problem.end_day;
  for (const auto& r : records_.sensor_readings) {
    for (const auto& o : r.series.observations) {
      if (!compared(r, o, study_.weights, end_day)) continue;
      ++(is_head(r) ? head_readings_ : water_content_readings_);
    }
  }
  if (head_readings_ + water_content_readings_ == 0) {
    throw base::InputError(
        site_.site_file.string(), 0, "",
        study_.weights.water_content_uncertainty
            ? "no sensor readings inside the run to compare runs with: add [[sensors]] with readings"
            : "no tensiometer readings inside the run to compare runs with: add tensiometers, or give "
              "[fit] water_content_uncertainty so that probe readings count");
  }
  for (const double visit : site_.visit_days) {
    if (visit > 1e-9 && visit < end_day - 1e-6) interval_ends_.push_back(visit);
  }
  interval_ends_.push_back(end_day);
}

ScoredRun SeasonModel::run(const studies::ParameterSet& values, profiles::RunRecord* record) const {
  ScoredRun scored;
  scored.values = values;
  scored.objective = std::numeric_limits<double>::infinity();
  std::optional<Season> season;
  try {
    season.emplace(build_season(with_parameters(site_, study_, values), records_));
  } catch (const std::exception& error) {  // an unphysical combination of values
    scored.failure = error.what();
    return scored;
  }
  solver::ColumnRun column;
  try {
    column = solver::simulate(season->problem);
  } catch (const std::exception& error) {  // a problem the solver refuses for these values
    scored.failure = error.what();
    return scored;
  }
  if (!column.complete) {
    scored.failure = column.failure
                         ? fmt::format("solver failed at day {:.3f} near {:.1f} cm: {}", column.failure->time_days,
                                       column.failure->depth_cm, column.failure->reason)
                         : std::string("solver failed");
    return scored;
  }
  const double end_day = season->problem.end_day;
  const obs::SimulatedProfiles heads = simulated_profiles(column, true);
  const obs::SimulatedProfiles contents = simulated_profiles(column, false);
  std::vector<double> residuals;
  std::vector<double> head_sim, head_obs, content_sim, content_obs;
  for (const auto& r : records_.sensor_readings) {
    const bool tensiometer = is_head(r);
    for (const auto& o : r.series.observations) {
      if (!compared(r, o, study_.weights, end_day)) continue;
      const auto value = obs::simulated_value_at(tensiometer ? heads : contents, o.day, o.depth_cm);
      if (!value) {
        scored.failure = fmt::format("no simulated value for {} at day {:.3f}", r.name, o.day);
        return scored;
      }
      const double sigma = detail::reading_uncertainty(r, study_.weights);
      residuals.push_back((*value - o.value) / sigma);
      (tensiometer ? head_sim : content_sim).push_back(*value);
      (tensiometer ? head_obs : content_obs).push_back(o.value);
    }
  }
  scored.residuals = Eigen::Map<const Eigen::VectorXd>(residuals.data(), static_cast<Eigen::Index>(residuals.size()));
  scored.objective = scored.residuals.squaredNorm();
  scored.heads = obs::fit_metrics(head_sim, head_obs);
  if (study_.weights.water_content_uncertainty) scored.water_contents = obs::fit_metrics(content_sim, content_obs);
  profiles::RunRecord made = make_record(*season, std::move(column), "");
  for (const auto& interval : made.visit_balance) {
    scored.visit_recharge_cm.push_back(interval.plane_flux_cm.at(0));
    scored.season_recharge_cm += interval.plane_flux_cm.at(0);
  }
  scored.complete = true;
  if (record) *record = std::move(made);
  return scored;
}

studies::TaskHandler SeasonModel::handler() const {
  return [this](std::string_view request) { return encode_scored_run(run(decode_parameter_set(request))); };
}

std::vector<ScoredRun> SeasonModel::run_all(const std::vector<studies::ParameterSet>& sets, unsigned threads,
                                            const std::function<void(std::size_t)>& finished) const {
  studies::ThreadTaskRunner runner(handler(), threads);
  return run_all(sets, runner, finished);
}

std::vector<ScoredRun> SeasonModel::run_all(const std::vector<studies::ParameterSet>& sets,
                                            studies::TaskRunner& runner,
                                            const std::function<void(std::size_t)>& finished) const {
  std::vector<std::string> requests;
  for (const auto& set : sets) requests.push_back(encode_parameter_set(set));
  std::vector<ScoredRun> runs;
  const auto each = [&finished](std::size_t done, std::size_t, std::string_view) {
    if (finished) finished(done);
  };
  for (const std::string& result : runner.run(requests, each)) runs.push_back(decode_scored_run(result));
  return runs;
}

studies::ModelBatch SeasonModel::batch(studies::TaskRunner& runner,
                                       const std::function<void(std::size_t)>& finished) const {
  return [this, &runner, finished](const std::vector<studies::ParameterSet>& sets) {
    std::vector<studies::ModelRun> out;
    for (ScoredRun& scored : run_all(sets, runner, finished)) {
      studies::ModelRun model_run;
      model_run.ok = scored.complete;
      model_run.failure = std::move(scored.failure);
      model_run.residuals = std::move(scored.residuals);
      model_run.outputs.resize(static_cast<Eigen::Index>(scored.visit_recharge_cm.size() + 1));
      if (scored.complete) {
        model_run.outputs[0] = scored.season_recharge_cm;
        for (std::size_t i = 0; i < scored.visit_recharge_cm.size(); ++i)
          model_run.outputs[static_cast<Eigen::Index>(i + 1)] = scored.visit_recharge_cm[i];
      }
      out.push_back(std::move(model_run));
    }
    return out;
  };
}

}  // namespace wetfront::site
