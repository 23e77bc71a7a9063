// `wetfront soil cores` and `wetfront soil retention`: laboratory core data and the van
// Genuchten retention fit (wetfront/soils/core_samples.hpp, retention_fit.hpp).
#include <memory>

#include <fmt/format.h>

#include "command_output.hpp"
#include "soil_commands.hpp"
#include "wetfront/site/lab_analysis.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive

void add_cores_command(CLI::App& soil) {
  struct CoreFiles {
    std::string cores_file;
    std::string steps_file;
  };
  auto options = std::make_shared<TableCommandOptions<CoreFiles>>();
  CLI::App* cmd = soil.add_subcommand("cores",
                                      "Water content, bulk density and porosity of ring samples, and their "
                                      "retention points when suction steps were weighed");
  cmd->add_option("FILE", options->inputs.cores_file,
                  "CSV with columns sample, ring_volume_cm3, tare_mass_g, wet_mass_g, oven_dry_mass_g [, note]")
      ->required();
  cmd->add_option("--steps", options->inputs.steps_file,
                  "CSV of equilibrium masses: sample, suction_cm or suction_kPa, wet_mass_g [, note]");
  finish_table_command(
      cmd, options->csv_path, options->force, "also write the last table to this CSV file",
      "Examples:\n  wetfront soil cores examples/soil-data/cores.csv\n"
      "  wetfront soil cores examples/soil-data/cores.csv --steps examples/soil-data/suction-steps.csv --csv "
      "points.csv",
      [options] {
        emit_report(core_tables(options->inputs.cores_file, options->inputs.steps_file), {}, options->csv_path);
      });
}

void add_retention_command(CLI::App& soil) {
  auto options = std::make_shared<TableCommandOptions<RetentionInputs>>();
  CLI::App* cmd = soil.add_subcommand("retention", "Fit the van Genuchten retention curve to measured water contents");
  cmd->add_option("FILE", options->inputs.points_file,
                  "CSV of retention points: suction_cm or suction_kPa, water_content [, sample] [, note]");
  cmd->add_option("--cores", options->inputs.cores_file, "instead of FILE: ring samples (see `wetfront soil cores`)");
  cmd->add_option("--steps", options->inputs.steps_file, "instead of FILE: suction steps weighed on the --cores rings");
  cmd->add_option("--sample", options->inputs.sample, "fit only this sample (default: each sample, then all pooled)");
  cmd->add_option("--fix-residual", options->inputs.fix_residual,
                  "hold the residual water content at this value (e.g. 0.05 or \"5 %\") instead of fitting it");
  finish_table_command(
      cmd, options->csv_path, options->force, "also write the table of fits to this CSV file",
      "Examples:\n  wetfront soil retention examples/soil-data/retention-points.csv\n"
      "  wetfront soil retention --cores examples/soil-data/cores.csv --steps examples/soil-data/suction-steps.csv "
      "--fix-residual 0",
      [options] {
        const RetentionReport report = analyse_retention(options->inputs);
        emit_report(report.tables, report.warnings, options->csv_path);
        const auto& p = report.chosen;
        fmt::print("\nRetention: theta_r = {}, theta_s = {} cm3/cm3, alpha = {} 1/cm, n = {} ({})\n",
                   number(p.residual_water_content), number(p.saturated_water_content), number(p.alpha_per_cm),
                   number(p.n), report.provenance);
      });
}

}  // namespace wetfront::cli
