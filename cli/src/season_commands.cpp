#include "season_commands.hpp"

#include <chrono>
#include <cstdio>
#include <future>
#include <memory>
#include <optional>
#include <variant>

#include <fmt/format.h>

#include "wetfront/site/adjustable_parameters.hpp"
#include "command_output.hpp"
#include "exit_codes.hpp"
#include "wetfront/base/input_error.hpp"
#include "parameter_report.hpp"
#include "wetfront/site/report_table.hpp"
#include "season_report.hpp"
#include "wetfront/site/grid_check.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/site/run_season.hpp"
#include "wetfront/site/season_files.hpp"
#include "wetfront/site/season_tables.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/sensor_check.hpp"
#include "sensor_report.hpp"
#include "wetfront/site/site_file.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/soils/model_parameters.hpp"
#include "wetfront/soils/texture_classes.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

// Runs the solver on a worker thread, each profile to `observe`; prints a progress line on stderr
// once it has taken longer than a second.
solver::ColumnRun simulate_with_progress(const solver::ColumnProblem& problem, const solver::OutputObserver& observe,
                                         bool quiet, const std::string& label) {
  const auto started = std::chrono::steady_clock::now();
  auto future = std::async(std::launch::async, [&] { return solver::simulate(problem, observe); });
  bool printed = false;
  while (future.wait_for(std::chrono::milliseconds(1000)) != std::future_status::ready) {
    if (quiet) continue;
    const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count();
    fmt::print(stderr, "\rwetfront: simulating {} ... {:.0f} s", label, seconds);
    std::fflush(stderr);
    printed = true;
  }
  if (printed) fmt::print(stderr, "\n");
  return future.get();
}

// "van Genuchten-Mualem: theta_r 0.05 ... Ks 25 cm/d l 0.5": the model's parameters as
// model_parameters.hpp lists them, with the unit where it is not a fraction or a pure number.
std::string layer_text(const soils::SoilLayer& layer) {
  std::string text(soils::model_name(layer.model));
  std::string_view separator = ":";
  for (const auto& p : soils::model_parameters(layer.model)) {
    text += fmt::format("{} {} {}", separator, p.symbol, number(*soils::parameter_value(layer.model, p.key)));
    if (p.unit != "cm3/cm3" && p.unit != "1") text += fmt::format(" {}", p.unit);
    separator = "";
  }
  return text;
}

