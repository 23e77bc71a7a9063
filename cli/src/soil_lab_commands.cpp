// `wetfront soil cores` and `wetfront soil retention`: laboratory core data and the van
// Genuchten retention fit (wetfront/soils/core_samples.hpp, retention_fit.hpp).
#include <memory>

#include <fmt/format.h>

#include "command_output.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"
#include "wetfront/site/lab_analysis.hpp"
#include "soil_commands.hpp"
#include "wetfront/soils/core_samples.hpp"
#include "wetfront/soils/lab_csv.hpp"

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
        const auto cores = soils::read_core_samples_csv(options->inputs.cores_file);
        ReportTable table;
        table.title = fmt::format("Ring samples of {} (particle density {} g/cm3 for porosity, common practice)",
                                  options->inputs.cores_file, soils::kMineralParticleDensity_g_per_cm3);
        table.headers = {"sample", "water content [cm3/cm3]", "water content [g/g]", "dry bulk density [g/cm3]",
                         "porosity [cm3/cm3]"};
        for (const auto& core : cores) {
          const auto p = soils::core_properties(core);
          table.add_row({core.name, number(p.volumetric_water_content), number(p.gravimetric_water_content_g_per_g),
                         number(p.dry_bulk_density_g_per_cm3), number(soils::porosity(p.dry_bulk_density_g_per_cm3))});
        }
        std::vector<ReportTable> tables = {table};
        if (!options->inputs.steps_file.empty()) {
          std::vector<soils::RetentionSeries> series;
          try {
            series = soils::retention_from_cores(cores, soils::read_suction_steps_csv(options->inputs.steps_file));
          } catch (const base::InputError& error) {
            throw base::InputError(options->inputs.steps_file, 0, "sample", error.what());
          }
          ReportTable points;
          points.title = fmt::format("Retention points from the suction steps of {}", options->inputs.steps_file);
          points.headers = {"sample", "suction [cm]", "suction [kPa]", "water content [cm3/cm3]"};
          for (const auto& s : series) {
            for (const auto& point : s.points) {
              points.add_row({s.sample, number(point.suction_cm),
                              number(point.suction_cm / base::kCentimetresOfWaterPerKilopascal),
                              number(point.water_content)});
            }
          }
          tables.push_back(points);
        }
        emit_report(tables, {}, options->csv_path);
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
