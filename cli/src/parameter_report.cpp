#include "parameter_report.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "wetfront/site/parameter_study_tables.hpp"
#include "wetfront/studies/parameter_uncertainty.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

constexpr const char* kSweepCautions =
    "\nCautions:\n"
    "  - A parameter set that matches the tensiometers is not proven right: other sets, other model\n"
    "    structure (preferential flow, hysteresis, lateral flow) or errors in the field records may\n"
    "    match them as well.\n"
    "  - Every recharge number here is an estimate. Decisions on water use, recharge or abstraction rest\n"
    "    with local regulations and licensed professionals, not with this program.\n";

constexpr const char* kCalibrationCautions =
    "\nCautions:\n"
    "  - The calibrated values are those that fit these readings best under this model; they are not\n"
    "    proven right. Other model structure (preferential flow, hysteresis, lateral flow) or errors in\n"
    "    the field records can bias them.\n"
    "  - The recharge bands cover parameter uncertainty only, under the model's assumptions and the\n"
    "    stated reading uncertainties; the true uncertainty is larger.\n"
    "  - Every recharge number here is an estimate. Decisions on water use, recharge or abstraction rest\n"
    "    with local regulations and licensed professionals, not with this program.\n";

// Which parameters drive the season band, in two plain measures: how far one standard error of
// each parameter moves season recharge (|s_k| se_k), and its first-order share of the variance.
std::string drivers_text(const studies::CalibrationResult& fit, const studies::FirstOrderInterval& season) {
  std::vector<std::size_t> order(fit.parameters.size());
  for (std::size_t k = 0; k < order.size(); ++k) order[k] = k;
  const auto moved = [&](std::size_t k) {
    const auto e = static_cast<Eigen::Index>(k);
    return std::abs(fit.output_sensitivity(0, e)) * fit.standard_errors[e];
  };
  std::sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return moved(a) > moved(b); });
  std::string out =
      fmt::format("What drives the season band (first order, sd {} mm):\n", mm_hundredths(season.standard_deviation));
  bool beyond = false;
  for (const std::size_t k : order) {
    out += fmt::format("  {}: one standard error moves season recharge by {} mm; {:.0f}% of the variance\n",
                       fit.parameters[k].name, mm_hundredths(moved(k)), 100 * season.variance_share[k]);
    beyond = beyond || season.variance_share[k] < 0 || season.variance_share[k] > 1;
  }
  if (beyond)
    out += "  (shares below 0 or above 100% come from correlated parameters whose effects on recharge partly cancel)\n";
  return out;
}

}  // namespace

std::string objective_text(const SeasonModel& model) {
  const FitWeights& w = model.study().weights;
  std::string text = fmt::format(
      "Objective: sum of squared weighted residuals (simulated - observed) / uncertainty;\n"
      "  {} tensiometer readings, uncertainty {} cm of water (weight 1/{}^2 per cm^2)",
      model.compared_heads(), number(w.head_uncertainty_cm), number(w.head_uncertainty_cm));
  if (w.water_content_uncertainty) {
    text += fmt::format(";\n  {} water-content readings (probes and cores), uncertainty {} cm3/cm3",
                        model.compared_water_contents(), number(*w.water_content_uncertainty));
  } else {
    text += ";\n  water contents are not compared (give [fit] water_content_uncertainty to include probes and cores)";
  }
  return text + "\n  Tensiometer readings beyond their working limit and observation-well levels are left out.\n";
}

std::string parameters_text(const ParameterStudy& study) {
  std::string text = fmt::format("Adjustable parameters ({}):\n", study.parameters.size());
  for (const auto& p : study.parameters) {
    const auto& r = p.range;
    text += fmt::format("  {}: {} to {}, {} scale, site value {}\n", r.name, parameter_value_text(r, r.lower),
                        parameter_value_text(r, r.upper), scale_name(r), parameter_value_text(r, r.start));
  }
  return text;
}

