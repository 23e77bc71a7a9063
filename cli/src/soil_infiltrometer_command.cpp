// `wetfront soil infiltrometer FILE`: conductivity near saturation from a tension disc
// infiltrometer (see field_analysis.hpp and soils/tension_infiltrometer.hpp).
#include <memory>

#include <fmt/format.h>

#include "command_output.hpp"
#include "wetfront/site/field_analysis.hpp"
#include "soil_commands.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive

void add_infiltrometer_command(CLI::App& soil) {
  struct Options {
    InfiltrometerInputs inputs;
    std::string csv_path;
    bool force = false;
  };
  auto options = std::make_shared<Options>();
  CLI::App* cmd = soil.add_subcommand(
      "infiltrometer",
      "Conductivity near saturation from tension disc infiltrometer readings at two or more supply heads");
  cmd->add_option("FILE", options->inputs.file,
                  "CSV with columns 'supply head [cm]', 'time [min]', 'water level [cm]', 'steady' (yes/no)")
      ->required();
  cmd->add_option("--disc-radius", options->inputs.disc_radius,
                  "radius of the disc membrane, with unit (e.g. \"10 cm\")")
      ->required();
  cmd->add_option("--tower-area", options->inputs.tower_area,
                  "inner cross-section of the water tower the levels are read on, with unit (e.g. \"19.6 cm2\")")
      ->required();
  cmd->add_option("--max-drift", options->inputs.tolerances.max_relative_drift,
                  "largest accepted change of fall rate between the halves of the steady readings, as a fraction")
      ->capture_default_str();
  cmd->add_option("--max-scatter", options->inputs.tolerances.max_relative_scatter,
                  "largest accepted scatter about the fitted line, as a fraction of the level fall")
      ->capture_default_str();
  cmd->add_option("--csv", options->csv_path, "also write the conductivity table to this CSV file");
  add_force_flag(cmd, options->force);
  cmd->footer(
      "Example:\n"
      "  wetfront soil infiltrometer examples/soil-data/tension-disc.csv --disc-radius \"10 cm\" \\\n"
      "      --tower-area \"19.6 cm2\" --csv disc.csv");
  cmd->callback([options, cmd] {
    const auto guard = guard_outputs(*cmd, {options->csv_path}, options->force);
    const FieldReport report = analyse_infiltrometer(options->inputs);
    emit_report(report.tables, report.warnings, options->csv_path);
    fmt::print("\nSaturated conductivity: {} cm/d ({})\n", number(report.saturated_conductivity_cm_per_d),
               report.provenance);
  });
}

}  // namespace wetfront::cli
