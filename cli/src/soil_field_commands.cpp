// `wetfront soil permeameter FILE` and `wetfront soil infiltrometer FILE`: saturated
// conductivity from a constant-head well permeameter or a tension disc infiltrometer (see
// field_analysis.hpp, soils/well_permeameter.hpp and soils/tension_infiltrometer.hpp).
#include <memory>
#include <string_view>

#include <fmt/format.h>

#include "command_output.hpp"
#include "soil_commands.hpp"
#include "wetfront/site/field_analysis.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive

namespace {

// --max-drift and --max-scatter: how steady the readings of either field test must be.
void add_steadiness_options(CLI::App& cmd, soils::SteadinessTolerances& tolerances) {
  cmd.add_option("--max-drift", tolerances.max_relative_drift,
                 "largest accepted change of fall rate between the halves of the steady readings, as a fraction")
      ->capture_default_str();
  cmd.add_option("--max-scatter", tolerances.max_relative_scatter,
                 "largest accepted scatter about the fitted line, as a fraction of the level fall")
      ->capture_default_str();
}

// The tables and warnings of a field test, then its conductivity under `label`.
void emit_field_report(const FieldReport& report, std::string_view label, const std::string& csv_path) {
  emit_report(report.tables, report.warnings, csv_path);
  fmt::print("\n{}: {} cm/d ({})\n", label, number(report.saturated_conductivity_cm_per_d), report.provenance);
}

}  // namespace

void add_permeameter_command(CLI::App& soil) {
  auto options = std::make_shared<TableCommandOptions<PermeameterInputs>>();
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
  add_steadiness_options(*cmd, options->inputs.tolerances);
  finish_table_command(cmd, options->csv_path, options->force, "also write the results table to this CSV file",
                       "Example:\n"
                       "  wetfront soil permeameter examples/soil-data/well-permeameter.csv --well-radius \"3 cm\" \\\n"
                       "      --reservoir-area \"35.4 cm2\" --soil structured --csv kfs.csv",
                       [options] {
                         emit_field_report(analyse_permeameter(options->inputs), "Field-saturated conductivity",
                                           options->csv_path);
                       });
}

void add_infiltrometer_command(CLI::App& soil) {
  auto options = std::make_shared<TableCommandOptions<InfiltrometerInputs>>();
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
  add_steadiness_options(*cmd, options->inputs.tolerances);
  finish_table_command(cmd, options->csv_path, options->force, "also write the conductivity table to this CSV file",
                       "Example:\n"
                       "  wetfront soil infiltrometer examples/soil-data/tension-disc.csv --disc-radius \"10 cm\" \\\n"
                       "      --tower-area \"19.6 cm2\" --csv disc.csv",
                       [options] {
                         emit_field_report(analyse_infiltrometer(options->inputs), "Saturated conductivity",
                                           options->csv_path);
                       });
}

}  // namespace wetfront::cli
