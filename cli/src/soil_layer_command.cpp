// `wetfront soil layer`: one layer's laboratory and field results combined into the TOML
// block of a site file (wetfront/site/layer_block.hpp), printed or written to --output.
#include <memory>

#include <fmt/format.h>

#include "command_output.hpp"
#include "soil_commands.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/file_save.hpp"
#include "wetfront/site/layer_block.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

struct LayerOptions {
  LayerInputs inputs;
  std::string output_path;
  std::string csv_path;
  bool force = false;
};

void run_layer(const LayerOptions& o) {
  const LayerBlock block = layer_block(o.inputs);
  emit_report(block.tables, block.warnings, o.csv_path);
  if (o.output_path.empty()) {
    fmt::print("\n{}", block.text);
  } else {
    try {
      profiles::StagedFile(o.output_path, block.text).commit();
    } catch (const std::exception& error) {
      throw base::InputError(o.output_path, 0, "",
                             fmt::format("cannot write the layer block (option --output): {}", error.what()));
    }
    fmt::print("\nLayer block written to {}\n", o.output_path);
  }
}

}  // namespace

void add_layer_command(CLI::App& soil) {
  auto o = std::make_shared<LayerOptions>();
  CLI::App* cmd = soil.add_subcommand(
      "layer", "Combine a layer's retention and conductivity results into the TOML layer block of a site file");
  cmd->add_option("--name", o->inputs.name, "layer name, e.g. \"sandy loam topsoil\"")->required();
  cmd->add_option("--top", o->inputs.top, "depth of the layer top, with unit (e.g. \"0 cm\")")->required();
  cmd->add_option("--bottom", o->inputs.bottom, "depth of the layer bottom, with unit (e.g. \"30 cm\")")->required();
  auto* retention = cmd->add_option_group("retention", "where theta_r, theta_s, alpha and n come from");
  retention->add_option("--retention", o->inputs.retention.points_file,
                        "retention points CSV (as `wetfront soil retention`)");
  retention->add_option("--cores", o->inputs.retention.cores_file, "ring samples CSV, with --steps");
  retention->add_option("--steps", o->inputs.retention.steps_file, "suction steps CSV, with --cores");
  retention->add_option("--sample", o->inputs.retention.sample, "use this sample only");
  retention->add_option("--fix-residual", o->inputs.retention.fix_residual, "hold theta_r at this value in the fit");
  retention->add_option("--texture", o->inputs.texture, "instead of lab data: class averages of this texture class");
  auto* conductivity = cmd->add_option_group("saturated conductivity", "where Ks comes from (exactly one)");
  conductivity->add_option("--permeameter", o->inputs.permeameter.file,
                           "well permeameter CSV (as `wetfront soil permeameter`)");
  conductivity->add_option("--well-radius", o->inputs.permeameter.well_radius, "with --permeameter");
  conductivity->add_option("--reservoir-area", o->inputs.permeameter.reservoir_area, "with --permeameter");
  conductivity->add_option("--soil", o->inputs.permeameter.soil_category, "with --permeameter")->capture_default_str();
  conductivity->add_flag("--single-head", o->inputs.permeameter.single_head_only, "with --permeameter");
  conductivity->add_option("--infiltrometer", o->inputs.infiltrometer.file,
                           "tension disc CSV (as `wetfront soil infiltrometer`)");
  conductivity->add_option("--disc-radius", o->inputs.infiltrometer.disc_radius, "with --infiltrometer");
  conductivity->add_option("--tower-area", o->inputs.infiltrometer.tower_area, "with --infiltrometer");
  conductivity->add_option("--saturated-conductivity", o->inputs.saturated_conductivity,
                           "a value with unit, e.g. \"25 cm/d\"");
  cmd->add_option("--pore-connectivity", o->inputs.pore_connectivity, "Mualem pore-connectivity exponent l")
      ->capture_default_str()
      ->each([o](const std::string&) { o->inputs.pore_connectivity_given = true; });
  cmd->add_option("--output", o->output_path, "write the TOML block to this file instead of the screen");
  cmd->add_option("--csv", o->csv_path, "also write the parameter table to this CSV file");
  add_force_flag(cmd, o->force);
  cmd->footer(
      "Example:\n"
      "  wetfront soil layer --name topsoil --top \"0 cm\" --bottom \"30 cm\" \\\n"
      "      --retention examples/soil-data/retention-points.csv \\\n"
      "      --permeameter examples/soil-data/well-permeameter.csv --well-radius \"3 cm\" --reservoir-area \"35.4 "
      "cm2\"");
  cmd->callback([o, cmd] {
    if (!o->output_path.empty() && o->output_path == o->csv_path)
      throw base::InputError(o->output_path, 0, "", "--output and --csv name the same file; give two names");
    const auto guard = guard_outputs(*cmd, {o->output_path, o->csv_path}, o->force);
    run_layer(*o);
  });
}

}  // namespace wetfront::cli
