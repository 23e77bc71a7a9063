#include "wetfront/site/season_tables.hpp"

#include <cmath>

#include "wetfront/base/time_point.hpp"

namespace wetfront::site {

std::string date_after(const std::string& run_start, double days) {
  const auto start = base::parse_timestamp(run_start);
  if (!start) return fmt::format("day {:.2f}", days);
  return base::format_timestamp(base::time_after(*start, std::round(days * 86400.0) / 86400.0));
}

double recharge_cm(const profiles::IntervalBalance& b) {
  return b.plane_flux_cm.empty() ? 0.0 : b.plane_flux_cm.front();
}

std::string plane_label(const profiles::RunRecord& record) {
  return record.flux_plane_depths_cm.empty()
             ? std::string("recharge plane")
             : fmt::format("drainage at {} cm", number(record.flux_plane_depths_cm.front()));
}

ReportTable visit_balance_table(const profiles::RunRecord& record, const SensorCheck* sensors) {
  const DarcyCheck* darcy = sensors && sensors->darcy ? &*sensors->darcy : nullptr;
  ReportTable table;
  table.title =
      "Water balance per visit interval [mm] (fluxes positive downward; evaporation, transpiration, runoff positive "
      "leaving)";
  table.headers = {"from",
                   "to",
                   "rain + irrigation [mm]",
                   "runoff [mm]",
                   "evaporation [mm]",
                   "transpiration [mm]",
                   "storage change [mm]",
                   fmt::format("{} [mm]", plane_label(record)),
                   "bottom flux [mm]",
                   "balance error [mm]"};
  if (darcy) {
    table.headers.push_back(fmt::format("Darcy {}-{} [mm]", darcy->upper_name, darcy->lower_name));
    table.headers.push_back("model and Darcy");
  }
  const WaterTableCheck* water_table = sensors && sensors->water_table ? &*sensors->water_table : nullptr;
  if (water_table) {
    table.headers.push_back(fmt::format("water table {} [mm]", water_table->well));
    table.headers.push_back("model and water table");
  }
  const StorageCheck* storage =
      sensors && sensors->storage && sensors->storage->usable() ? &*sensors->storage : nullptr;
  if (storage) {
    table.headers.push_back(fmt::format("observed storage change {} [mm]", depth_range(*storage)));
    table.headers.push_back(fmt::format("simulated storage change {} [mm]", depth_range(*storage)));
  }
  for (std::size_t i = 0; i < record.visit_balance.size(); ++i) {
    const auto& b = record.visit_balance[i];
    std::vector<std::string> row({date_after(record.run_start_date, b.start_day),
                                  date_after(record.run_start_date, b.end_day), mm(b.water_input_cm), mm(b.runoff_cm),
                                  mm(b.actual_evaporation_cm), mm(b.transpiration_cm),
                                  mm(b.storage_change_cm + b.ponded_change_cm), mm(recharge_cm(b)),
                                  mm(b.bottom_flux_cm), fmt::format("{:.4f}", b.balance_error_change_cm * kMmPerCm)});
    if (darcy) {
      const DarcyInterval* d = i < darcy->intervals.size() ? &darcy->intervals[i] : nullptr;
      row.push_back(d && d->estimate_cm ? mm(*d->estimate_cm) : "");
      row.push_back(!d || !d->estimate_cm ? "no estimate" : d->disagree ? "differ" : "agree");
    }
    if (water_table) {
      const EstimateInterval* w = i < water_table->intervals.size() ? &water_table->intervals[i] : nullptr;
      row.push_back(w && w->estimate_cm ? mm(*w->estimate_cm) : "");
      row.push_back(!w || !w->estimate_cm ? "no estimate" : w->disagree ? "differ" : "agree");
    }
    if (storage) {
      const StorageInterval* s = i < storage->intervals.size() ? &storage->intervals[i] : nullptr;
      row.push_back(s && s->observed_change_cm ? mm(*s->observed_change_cm) : "");
      row.push_back(s && s->simulated_change_cm ? mm(*s->simulated_change_cm) : "");
    }
    table.add_row(std::move(row));
  }
  return table;
}

ReportTable sensor_metrics_table(const SensorCheck& sensors) {
  ReportTable table;
  table.title = "Fit metrics per sensor and pooled";
  table.headers = {"sensor",
                   "depth [cm]",
                   "quantity",
                   "unit",
                   "readings used",
                   "left out beyond working limit",
                   "left out outside run",
                   "left out outside cell centres",
                   "bias [see unit]",
                   "RMSE [see unit]",
                   "NSE [1]",
                   "KGE [1]"};
  auto add = [&](const SensorFitRow& r) {
    auto plain = [](double v) { return std::isnan(v) ? std::string("") : fmt::format("{:.6g}", v); };
    table.add_row({r.name, std::isnan(r.depth_cm) ? std::string("") : number(r.depth_cm), r.quantity, r.unit,
                   fmt::format("{}", r.metrics.count), fmt::format("{}", r.beyond_working_limit),
                   fmt::format("{}", r.outside_run), fmt::format("{}", r.outside_depth), plain(r.metrics.bias),
                   plain(r.metrics.root_mean_square_error), plain(r.metrics.nash_sutcliffe),
                   plain(r.metrics.kling_gupta)});
  };
  for (const auto& r : sensors.sensors) add(r);
  for (const auto& r : sensors.pooled) add(r);
  return table;
}

}  // namespace wetfront::site
