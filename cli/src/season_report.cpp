#include "season_report.hpp"

#include <cmath>

#include <fmt/format.h>

#include "sensor_report.hpp"
#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/site/season_tables.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

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
