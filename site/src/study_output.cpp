#include "wetfront/site/study_output.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/studies/parallel_batch.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/study_file.hpp"
#include "study_tables.hpp"

namespace wetfront::site {
namespace {

namespace obs = observations;
using profiles::StudyColumn;

constexpr double kMissing = std::numeric_limits<double>::quiet_NaN();

StudyColumn interval_axis(const SeasonModel& model) {
  return {"interval_end", "days since run start",
          "end of the visit interval (its start is the previous end, or the run start)", model.interval_end_days()};
}

std::vector<std::pair<std::string, double>> labelled_values(const SeasonModel& model,
                                                            const studies::ParameterSet& values) {
  std::vector<std::pair<std::string, double>> out;
  const auto& parameters = model.study().parameters;
  for (std::size_t k = 0; k < values.size(); ++k) {
    const auto& r = parameters[k].range;
    out.push_back({r.unit.empty() ? r.name : fmt::format("{} [{}]", r.name, r.unit), values[k]});
  }
  return out;
}

}  // namespace

namespace detail {

profiles::StudyRecord study_record(const SiteSetup& site, const ParameterStudy& study, const std::string& input_hash,
                                   std::string kind, const std::string& version, const std::string& run_id) {
  profiles::StudyRecord record;
  record.run_id = run_id;
  record.study_kind = std::move(kind);
  record.site_name = site.name;
  record.run_start_date = site.run_start_text;
  record.program_version = version;
  record.input_hash = input_hash;
  const FitWeights& w = study.weights;
  record.notes.push_back({"objective", "sum of squared weighted residuals (simulated - observed) / uncertainty"});
  record.notes.push_back({"head_uncertainty", fmt::format("{} cm", w.head_uncertainty_cm)});
  record.notes.push_back({"water_content_uncertainty", w.water_content_uncertainty
                                                           ? fmt::format("{} cm3/cm3", *w.water_content_uncertainty)
                                                           : "not compared"});
  record.notes.push_back({"recharge_plane", fmt::format("{} cm below the surface; recharge positive downward",
                                                        site.recharge_plane_depth_cm)});
  return record;
}

// /parameters: one row per adjustable parameter.
profiles::StudyTable parameter_table(const ParameterStudy& study) {
  profiles::StudyTable table;
  table.group = "parameters";
  const auto& parameters = study.parameters;
  table.axis = {"parameter_number", "1", "number of the adjustable parameter (site-file order)", {}};
  profiles::StudyTextColumn names{"name", "layer and key, or site key", {}};
  profiles::StudyTextColumn units{"unit", "unit of the values of this parameter", {}};
  profiles::StudyTextColumn scales{"scale", "search scale: linear, or log (log10 of the value)", {}};
  StudyColumn lower{"lower", "", "lower end of the range, in the unit given by unit", {}};
  StudyColumn upper{"upper", "", "upper end of the range, in the unit given by unit", {}};
  StudyColumn site_value{"site_value", "", "value in the site file, in the unit given by unit", {}};
  for (std::size_t k = 0; k < parameters.size(); ++k) {
    const auto& r = parameters[k].range;
    table.axis.values.push_back(static_cast<double>(k + 1));
    names.values.push_back(r.name);
    units.values.push_back(r.unit.empty() ? "1" : r.unit);
    scales.values.push_back(r.scale == studies::ParameterScale::log ? "log" : "linear");
    lower.values.push_back(r.lower);
    upper.values.push_back(r.upper);
    site_value.values.push_back(r.start);
  }
  table.texts = {names, units, scales};
  table.columns = {lower, upper, site_value};
  return table;
}

void save_study(const std::filesystem::path& path, const profiles::StudyRecord& record) {
  try {
    profiles::write_study(path, record);
  } catch (const profiles::RunFileError& error) {
    throw base::InputError(error.what());
  }
}
}  // namespace detail

void write_sweep_file(const std::filesystem::path& path, const SeasonModel& model, const SweepResult& sweep,
                      std::size_t kept, unsigned threads, const std::string& program_version,
                      const std::string& run_id) {
  profiles::StudyRecord record = detail::study_record(model.site(), model.study(), model.records().input_hash,
                                                      "parameter sweep", program_version, run_id);
  record.notes.push_back({"sampling", sweep.method});
  record.tables.push_back(detail::parameter_table(model.study()));

  profiles::StudyTable sets;
  sets.group = "sets";
  sets.axis = {"set_number", "1", "number of the parameter set in the order the sets were made", {}};
  StudyColumn rank{"rank", "1", "rank by objective, 1 = best; failed runs last", {}};
  StudyColumn objective{"objective", "1", "sum of squared weighted residuals (infinite for a failed run)", {}};
  StudyColumn complete{"complete", "1", "1 when the run reached the end, 0 when it failed", {}};
  StudyColumn rmse{"head_rmse", "cm", "root mean square error of the tensiometer heads", {}};
  StudyColumn bias{"head_bias", "cm", "mean of simulated minus observed tensiometer heads", {}};
  StudyColumn nse{"head_nse", "1", "Nash-Sutcliffe efficiency of the tensiometer heads", {}};
  StudyColumn kge{"head_kge", "1", "Kling-Gupta efficiency of the tensiometer heads", {}};
  StudyColumn season{"season_recharge", "cm", "water across the recharge plane over the run (positive downward)", {}};
  const auto& parameters = model.study().parameters;
  StudyColumn parameter_axis{"parameter_number", "1", "number of the adjustable parameter", {}};
  for (std::size_t k = 0; k < parameters.size(); ++k) parameter_axis.values.push_back(static_cast<double>(k + 1));
  profiles::StudyMatrix values{
      "values", "", "parameter values of the set, in the units given by /parameters/unit", parameter_axis, {}};
  profiles::StudyMatrix recharge{"interval_recharge",
                                 "cm",
                                 "water across the recharge plane per visit interval (positive downward)",
                                 interval_axis(model),
                                 {}};
  std::vector<double> ranks(sweep.runs.size());
  for (std::size_t r = 0; r < sweep.ranking.size(); ++r) ranks[sweep.ranking[r]] = static_cast<double>(r + 1);
  for (std::size_t i = 0; i < sweep.runs.size(); ++i) {
    const ScoredRun& run = sweep.runs[i];
    sets.axis.values.push_back(static_cast<double>(i + 1));
    rank.values.push_back(ranks[i]);
    objective.values.push_back(run.objective);
    complete.values.push_back(run.complete ? 1 : 0);
    rmse.values.push_back(run.complete ? run.heads.root_mean_square_error : kMissing);
    bias.values.push_back(run.complete ? run.heads.bias : kMissing);
    nse.values.push_back(run.complete ? run.heads.nash_sutcliffe : kMissing);
    kge.values.push_back(run.complete ? run.heads.kling_gupta : kMissing);
    season.values.push_back(run.complete ? run.season_recharge_cm : kMissing);
    values.values.insert(values.values.end(), run.values.begin(), run.values.end());
    for (std::size_t j = 0; j < model.interval_end_days().size(); ++j)
      recharge.values.push_back(run.complete && j < run.visit_recharge_cm.size() ? run.visit_recharge_cm[j] : kMissing);
  }
  sets.columns = {rank, objective, complete, rmse, bias, nse, kge, season};
  sets.matrices = {values, recharge};
  record.tables.push_back(std::move(sets));

  // The best complete runs again, in parallel, for their profiles (deterministic: the same runs).
  std::size_t count = 0;
  while (count < std::min(kept, sweep.ranking.size()) && sweep.runs[sweep.ranking[count]].complete) ++count;
  std::vector<profiles::RunRecord> records(count);
  studies::run_batch(count, threads,
                     [&](std::size_t r) { model.run(sweep.runs[sweep.ranking[r]].values, &records[r]); });
  for (std::size_t r = 0; r < count; ++r) {
    const ScoredRun& best = sweep.runs[sweep.ranking[r]];
    record.runs.push_back(
        {fmt::format("rank_{}", r + 1),
         fmt::format("set {}, rank {} by objective ({})", sweep.ranking[r] + 1, r + 1, best.objective),
         labelled_values(model, best.values), std::move(records[r].run)});
  }
  detail::save_study(path, record);
}

void write_calibration_file(const std::filesystem::path& path, const SeasonModel& model, const CalibrationStudy& study,
                            const std::string& program_version, const std::string& run_id) {
  const studies::CalibrationResult& fit = study.fit;
  profiles::StudyRecord record = detail::study_record(model.site(), model.study(), model.records().input_hash,
                                                      "calibration", program_version, run_id);
  record.notes.push_back({"stop_reason", fit.stop_reason});
  record.notes.push_back({"model_runs", std::to_string(fit.runs)});
  if (!fit.covariance_note.empty()) record.notes.push_back({"covariance_note", fit.covariance_note});
  std::string warnings;
  for (const auto& w : fit.warnings) warnings += w + "\n";
  record.notes.push_back({"warnings", warnings});

  profiles::StudyTable parameters = detail::parameter_table(model.study());
  const auto n = fit.parameters.size();
  StudyColumn start{"start", "", "value the calibration started from, in the unit given by unit", fit.start};
  StudyColumn best{"calibrated", "", "calibrated value, in the unit given by unit", fit.best};
  StudyColumn best_search{"calibrated_search_value", "", "calibrated value on the search scale, in search_unit", {}};
  StudyColumn se{"standard_error", "", "standard error on the search scale, in search_unit (NaN when unavailable)", {}};
  profiles::StudyTextColumn search_unit{
      "search_unit", "unit on the search scale: the parameter's unit, or log10 of it", {}};
  for (std::size_t k = 0; k < n; ++k) {
    const auto& p = fit.parameters[k];
    search_unit.values.push_back(p.scale == studies::ParameterScale::log
                                     ? fmt::format("log10({})", p.unit.empty() ? "1" : p.unit)
                                     : (p.unit.empty() ? "1" : p.unit));
    best_search.values.push_back(fit.best_search[static_cast<Eigen::Index>(k)]);
    se.values.push_back(fit.standard_errors.size() > 0 ? fit.standard_errors[static_cast<Eigen::Index>(k)] : kMissing);
  }
  parameters.columns.insert(parameters.columns.end(), {start, best, best_search, se});
  parameters.texts.push_back(search_unit);
  if (fit.covariance.size() > 0) {
    const StudyColumn axis = parameters.axis;
    std::vector<double> covariance(fit.covariance.data(), fit.covariance.data() + fit.covariance.size());
    std::vector<double> correlation(fit.correlation.data(), fit.correlation.data() + fit.correlation.size());
    // Both are symmetric, so column-major storage reads the same row-major.
    parameters.matrices.push_back({"covariance", "",
                                   "covariance of the calibrated values on the search scale, in the product of the two "
                                   "parameters' search_unit",
                                   axis, covariance});
    parameters.matrices.push_back({"correlation", "1", "correlation of the calibrated values", axis, correlation});
  }
  record.tables.push_back(std::move(parameters));

  profiles::StudyTable recharge;
  recharge.group = "recharge";
  recharge.axis = interval_axis(model);
  const auto interval_column = [&](std::string name, std::string long_name, auto value_of) {
    StudyColumn column{std::move(name), "cm", std::move(long_name), {}};
    for (std::size_t i = 0; i < model.interval_end_days().size(); ++i) column.values.push_back(value_of(i + 1));
    return column;
  };
  const auto run_value = [](const ScoredRun& run, std::size_t i) {
    return run.complete && i - 1 < run.visit_recharge_cm.size() ? run.visit_recharge_cm[i - 1] : kMissing;
  };
  recharge.columns.push_back(interval_column("at_start", "recharge per interval with the starting values",
                                             [&](std::size_t i) { return run_value(study.before, i); }));
  recharge.columns.push_back(interval_column("calibrated", "recharge per interval with the calibrated values",
                                             [&](std::size_t i) { return run_value(study.after, i); }));
  if (!study.first_order.empty()) {
    recharge.columns.push_back(interval_column("first_order_low", "lower end of the first-order 95% interval",
                                               [&](std::size_t i) { return study.first_order[i].lower; }));
    recharge.columns.push_back(interval_column("first_order_high", "upper end of the first-order 95% interval",
                                               [&](std::size_t i) { return study.first_order[i].upper; }));
  }
  if (!study.band.empty()) {
    recharge.columns.push_back(interval_column("sampled_p025", "2.5th percentile over the sampled parameter sets",
                                               [&](std::size_t i) { return study.band[i].low; }));
    recharge.columns.push_back(interval_column("sampled_p50", "median over the sampled parameter sets",
                                               [&](std::size_t i) { return study.band[i].median; }));
    recharge.columns.push_back(interval_column("sampled_p975", "97.5th percentile over the sampled parameter sets",
                                               [&](std::size_t i) { return study.band[i].high; }));
  }
  record.tables.push_back(std::move(recharge));
  // The season totals as a one-row table: first-order and sampled band of the whole run.
  profiles::StudyTable season;
  season.group = "season_recharge";
  season.axis = {"run_end", "days since run start", "end of the run", {model.interval_end_days().back()}};
  season.columns.push_back({"at_start",
                            "cm",
                            "season recharge with the starting values",
                            {study.before.complete ? study.before.season_recharge_cm : kMissing}});
  season.columns.push_back({"calibrated",
                            "cm",
                            "season recharge with the calibrated values",
                            {study.after.complete ? study.after.season_recharge_cm : kMissing}});
  if (!study.first_order.empty()) {
    season.columns.push_back(
        {"first_order_sd", "cm", "first-order standard deviation", {study.first_order[0].standard_deviation}});
    season.columns.push_back(
        {"first_order_low", "cm", "lower end of the first-order 95% interval", {study.first_order[0].lower}});
    season.columns.push_back(
        {"first_order_high", "cm", "upper end of the first-order 95% interval", {study.first_order[0].upper}});
    for (std::size_t k = 0; k < n; ++k)
      season.columns.push_back(
          {fmt::format("variance_share_{}", k + 1),
           "1",
           fmt::format("first-order share of the variance from parameter {} ({})", k + 1, fit.parameters[k].name),
           {study.first_order[0].variance_share[k]}});
  }
  if (!study.band.empty()) {
    season.columns.push_back(
        {"sampled_p025", "cm", "2.5th percentile over the sampled parameter sets", {study.band[0].low}});
    season.columns.push_back({"sampled_p50", "cm", "median over the sampled parameter sets", {study.band[0].median}});
    season.columns.push_back(
        {"sampled_p975", "cm", "97.5th percentile over the sampled parameter sets", {study.band[0].high}});
  }
  record.tables.push_back(std::move(season));

  if (study.after.complete) {
    profiles::RunRecord run_record;
    model.run(fit.best, &run_record);
    record.runs.push_back({"calibrated", "the run with the calibrated values", labelled_values(model, fit.best),
                           std::move(run_record.run)});
  }
  detail::save_study(path, record);
}

}  // namespace wetfront::site
