#include "season_report.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "wetfront/forcing/time_axis.hpp"
#include "wetfront/profiles/visit_balance.hpp"

namespace wetfront::cli {
namespace {

constexpr double mm_per_cm = 10.0;

std::string date_after(const std::string& run_start, double days) {
  const auto start = forcing::parse_timestamp(run_start);
  if (!start) return fmt::format("day {:.2f}", days);
  return forcing::format_timestamp(forcing::time_after(*start, std::round(days * 86400.0) / 86400.0));
}

std::string mm(double cm) { return fmt::format("{:.1f}", cm * mm_per_cm); }

double recharge_cm(const profiles::IntervalBalance& b) { return b.plane_flux_cm.empty() ? 0.0 : b.plane_flux_cm.front(); }

std::string plane_label(const profiles::RunRecord& record) {
  return record.flux_plane_depths_cm.empty() ? std::string("recharge plane")
                                             : fmt::format("drainage at {} cm", number(record.flux_plane_depths_cm.front()));
}

ReportTable season_table(const profiles::RunRecord& record, const profiles::IntervalBalance& total) {
  ReportTable table;
  table.title = fmt::format("Season water balance, {} to {} ({:.1f} d)", date_after(record.run_start_date, total.start_day),
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
  table.add_row({"balance error", fmt::format("{:.4f}", total.balance_error_change_cm * mm_per_cm),
                 "storage change - (infiltration - transpiration - bottom flux)"});
  return table;
}

std::string depth_range(const StorageCheck& storage) {
  return fmt::format("{}-{} cm", number(storage.depths_cm.front()), number(storage.depths_cm.back()));
}

}  // namespace

ReportTable visit_balance_table(const profiles::RunRecord& record, const SensorCheck* sensors) {
  const DarcyCheck* darcy = sensors && sensors->darcy ? &*sensors->darcy : nullptr;
  ReportTable table;
  table.title = "Water balance per visit interval [mm] (fluxes positive downward; evaporation, transpiration, runoff positive leaving)";
  table.headers = {"from",           "to",           "rain + irrigation [mm]", "runoff [mm]",
                   "evaporation [mm]", "transpiration [mm]", "storage change [mm]",
                   fmt::format("{} [mm]", plane_label(record)), "bottom flux [mm]", "balance error [mm]"};
  if (darcy) {
    table.headers.push_back(fmt::format("Darcy {}-{} [mm]", darcy->upper_name, darcy->lower_name));
    table.headers.push_back("model and Darcy");
  }
  const StorageCheck* storage = sensors && sensors->storage && sensors->storage->usable() ? &*sensors->storage : nullptr;
  if (storage) {
    table.headers.push_back(fmt::format("observed storage change {} [mm]", depth_range(*storage)));
    table.headers.push_back(fmt::format("simulated storage change {} [mm]", depth_range(*storage)));
  }
  for (std::size_t i = 0; i < record.visit_balance.size(); ++i) {
    const auto& b = record.visit_balance[i];
    std::vector<std::string> row({date_after(record.run_start_date, b.start_day), date_after(record.run_start_date, b.end_day),
                   mm(b.water_input_cm), mm(b.runoff_cm), mm(b.actual_evaporation_cm), mm(b.transpiration_cm),
                   mm(b.storage_change_cm + b.ponded_change_cm), mm(recharge_cm(b)), mm(b.bottom_flux_cm),
                   fmt::format("{:.4f}", b.balance_error_change_cm * mm_per_cm)});
    if (darcy) {
      const DarcyInterval* d = i < darcy->intervals.size() ? &darcy->intervals[i] : nullptr;
      row.push_back(d && d->darcy_cm ? mm(*d->darcy_cm) : "");
      row.push_back(!d || !d->darcy_cm ? "no estimate" : d->disagree ? "differ" : "agree");
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

std::string sensor_section(const SensorCheck& sensors) {
  std::string out = "Sensors against the model\n";
  if (sensors.sensors.empty()) return out + "  no sensor readings inside the run\n\n";
  out += "  Simulated values at each reading's time and depth (reading times are solver output times; linear in depth\n"
         "  between cell centres). Bias = mean(model - reading): positive means the model is wetter (higher head) or\n"
         "  holds more water. Heads in cm of water at the cup; water content in cm3/cm3.\n";
  ReportTable table;
  table.headers = {"sensor", "depth [cm]", "quantity [unit]", "used", "left out", "bias", "RMSE", "NSE", "KGE"};
  auto value = [](double v, int digits) { return std::isnan(v) ? std::string("n/a") : fmt::format("{:.{}f}", v, digits); };
  auto add = [&](const SensorFitRow& r) {
    const int digits = r.unit == "cm" ? 1 : 3;
    table.add_row({r.name, std::isnan(r.depth_cm) ? std::string("") : number(r.depth_cm),
                   fmt::format("{} [{}]", r.quantity, r.unit), fmt::format("{}", r.metrics.count),
                   fmt::format("{}", r.beyond_working_limit + r.outside_run), value(r.metrics.bias, digits),
                   value(r.metrics.root_mean_square_error, digits), value(r.metrics.nash_sutcliffe, 2),
                   value(r.metrics.kling_gupta, 2)});
  };
  for (const auto& r : sensors.sensors) add(r);
  for (const auto& r : sensors.pooled) add(r);
  out += format_table(table);
  int limit = 0, outside = 0;
  for (const auto& r : sensors.pooled) {
    if (r.unit == "cm") limit += r.beyond_working_limit;
    outside += r.outside_run;
  }
  out += fmt::format("  Left out: {} tensiometer reading(s) beyond the working limit (the water column cavitates at high tension,\n"
                     "  so the reading no longer gives the soil's head); {} reading(s) outside the time the run covers.\n",
                     limit, outside);
  out += "  Pooled rows combine all sensors of one kind; heads and water contents are never pooled together.\n"
         "  NSE and KGE are n/a where the readings have no spread.\n";
  if (sensors.darcy) {
    const auto& d = *sensors.darcy;
    out += fmt::format("\n  Recharge from tensiometers {} ({} cm) and {} ({} cm) by Darcy's law, per visit interval, beside the\n"
                       "  model's drainage;\n  {}.\n  Readings within {} d of a visit count as read at it. Estimates "
                       "differ when their signs differ or one\n  exceeds the other by more than a factor of {} "
                       "(both below {} mm agree). See the visit table for every interval.\n",
                       d.upper_name, number(d.upper_depth_cm), d.lower_name, number(d.lower_depth_cm), d.soil_note,
                       kVisitReadingWindowDays, kAgreementFactor, kNegligibleRechargeCm * mm_per_cm);
    double model = 0, darcy = 0;
    int estimated = 0, differ = 0;
    std::vector<std::string> reasons;
    for (const auto& i : d.intervals) {
      if (!i.darcy_cm) continue;
      ++estimated;
      model += i.model_cm;
      darcy += *i.darcy_cm;
      if (i.disagree) {
        ++differ;
        for (const auto& reason : i.reasons) {
          if (std::find(reasons.begin(), reasons.end(), reason) == reasons.end()) reasons.push_back(reason);
        }
      }
    }
    out += fmt::format("  Intervals with an estimate: {} of {}; over them the model drained {} mm, Darcy gives {} mm;\n"
                       "  they differ in {} interval(s).\n", estimated, d.intervals.size(), mm(model), mm(darcy), differ);
    if (!reasons.empty()) {
      out += "  Where they differ, consider:\n";
      for (const auto& reason : reasons) out += fmt::format("    - {}\n", reason);
    }
  }
  return out + "\n";
}

std::string storage_section(const StorageCheck& storage) {
  std::string out = "Stored water over the probe depths\n";
  if (!storage.usable()) {
    const std::string has = storage.depths_cm.empty()
                                ? std::string("has none")
                                : fmt::format("has them at one depth only ({} cm)", number(storage.depths_cm.front()));
    return out + fmt::format("  The comparison needs water-content probes at two or more depths; this site {}.\n\n", has);
  }
  out += fmt::format("  Water stored between {} and {} cm (probes {}, at {} cm), in mm: the trapezoidal rule\n"
                     "  over the probe depths, from the readings and from the model at the same depths and times.\n"
                     "  Readings within {} d of a visit count as read at it; nothing is counted above the shallowest or\n"
                     "  below the deepest probe.\n",
                     number(storage.depths_cm.front()), number(storage.depths_cm.back()), fmt::join(storage.probe_names, ", "),
                     fmt::join(storage.depths_cm, ", "), kVisitReadingWindowDays);
  int both = 0;
  double observed = 0, simulated = 0;
  for (const auto& v : storage.visits) {
    if (!v.observed_cm || !v.simulated_cm) continue;
    ++both;
    observed += *v.observed_cm;
    simulated += *v.simulated_cm;
  }
  out += fmt::format("  Visits (with the run start and end) with a reading at every depth: {} of {}.\n", both, storage.visits.size());
  if (both > 0) {
    out += fmt::format("  Mean stored water at those visits: readings {} mm, model {} mm (model minus readings {} mm).\n",
                       mm(observed / both), mm(simulated / both), mm((simulated - observed) / both));
  }
  int intervals = 0;
  double observed_change = 0, simulated_change = 0;
  for (const auto& i : storage.intervals) {
    if (!i.observed_change_cm || !i.simulated_change_cm) continue;
    ++intervals;
    observed_change += *i.observed_change_cm;
    simulated_change += *i.simulated_change_cm;
  }
  out += fmt::format("  Intervals with a change from both: {} of {}; the changes summed over them: readings {} mm,\n"
                     "  model {} mm (positive: water gained). The storage change columns of the visit table give every\n"
                     "  interval.\n\n",
                     intervals, storage.intervals.size(), mm(observed_change), mm(simulated_change));
  return out;
}

std::string season_report(const profiles::RunRecord& record, const std::vector<std::string>& notes, const SensorCheck* sensors) {
  const auto& run = record.run;
  std::string out;
  out += fmt::format("Site: {}\n", record.site_name);
  out += fmt::format("Run start: {}   program: wetfront {}   inputs: {}\n", record.run_start_date, record.program_version,
                     record.input_hash);
  out += fmt::format("Column: {} cells to {} cm; {} layers; {} sensors\n", run.cell_depths_cm.size(),
                     run.face_depths_cm.empty() ? 0.0 : run.face_depths_cm.back(), record.layers.size(), record.sensors.size());
  if (!run.complete) {
    out += "\nRUN INCOMPLETE: the solver stopped before the end of the period; the results below cover only the time reached.\n";
    if (run.failure) {
      out += fmt::format("  stopped at {} (day {:.4f}), near {} cm: {}\n", date_after(record.run_start_date, run.failure->time_days),
                         run.failure->time_days, number(run.failure->depth_cm), run.failure->reason);
    }
  }
  out += "\nUnits and signs: amounts in mm of water over the plot. Fluxes are positive downward (infiltration,\n"
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
  out += "\nCautions:\n"
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
