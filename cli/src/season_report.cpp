#include "season_report.hpp"

#include "sensor_report.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "wetfront/base/time_point.hpp"
#include "wetfront/profiles/visit_balance.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

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

ReportTable season_table(const profiles::RunRecord& record, const profiles::IntervalBalance& total) {
  ReportTable table;
  table.title =
      fmt::format("Season water balance, {} to {} ({:.1f} d)", date_after(record.run_start_date, total.start_day),
                  date_after(record.run_start_date, total.end_day), total.end_day - total.start_day);
  table.headers = {"term", "amount [mm]", "meaning"};
  const double storage_change = total.storage_change_cm + total.ponded_change_cm;
  table.add_row({"rain + irrigation", mm(total.water_input_cm), "water reaching the surface"});
  table.add_row({"runoff", mm(total.runoff_cm), "left the plot over the surface"});
  table.add_row({"evaporation", mm(total.actual_evaporation_cm),
                 fmt::format("left through the soil surface (potential {})", mm(total.potential_evaporation_cm))});
  table.add_row({"transpiration", mm(total.transpiration_cm), "taken up by roots"});
  table.add_row({"storage change", mm(storage_change), "soil water and ponded water, end minus start"});
  table.add_row({plane_label(record), mm(recharge_cm(total)), "recharge estimate: net downward flux across the plane"});
  table.add_row({"bottom flux", mm(total.bottom_flux_cm), "net downward flux out of the column bottom"});
  table.add_row({"balance error", fmt::format("{:.4f}", total.balance_error_change_cm * kMmPerCm),
                 "storage change - (infiltration - transpiration - bottom flux)"});
  return table;
}

}  // namespace

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

std::string season_report(const profiles::RunRecord& record, const std::vector<std::string>& notes,
                          const SensorCheck* sensors) {
  const auto& run = record.run;
  std::string out;
  out += fmt::format("Site: {}\n", record.site_name);
  out += fmt::format("Run start: {}   program: wetfront {}   inputs: {}\n", record.run_start_date,
                     record.program_version, record.input_hash);
  out += fmt::format("Column: {} cells to {} cm; {} layers; {} sensors\n", run.cell_depths_cm.size(),
                     run.face_depths_cm.empty() ? 0.0 : run.face_depths_cm.back(), record.layers.size(),
                     record.sensors.size());
  if (!run.complete) {
    out +=
        "\nRUN INCOMPLETE: the solver stopped before the end of the period; the results below cover only the time "
        "reached.\n";
    if (run.failure) {
      out += fmt::format("  stopped at {} (day {:.4f}), near {} cm: {}\n",
                         date_after(record.run_start_date, run.failure->time_days), run.failure->time_days,
                         number(run.failure->depth_cm), run.failure->reason);
    }
  }
  out +=
      "\nUnits and signs: amounts in mm of water over the plot. Fluxes are positive downward (infiltration,\n"
      "drainage, recharge); a negative flux is upward (capillary rise). Evaporation, transpiration and\n"
      "runoff are positive amounts leaving the soil. Depths are below the soil surface.\n\n";
  if (run.balances.size() >= 2) {
    const auto total = profiles::season_total(run.balances);
    out += format_table(season_table(record, total));
    const double throughflow = std::abs(total.water_input_cm) + std::abs(total.actual_evaporation_cm) +
                               std::abs(total.transpiration_cm) + std::abs(total.bottom_flux_cm);
    if (throughflow > 0) {
      out += fmt::format("Balance error relative to the water moved: {:.2e}\n",
                         std::abs(total.balance_error_change_cm) / throughflow);
    }
    out += "\n";
    out += format_table(visit_balance_table(record, sensors));
    out += "\n";
    if (sensors) out += sensor_section(*sensors);
    if (sensors && sensors->water_table) out += water_table_section(*sensors->water_table);
    if (sensors && sensors->storage) out += storage_section(*sensors->storage);
  } else {
    out += "No water balance: the run did not reach its first output time.\n\n";
  }
  const auto& s = run.statistics;
  out += fmt::format(
      "Solver: {} steps, {} residual evaluations, {} Jacobians, {} Newton iterations, {} Newton failures,\n"
      "        {} error-test failures, {} surface switches (flux / ponded / dry limit), {} bottom switches\n",
      s.steps, s.residual_evaluations, s.jacobian_evaluations, s.nonlinear_iterations, s.nonlinear_failures,
      s.error_test_failures, s.surface_switches, s.bottom_switches);
  if (!notes.empty()) {
    out += "\nNotes on the inputs:\n";
    for (const auto& note : notes) out += fmt::format("  - {}\n", note);
  }
  out +=
      "\nCautions:\n"
      "  - The model is one-dimensional: water moves only vertically; lateral flow, slopes and\n"
      "    neighbouring land are not represented.\n"
      "  - No preferential flow (cracks, root channels, worm holes), no hysteresis of the retention\n"
      "    curve, no freezing or thawing, no solute or heat transport.\n"
      "  - Every number here is an estimate that depends on the soil parameters, the field records\n"
      "    and the crop description; check it against the sensor readings before relying on it.\n"
      "  - Decisions on water use, recharge or abstraction rest with local regulations and\n"
      "    licensed professionals, not with this program.\n";
  return out;
}

}  // namespace wetfront::cli