std::string sweep_report(const SeasonModel& model, const SweepResult& sweep, std::size_t shown, double seconds,
                         unsigned threads) {
  const SiteSetup& site = model.site();
  std::string out = fmt::format("Parameter sweep: {}, {} to {}\n\n", site.name, site.run_start_text, site.run_end_text);
  out += parameters_text(model.study()) + "\n" + objective_text(model);
  std::vector<double> complete_recharge;
  std::size_t failed = 0;
  for (const auto& run : sweep.runs) {
    if (run.complete)
      complete_recharge.push_back(run.season_recharge_cm);
    else
      ++failed;
  }
  out += fmt::format("\nSets: {}, {} runs in {:.1f} s on {} thread(s) (about {:.2f} s of one thread per run)\n",
                     sweep.method, sweep.runs.size(), seconds, threads,
                     sweep.runs.empty() ? 0.0 : seconds * threads / static_cast<double>(sweep.runs.size()));
  ReportTable full = sweep_table(model, sweep);
  ReportTable top;
  top.title = fmt::format("Best {} of {} sets (lowest objective first); recharge across {}",
                          std::min(shown, full.rows.size()), full.rows.size(), recharge_plane_text(model));
  // The printed table keeps the parameter, fit and season columns; the CSV has every interval.
  const std::size_t season_column =
      std::find(full.headers.begin(), full.headers.end(), "season recharge [mm]") - full.headers.begin();
  top.headers.assign(full.headers.begin(), full.headers.begin() + static_cast<std::ptrdiff_t>(season_column + 1));
  for (std::size_t i = 0; i < std::min(shown, full.rows.size()); ++i)
    top.add_row({full.rows[i].begin(), full.rows[i].begin() + static_cast<std::ptrdiff_t>(season_column + 1)});
  out += fmt::format("\n{}", format_table(top));
  if (!complete_recharge.empty()) {
    std::vector<double> best_tenth;
    const std::size_t tenth = std::max<std::size_t>(1, complete_recharge.size() / 10);
    for (std::size_t i = 0; i < tenth; ++i) best_tenth.push_back(sweep.runs[sweep.ranking[i]].season_recharge_cm);
    const auto [low_all, high_all] = std::minmax_element(complete_recharge.begin(), complete_recharge.end());
    const auto [low_best, high_best] = std::minmax_element(best_tenth.begin(), best_tenth.end());
    out += fmt::format(
        "\nSeason recharge: {} to {} mm over the best {} set(s) (the best tenth); {} to {} mm over all {} complete "
        "sets.\n",
        mm_hundredths(*low_best), mm_hundredths(*high_best), tenth, mm_hundredths(*low_all), mm_hundredths(*high_all),
        complete_recharge.size());
  }
  if (failed > 0)
    out += fmt::format("{} run(s) did not finish; they are ranked last with the reason in the CSV.\n", failed);
  out +=
      "A sweep shows which sets are consistent with the readings; it is not a probability distribution of recharge.\n";
  return out + kSweepCautions;
}

