// `wetfront soil permeameter FILE`: field-saturated conductivity from a constant-head well
// permeameter (see field_analysis.hpp and soils/well_permeameter.hpp).
#include <memory>

#include <fmt/format.h>

#include "command_output.hpp"
#include "wetfront/site/field_analysis.hpp"
#include "soil_commands.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive

void add_permeameter_command(CLI::App& soil) {
  struct Options {
    PermeameterInputs inputs;
    std::string csv_path;
    bool force = false;
  };
  auto options = std::make_shared<Options>();
  CLI::App* cmd = soil.add_subcommand(
      "permeameter",
      "Field-saturated conductivity from constant-head well permeameter readings at one or two water depths");
  cmd->add_option("FILE", options->inputs.file,
                  "CSV with columns 'water depth [cm]', 'time [min]', 'water level [cm]', 'steady' (yes/no)")
      ->required();
  cmd->add_option("--well-radius", options->inputs.well_radius, "radius of the auger hole, with unit (e.g. \"3 cm\")")
      ->required();
  cmd->add_option("--reservoir-area", options->inputs.reservoir_area,
                  "inner cross-section of the reservoir the levels are read on, with unit (e.g. \"35.4 cm2\")")
      ->required();
  cmd->add_option("--soil", options->inputs.soil_category,
                  "soil category for alpha* and the shape factor: compacted-clay, fine-unstructured, structured, "
                  "coarse-sand, highly-structured")
      ->capture_default_str();
  cmd->add_flag("--single-head", options->inputs.single_head_only,
                "with two water depths, average the single-head results instead of solving the two-head equations");
  cmd->add_option("--max-drift", options->inputs.tolerances.max_relative_drift,
                  "largest accepted change of fall rate between the halves of the steady readings, as a fraction")
      ->capture_default_str();
  cmd->add_option("--max-scatter", options->inputs.tolerances.max_relative_scatter,
                  "largest accepted scatter about the fitted line, as a fraction of the level fall")
      ->capture_default_str();
  cmd->add_option("--csv", options->csv_path, "also write the results table to this CSV file");
  add_force_flag(cmd, options->force);
  cmd->footer(
      "Example:\n"
      "  wetfront soil permeameter examples/soil-data/well-permeameter.csv --well-radius \"3 cm\" \\\n"
      "      --reservoir-area \"35.4 cm2\" --soil structured --csv kfs.csv");
  cmd->callback([options, cmd] {
    const auto guard = guard_outputs(*cmd, {options->csv_path}, options->force);
    const FieldReport report = analyse_permeameter(options->inputs);
    emit_report(report.tables, report.warnings, options->csv_path);
    fmt::print("\nField-saturated conductivity: {} cm/d ({})\n", number(report.saturated_conductivity_cm_per_d),
               report.provenance);
  });
}

}  // namespace wetfront::cli