std::string resolved_setup(const Season& season) {
  const SiteSetup& s = season.site;
  std::string out;
  out += fmt::format("Site file: {}\nSite: {}\n", s.site_file.string(), s.name);
  if (!s.location.empty()) out += fmt::format("Location: {}\n", s.location);
  if (!s.description.empty()) out += fmt::format("Description: {}\n", s.description);
  out += fmt::format("Period: {} to {} ({} d), output every {} d, {} output times\n", s.run_start_text, s.run_end_text,
                     number(s.run_length_days), number(s.output_interval_days), season.problem.output_days.size());
  out += fmt::format("Visits: {}\n",
                     s.visit_dates.empty() ? std::string("none") : fmt::format("{}", fmt::join(s.visit_dates, ", ")));
  out += "Layers (depths in cm):\n";
  for (const auto& layer : s.layers) {
    out += fmt::format("  {:>6} - {:<6} {}: {}\n", number(layer.top_depth_cm), number(layer.bottom_depth_cm),
                       layer.name, layer_text(layer));
  }
  const auto& grid = season.problem.grid;
  double thinnest = 1e300, thickest = 0;
  for (std::size_t i = 0; i < grid.cell_count(); ++i) {
    thinnest = std::min(thinnest, grid.cell_thickness_cm(i));
    thickest = std::max(thickest, grid.cell_thickness_cm(i));
  }
  out += fmt::format("Grid: {} cells, {} to {} cm thick, faces kept at {} cm\n", grid.cell_count(), number(thinnest),
                     number(thickest), fmt::join(s.grid.required_face_depths_cm, ", "));
  out += fmt::format("Initial state: {}\nBottom: {}\n", s.initial_text, s.bottom_text);
  out += fmt::format("Surface: dry limit {} cm, ponding up to {} cm before runoff\n", number(s.dry_limit_head_cm),
                     number(s.max_ponded_depth_cm));
  out += fmt::format("Rain: {} ({} mm)\n", s.rain.path.string(), number(season.totals.rain_cm * 10));
  if (s.irrigation)
    out +=
        fmt::format("Irrigation: {} ({} mm)\n", s.irrigation->path.string(), number(season.totals.irrigation_cm * 10));
  out += fmt::format("Pan: {} ({} mm Class A pan evaporation), pan coefficient Kp {}\n",
                     (s.pan.readings ? s.pan.readings->path : s.pan.daily_evaporation->path).string(),
                     number(season.totals.pan_evaporation_cm * 10), number(season.pan_coefficient, 3));
  const auto& c = s.crop.kc_curve;
  out +=
      fmt::format("Crop: {}, planted day {}, stages {} / {} / {} / {} d, Kc {} / {} / {}, bare soil {}\n", s.crop.name,
                  number(c.planting_day), number(c.stages.initial_days), number(c.stages.development_days),
                  number(c.stages.mid_season_days), number(c.stages.late_season_days), number(c.kc_initial),
                  number(c.kc_mid), number(c.kc_end), number(c.kc_bare_soil));
  out += fmt::format("Potential transpiration over the run: {} mm ({})\n",
                     number(season.totals.potential_transpiration_cm * 10),
                     season.roots_simulated ? "taken up by roots where the soil allows"
                                            : "NOT taken from the soil: root uptake is not simulated in this version");
  out += "Sensors:\n";
  if (s.sensors.empty()) out += "  none\n";
  for (const auto& sensor : s.sensors) {
    // Wells and core samples have no fixed depth: each reading carries its own.
    const bool fixed_depth = sensor.kind == kTensiometer || sensor.kind == kWaterContentProbe;
    const std::string where = fixed_depth ? fmt::format(" at {} cm", number(sensor.depth_cm))
                              : sensor.kind == kObservationWell
                                  ? fmt::format(", specific yield {}", number(sensor.specific_yield))
                                  : std::string();
    out += fmt::format("  {} ({}){}: {}\n", sensor.name, sensor.kind, where, sensor.readings.string());
  }
  out += fmt::format("Recharge plane: {} cm\n", number(s.recharge_plane_depth_cm));
  out += fmt::format("Solver: relative tolerance {}, storage tolerance {} cm, max step {} d\n",
                     s.settings.relative_tolerance, s.settings.absolute_tolerance_storage_cm,
                     number(s.settings.max_step_days));
  for (const auto& note : season.notes) out += fmt::format("note: {}\n", note);
  return out;
}

std::vector<std::string> season_notes(const Season& season) {
  std::vector<std::string> notes = season.notes;
  if (!season.roots_simulated) {
    notes.push_back(
        fmt::format("root water uptake is not simulated in this version: the {} mm of potential transpiration "
                    "were not taken from the soil, so drainage is overestimated",
                    number(season.totals.potential_transpiration_cm * 10)));
  }
  return notes;
}

// The refinement check's section of the report.
std::string grid_check_text(const GridCheck& check) {
  std::string out = fmt::format("\nGrid check: the season again with every cell cut in two ({} cells instead of {})\n",
                                check.finer_cells, check.cells);
  if (!check.finer_complete) {
    out += fmt::format("  the finer run did not finish: {}\n", check.finer_failure);
  } else {
    out +=
        fmt::format("  season recharge {} mm on this grid, {} mm on the finer one: change {:+.2f} % (limit {} %){}\n",
                    number(check.recharge_cm * 10), number(check.finer_recharge_cm * 10), 100 * check.recharge_change,
                    number(100 * kGridRechargeLimit), check.recharge_too_coarse ? "  TOO COARSE" : "");
    for (const auto& s : check.sensors) {
      const double limit = s.quantity == "pressure head" ? kGridHeadLimitCm : kGridWaterContentLimit;
      out += fmt::format("  {:<24} {:<14} change RMS {} {}, largest {} {} over {} readings (limit {} {} RMS){}\n",
                         s.name, s.quantity, number(s.rms_change), s.unit, number(s.largest_change), s.unit, s.readings,
                         number(limit), s.unit, s.too_coarse ? "  TOO COARSE" : "");
    }
  }
  out += check.too_coarse()
             ? "  The grid is too coarse for these results: set smaller cells in [grid] (surface_cell, max_cell) and "
               "run again.\n"
             : "  The grid is fine enough: halving the cells changes none of these beyond its limit.\n";
  return out;
}