std::string calibration_report(const SeasonModel& model, const CalibrationStudy& study, double seconds,
                               unsigned threads) {
  const SiteSetup& site = model.site();
  const studies::CalibrationResult& fit = study.fit;
  std::string out = fmt::format("Calibration: {}, {} to {}\n\n", site.name, site.run_start_text, site.run_end_text);
  out += parameters_text(model.study()) + "\n" + objective_text(model);
  out += fmt::format(
      "\nLevenberg-Marquardt on the search scale (log10 for log parameters): {} after {} iteration(s),\n"
      "{} model runs in {:.1f} s on {} thread(s).\n",
      fit.stop_reason, fit.iterations, fit.runs, seconds, threads);
  ReportTable parameters;
  parameters.title =
      "Parameters (standard errors on the search scale; the 95% range is best +- 1.96 standard errors, mapped back)";
  parameters.headers = {"parameter", "unit", "scale", "start", "calibrated", "standard error", "95% low", "95% high"};
  for (std::size_t k = 0; k < fit.parameters.size(); ++k) {
    const auto& p = fit.parameters[k];
    const auto e = static_cast<Eigen::Index>(k);
    const double se = fit.standard_errors.size() > e ? fit.standard_errors[e] : NAN;
    std::string low, high;
    if (std::isfinite(se)) {
      const double lo = std::max(to_search_scale(p, p.lower), fit.best_search[e] - 1.959964 * se);
      const double hi = std::min(to_search_scale(p, p.upper), fit.best_search[e] + 1.959964 * se);
      low = number(from_search_scale(p, lo), 4);
      high = number(from_search_scale(p, hi), 4);
    }
    parameters.add_row({p.name, p.unit, scale_name(p), number(fit.start[k], 4), number(fit.best[k], 4),
                        std::isfinite(se) ? number(se, 3) : "unavailable", low, high});
  }
  out += "\n" + format_table(parameters);
  if (fit.correlation.size() > 0 && fit.parameters.size() > 1) {
    ReportTable correlation;
    correlation.title = "Correlation of the calibrated parameters";
    correlation.headers = {"parameter"};
    for (const auto& p : fit.parameters) correlation.headers.push_back(p.name);
    for (std::size_t a = 0; a < fit.parameters.size(); ++a) {
      std::vector<std::string> row{fit.parameters[a].name};
      for (std::size_t b = 0; b < fit.parameters.size(); ++b)
        row.push_back(
            fmt::format("{:.3f}", fit.correlation(static_cast<Eigen::Index>(a), static_cast<Eigen::Index>(b))));
      correlation.add_row(std::move(row));
    }
    out += "\n" + format_table(correlation);
  } else if (fit.correlation.size() == 0) {
    out += fmt::format("\nNo standard errors or correlations: {}\n", fit.covariance_note);
  }
  ReportTable residuals;
  residuals.title = "Fit to the readings";
  residuals.headers = {"", "objective", "head RMSE [cm]", "head bias [cm]", "head NSE", "head KGE"};
  const bool contents = study.after.water_contents.has_value();
  if (contents)
    residuals.headers.insert(residuals.headers.end(), {"water content RMSE [cm3/cm3]", "water content bias [cm3/cm3]"});
  for (const auto* run : {&study.before, &study.after}) {
    std::vector<std::string> row{run == &study.before ? "at start" : "calibrated", number(run->objective, 5),
                                 metric_text(run->heads.root_mean_square_error),   metric_text(run->heads.bias),
                                 metric_text(run->heads.nash_sutcliffe),           metric_text(run->heads.kling_gupta)};
    if (contents && run->water_contents)
      row.insert(row.end(),
                 {metric_text(run->water_contents->root_mean_square_error), metric_text(run->water_contents->bias)});
    residuals.add_row(std::move(row));
  }
  out += "\n" + format_table(residuals);
  if (fit.residual_count() > static_cast<int>(fit.parameters.size())) {
    const double s2 = study.after.objective / (fit.residual_count() - static_cast<int>(fit.parameters.size()));
    out += fmt::format(
        "Residual variance per reading {:.3g} (1 when the stated uncertainties describe the misfit; above 1 the\n"
        "model or the readings differ by more; the standard errors are scaled by its square root).\n",
        s2);
  }
  if (!fit.warnings.empty()) {
    out += "\nWarnings:\n";
    for (const auto& w : fit.warnings) out += fmt::format("  - {}\n", w);
  }
  out += "\n" + format_table(calibration_recharge_table(model, study));
  if (!study.band_note.empty()) out += study.band_note + "\n";
  if (!study.band.empty())
    out += fmt::format(
        "Sampled band: {} parameter sets drawn from the calibrated covariance ({} ran to the end, {} failed).\n",
        study.band_runs_complete + study.band_runs_failed, study.band_runs_complete, study.band_runs_failed);
  if (!study.first_order.empty()) out += drivers_text(fit, study.first_order.front());
  return out + kCalibrationCautions;
}

}  // namespace wetfront::cli
