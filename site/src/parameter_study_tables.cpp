#include "wetfront/site/parameter_study_tables.hpp"

#include <cmath>

#include <fmt/format.h>

#include "wetfront/base/time_point.hpp"

namespace wetfront::site {
namespace {

std::string date_of(const SeasonModel& model, double day) {
  return base::format_timestamp(base::time_after(model.site().run_start, std::round(day * 86400.0) / 86400.0))
      .substr(0, 10);
}

std::string header_of(const studies::AdjustableParameter& p) {
  return p.unit.empty() ? p.name : fmt::format("{} [{}]", p.name, p.unit);
}

}  // namespace

std::string mm_hundredths(double cm) {
  const double value = std::round(cm * 1000.0) / 100.0;
  return fmt::format("{:.2f}", value == 0.0 ? 0.0 : value);
}

std::string scale_name(const studies::AdjustableParameter& p) {
  return p.scale == studies::ParameterScale::log ? "log" : "linear";
}

std::string metric_text(double value) { return std::isfinite(value) ? number(value, 4) : ""; }

std::string recharge_plane_text(const SeasonModel& model) {
  return fmt::format("the recharge plane at {} cm (positive downward)", number(model.site().recharge_plane_depth_cm));
}

ReportTable sweep_table(const SeasonModel& model, const SweepResult& sweep) {
  ReportTable table;
  table.headers = {"rank", "set"};
  for (const auto& p : model.study().parameters) table.headers.push_back(header_of(p.range));
  table.headers.insert(table.headers.end(), {"objective", "head RMSE [cm]", "head bias [cm]", "head NSE", "head KGE"});
  const bool contents = model.study().weights.water_content_uncertainty.has_value();
  if (contents)
    table.headers.insert(table.headers.end(), {"water content RMSE [cm3/cm3]", "water content bias [cm3/cm3]"});
  table.headers.push_back("season recharge [mm]");
  for (const double end : model.interval_end_days())
    table.headers.push_back(fmt::format("recharge to {} [mm]", date_of(model, end)));
  table.headers.push_back("failure");
  for (std::size_t rank = 0; rank < sweep.ranking.size(); ++rank) {
    const ScoredRun& run = sweep.runs[sweep.ranking[rank]];
    std::vector<std::string> row{std::to_string(rank + 1), std::to_string(sweep.ranking[rank] + 1)};
    for (std::size_t k = 0; k < run.values.size(); ++k) row.push_back(number(run.values[k], 4));
    if (run.complete) {
      row.insert(row.end(),
                 {number(run.objective, 5), metric_text(run.heads.root_mean_square_error), metric_text(run.heads.bias),
                  metric_text(run.heads.nash_sutcliffe), metric_text(run.heads.kling_gupta)});
      if (contents)
        row.insert(row.end(),
                   {metric_text(run.water_contents->root_mean_square_error), metric_text(run.water_contents->bias)});
      row.push_back(mm_hundredths(run.season_recharge_cm));
      for (const double v : run.visit_recharge_cm) row.push_back(mm_hundredths(v));
      row.push_back("");
    } else {
      const std::size_t blanks = 5 + (contents ? 2 : 0) + 1 + model.interval_end_days().size();
      row.insert(row.end(), blanks, "");
      row.push_back(run.failure);
    }
    table.add_row(std::move(row));
  }
  return table;
}

ReportTable calibration_recharge_table(const SeasonModel& model, const CalibrationStudy& study) {
  ReportTable table;
  table.title = fmt::format("Recharge across {}", recharge_plane_text(model));
  table.headers = {"interval",
                   "from",
                   "to",
                   "at start [mm]",
                   "calibrated [mm]",
                   "first-order 95% low [mm]",
                   "first-order 95% high [mm]",
                   "sampled 2.5% [mm]",
                   "sampled median [mm]",
                   "sampled 97.5% [mm]"};
  const auto& ends = model.interval_end_days();
  for (std::size_t i = 0; i <= ends.size(); ++i) {
    // Row 0 is the season; row i the interval ending at ends[i - 1].
    const bool season = i == 0;
    const double from = season || i == 1 ? 0.0 : ends[i - 2];
    const double to = season ? ends.back() : ends[i - 1];
    const auto value = [&](const ScoredRun& run) {
      if (!run.complete) return std::string();
      return mm_hundredths(season ? run.season_recharge_cm : run.visit_recharge_cm.at(i - 1));
    };
    std::vector<std::string> row{season ? "season" : std::to_string(i), date_of(model, from), date_of(model, to),
                                 value(study.before), value(study.after)};
    if (i < study.first_order.size()) {
      row.push_back(mm_hundredths(study.first_order[i].lower));
      row.push_back(mm_hundredths(study.first_order[i].upper));
    } else {
      row.insert(row.end(), 2, "");
    }
    if (i < study.band.size()) {
      row.insert(row.end(), {mm_hundredths(study.band[i].low), mm_hundredths(study.band[i].median),
                             mm_hundredths(study.band[i].high)});
    } else {
      row.insert(row.end(), 3, "");
    }
    table.add_row(std::move(row));
  }
  return table;
}

}  // namespace wetfront::site