// What `run` and `check` read: the site file, the period (--from, --to) and whether to check the grid.
struct SeasonOptions {
  std::string site;
  std::string from;
  std::string to;
  bool grid_check = false;
};

SiteSetup load_site(const SeasonOptions& o) { return load_site_file(o.site, {o.from, o.to}); }

void add_run_command(CLI::App& app) {
  struct Options : SeasonOptions {
    std::string out;
    bool quiet = false;
    bool force = false;
  };
  auto options = std::make_shared<Options>();
  CLI::App* cmd = app.add_subcommand("run", "Simulate the season at a site and report its water balance");
  cmd->add_option("SITE", options->site, "site file (TOML); see docs/site-file.md")->required();
  cmd->add_option("--out", options->out, "HDF5 run file to write (default: the site file's name with .h5)");
  cmd->add_option("--from", options->from, "start the run on this date instead (YYYY-MM-DD)");
  cmd->add_option("--to", options->to, "end the run on this date instead (YYYY-MM-DD)");
  cmd->add_flag("--quiet", options->quiet, "print only errors; no report and no progress line");
  cmd->add_flag("--grid-check", options->grid_check,
                "also run the season on cells of half the size and report how much recharge and the simulated sensor "
                "values change");
  cmd->add_flag("--force", options->force,
                "replace output files that wetfront did not write (files the run reads are never replaced)");
  cmd->footer(
      "Writes the run file and, next to it, NAME-visits.csv with the balance per visit interval and, with\n"
      "sensor readings, NAME-sensors.csv with the fit metrics per sensor.\n"
      "Exit codes: 0 done, 1 bad input (nothing written), 2 solver failure (partial run file marked incomplete).\n"
      "Example:\n  wetfront run examples/demo/site.toml --out season.h5");
  cmd->callback([options] {
    const std::filesystem::path site_file = options->site;
    SiteSetup site = load_site(*options);
    const SeasonFiles files =
        options->out.empty() ? default_season_files(site_file) : season_files(std::filesystem::path(options->out));
    const std::filesystem::path& out = files.run_file;
    // Before any work: the folder, the files read, files of other programs, another writer.
    const OutputGuard guard({.outputs = {out, files.visits_csv, files.sensors_csv},
                             .inputs = site_input_files(site),
                             .force = options->force});
    Season season = prepare_season(std::move(site));
    const SiteSetup site_setup = season.site;
    const std::string label = fmt::format("{} to {}", site_setup.run_start_text, site_setup.run_end_text);
    const auto started = std::chrono::steady_clock::now();
    double seconds = 0;
    std::optional<GridCheck> grid;
    const WrittenSeason written = run_season_to_files(
        std::move(season), files, WETFRONT_VERSION,
        [&](const solver::ColumnProblem& problem, const solver::OutputObserver& observe) {
          return simulate_with_progress(problem, observe, options->quiet, label);
        },
        [&](const SeasonResult& result) {
          seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count();
          if (options->grid_check && result.complete) grid = check_grid(site_setup, result, WETFRONT_VERSION);
        });
    const SeasonResult& result = written.result;
    const bool complete = result.complete;
    const bool metrics = written.sensor_table;
    const profiles::RunRecord& record = result.record;
    const SensorCheck& sensors = result.sensors;
    if (!options->quiet) {
      fmt::print("{}", season_report(record, season_notes(result.season), &sensors));
      if (grid) fmt::print("{}", grid_check_text(*grid));
      fmt::print("\nRun time {:.2f} s. Wrote {}{} and {}\n", seconds, out.string(),
                 metrics ? fmt::format(", {}", files.visits_csv.string()) : std::string(),
                 (metrics ? files.sensors_csv : files.visits_csv).string());
    }
    if (!complete) {
      const auto& failure = record.run.failure;
      fmt::print(stderr, "error: the solver failed{}; partial results written to {} (marked incomplete)\n",
                 failure ? fmt::format(" at day {:.4f} near {} cm: {}", failure->time_days, number(failure->depth_cm),
                                       failure->reason)
                         : std::string(),
                 out.string());
      throw CLI::RuntimeError(exit_solver_failure);
    }
  });
}

void add_check_command(CLI::App& app) {
  auto options = std::make_shared<SeasonOptions>();
  CLI::App* cmd = app.add_subcommand(
      "check", "Check a site file and its field records, and print the resolved setup without running");
  cmd->add_option("SITE", options->site, "site file (TOML); see docs/site-file.md")->required();
  cmd->add_option("--from", options->from, "check for a run starting on this date instead (YYYY-MM-DD)");
  cmd->add_option("--to", options->to, "check for a run ending on this date instead (YYYY-MM-DD)");
  cmd->add_flag("--grid-check", options->grid_check,
                "run the season on this grid and on cells of half the size (no files written) and report whether the "
                "grid is fine enough");
  cmd->footer(
      "Exit codes: 0 the site is usable, 1 it is not (the message names the file, line and key).\n"
      "Example:\n  wetfront check examples/demo/site.toml");
  cmd->callback([options] {
    const Season season = prepare_season(load_site(*options));
    const ParameterStudy study = load_parameter_study(season.site);
    fmt::print("{}", resolved_setup(season));
    if (!study.parameters.empty()) fmt::print("{}", parameters_text(study));
    fmt::print("Site file is usable.\n");
    if (options->grid_check) {
      const SeasonResult result = run_season(season.site, WETFRONT_VERSION);
      if (!result.complete) {
        fmt::print("Grid check: the season did not finish on this grid{}\n",
                   result.record.run.failure ? ": " + result.record.run.failure->reason : std::string());
        throw CLI::RuntimeError(exit_solver_failure);
      }
      fmt::print("{}", grid_check_text(check_grid(season.site, result, WETFRONT_VERSION)));
    }
  });
}

// The CSV files `run` wrote beside a run file must carry its run id; the user is told of any that
// does not.
void report_foreign_tables(const std::filesystem::path& run_file, const profiles::RunRecord& record) {
  for (const auto& [csv, id] : foreign_tables(season_files(run_file), record)) {
    fmt::print(stderr,
               "warning: {} does not belong to this run file (run id {}, the run file has {}): a run was stopped "
               "while writing or the files come from different runs; run the site again to make a matching set\n",
               csv.string(), id.empty() ? std::string("none") : id, record.run_id);
  }
}

void add_show_command(CLI::App& app) {
  struct Options {
    std::string run_file;
    std::string csv;
    std::string sensors_csv;
    bool force = false;
  };
  auto options = std::make_shared<Options>();
  CLI::App* cmd = app.add_subcommand("show", "Print the report of a finished run again from its HDF5 run file");
  cmd->add_option("RUN", options->run_file, "run file written by `wetfront run`")->required();
  cmd->add_option("--csv", options->csv, "also write the balance per visit interval to this CSV file");
  cmd->add_option("--sensors-csv", options->sensors_csv,
                  "also write the fit metrics per sensor and pooled to this CSV file");
  cmd->add_flag("--force", options->force, "replace CSV files that wetfront did not write (never the run file)");
  cmd->footer("Example:\n  wetfront show examples/demo/site.h5");
  cmd->callback([options] {
    if (!options->csv.empty() && !options->sensors_csv.empty() &&
        std::filesystem::path(options->csv).lexically_normal() ==
            std::filesystem::path(options->sensors_csv).lexically_normal())
      throw base::InputError(options->csv, 0, "", "--csv and --sensors-csv name the same file; give two names");
    const OutputGuard guard(
        {.outputs = {options->csv, options->sensors_csv}, .inputs = {options->run_file}, .force = options->force});
    const StoredRun stored = read_stored_run(options->run_file);
    check_stored_tables(stored, options->sensors_csv);
    fmt::print("{}", season_report(stored.record, {}, stored.sensors ? &*stored.sensors : nullptr));
    report_foreign_tables(options->run_file, stored.record);
    write_stored_tables(stored, options->csv, options->sensors_csv);
  });
}

}  // namespace

void add_season_commands(CLI::App& app) {
  add_run_command(app);
  add_check_command(app);
  add_show_command(app);
}

}  // namespace wetfront::cli
