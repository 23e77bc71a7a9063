// `wetfront soil layer`: one layer's laboratory and field results combined into the TOML
// block of a site file, each number with a comment saying where it came from.
//   retention (theta_r, theta_s, alpha, n): a van Genuchten fit of retention points or
//     weighed cores, or the class averages of a texture class;
//   saturated conductivity: the field method the user picks (well permeameter, tension
//     disc) or a value given directly;
//   pore connectivity l: 0.5 (Mualem 1976) unless given.
#include <memory>
#include <sstream>

#include <fmt/format.h>
#include <toml++/toml.h>

#include "command_output.hpp"
#include "wetfront/site/field_analysis.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/site/lab_analysis.hpp"
#include "wetfront/base/quantity.hpp"
#include "wetfront/profiles/file_save.hpp"
#include "soil_commands.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

std::string toml_string(std::string_view text) {
  std::string out = "\"";
  for (const char c : text) {
    if (c == '"' || c == '\\') out += '\\';
    if (c == '\n') {
      out += "\\n";
      continue;
    }
    out += c;
  }
  return out + "\"";
}

struct LayerOptions {
  std::string name;
  std::string top;
  std::string bottom;
  RetentionInputs retention;
  std::string texture;
  PermeameterInputs permeameter;
  InfiltrometerInputs infiltrometer;
  std::string saturated_conductivity;
  double pore_connectivity = 0.5;
  bool pore_connectivity_given = false;
  std::string output_path;
  std::string csv_path;
  bool force = false;
};

void run_layer(const LayerOptions& o) {
  if (o.name.empty()) throw base::InputError("option --name: give the layer a name");
  const double top = base::parse_quantity(o.top, base::Dimension::length, "option --top");
  const double bottom = base::parse_quantity(o.bottom, base::Dimension::length, "option --bottom");
  if (!(top >= 0.0 && bottom > top)) {
    throw base::InputError(
        fmt::format("options --top/--bottom: depths are positive downward and the bottom lies below the "
                    "top; got top {} cm, bottom {} cm",
                    number(top), number(bottom)));
  }

  // Retention.
  const bool lab =
      !o.retention.points_file.empty() || !o.retention.cores_file.empty() || !o.retention.steps_file.empty();
  if (lab == !o.texture.empty()) {
    throw base::InputError(
        "retention: give either laboratory data (--retention FILE, or --cores with --steps) or --texture NAME");
  }
  soils::RetentionParameters retention;
  std::string retention_source;
  std::vector<ReportTable> tables;
  std::vector<std::string> warnings;
  std::optional<soils::VanGenuchtenMualem> texture_class;
  if (lab) {
    const RetentionReport report = analyse_retention(o.retention);
    retention = report.chosen;
    retention_source = report.provenance;
    warnings = report.warnings;
  } else {
    try {
      texture_class = soils::texture_class_parameters(o.texture);
    } catch (const base::InputError& error) {
      throw base::InputError(fmt::format("option --texture: {}", error.what()));
    }
    retention = {texture_class->residual_water_content, texture_class->saturated_water_content,
                 texture_class->alpha_per_cm, texture_class->n};
    retention_source = fmt::format("class average for {} (Carsel & Parrish 1988)", o.texture);
  }

  // Saturated conductivity.
  const int conductivity_sources = (!o.permeameter.file.empty() ? 1 : 0) + (!o.infiltrometer.file.empty() ? 1 : 0) +
                                   (!o.saturated_conductivity.empty() ? 1 : 0);
  if (conductivity_sources != 1) {
    throw base::InputError(
        "saturated conductivity: give exactly one of --permeameter FILE, --infiltrometer FILE or "
        "--saturated-conductivity VALUE");
  }
  double conductivity = 0.0;
  std::string conductivity_source;
  if (!o.permeameter.file.empty()) {
    const FieldReport report = analyse_permeameter(o.permeameter);
    conductivity = report.saturated_conductivity_cm_per_d;
    conductivity_source = report.provenance;
    warnings.insert(warnings.end(), report.warnings.begin(), report.warnings.end());
  } else if (!o.infiltrometer.file.empty()) {
    const FieldReport report = analyse_infiltrometer(o.infiltrometer);
    conductivity = report.saturated_conductivity_cm_per_d;
    conductivity_source = report.provenance;
    warnings.insert(warnings.end(), report.warnings.begin(), report.warnings.end());
  } else {
    conductivity = base::parse_quantity(o.saturated_conductivity, base::Dimension::conductivity,
                                        "option --saturated-conductivity");
    if (!(conductivity > 0.0)) throw base::InputError("option --saturated-conductivity: must be positive");
    conductivity_source = "given on the command line";
  }
  if (!(o.pore_connectivity > -10.0 && o.pore_connectivity < 10.0)) {
    throw base::InputError(
        fmt::format("option --pore-connectivity: expected a value between -10 and 10, got {}", o.pore_connectivity));
  }
  const std::string connectivity_source =
      o.pore_connectivity_given ? "given on the command line" : "default of Mualem (1976)";

  ReportTable table;
  table.title = fmt::format("Layer '{}', {} to {} cm (van Genuchten-Mualem)", o.name, number(top), number(bottom));
  table.headers = {"parameter", "value", "unit", "source"};
  table.add_row({"residual water content", number(retention.residual_water_content), "cm3/cm3", retention_source});
  table.add_row({"saturated water content", number(retention.saturated_water_content), "cm3/cm3", retention_source});
  table.add_row({"alpha", number(retention.alpha_per_cm), "1/cm", retention_source});
  table.add_row({"n", number(retention.n), "-", retention_source});
  table.add_row({"saturated conductivity", number(conductivity), "cm/d", conductivity_source});
  table.add_row({"pore connectivity", number(o.pore_connectivity), "-", connectivity_source});
  tables.push_back(table);

  std::ostringstream block;
  // The first line marks the file as wetfront's, so that a later --output may replace it.
  block << fmt::format("{} (`wetfront soil layer`); the comment above each value says where it came from.\n",
                       site::kLayerBlockMark);
  block << "[[layers]]\n";
  block << fmt::format("name = {}\n", toml_string(o.name));
  block << fmt::format("top = {}\n", toml_string(fmt::format("{} cm", number(top, 6))));
  block << fmt::format("bottom = {}\n", toml_string(fmt::format("{} cm", number(bottom, 6))));
  block << "model = \"van Genuchten-Mualem\"\n";
  block << fmt::format("# theta_r, theta_s, alpha, n: {}\n", retention_source);
  block << fmt::format("residual_water_content = {}\n", number(retention.residual_water_content, 4));
  block << fmt::format("saturated_water_content = {}\n", number(retention.saturated_water_content, 4));
  block << fmt::format("alpha = {}\n", toml_string(fmt::format("{} 1/cm", number(retention.alpha_per_cm, 4))));
  block << fmt::format("n = {}\n", number(retention.n, 4));
  block << fmt::format("# saturated conductivity: {}\n", conductivity_source);
  block << fmt::format("saturated_conductivity = {}\n", toml_string(fmt::format("{} cm/d", number(conductivity, 4))));
  block << fmt::format("# pore connectivity l: {}\n", connectivity_source);
  block << fmt::format("pore_connectivity = {}\n", number(o.pore_connectivity, 4));
  const std::string text = block.str();

  // The block must read back as TOML with the values just written.
  try {
    const toml::table parsed = toml::parse(text);
    if (!parsed["layers"][0]["n"].value<double>()) throw std::logic_error("layer block lost its n");
  } catch (const toml::parse_error& error) {
    throw std::logic_error(fmt::format("internal error: the layer block is not valid TOML: {}", error.description()));
  }

  emit_report(tables, warnings, o.csv_path);
  if (o.output_path.empty()) {
    fmt::print("\n{}", text);
  } else {
    try {
      profiles::StagedFile(o.output_path, text).commit();
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
  cmd->add_option("--name", o->name, "layer name, e.g. \"sandy loam topsoil\"")->required();
  cmd->add_option("--top", o->top, "depth of the layer top, with unit (e.g. \"0 cm\")")->required();
  cmd->add_option("--bottom", o->bottom, "depth of the layer bottom, with unit (e.g. \"30 cm\")")->required();
  auto* retention = cmd->add_option_group("retention", "where theta_r, theta_s, alpha and n come from");
  retention->add_option("--retention", o->retention.points_file, "retention points CSV (as `wetfront soil retention`)");
  retention->add_option("--cores", o->retention.cores_file, "ring samples CSV, with --steps");
  retention->add_option("--steps", o->retention.steps_file, "suction steps CSV, with --cores");
  retention->add_option("--sample", o->retention.sample, "use this sample only");
  retention->add_option("--fix-residual", o->retention.fix_residual, "hold theta_r at this value in the fit");
  retention->add_option("--texture", o->texture, "instead of lab data: class averages of this texture class");
  auto* conductivity = cmd->add_option_group("saturated conductivity", "where Ks comes from (exactly one)");
  conductivity->add_option("--permeameter", o->permeameter.file,
                           "well permeameter CSV (as `wetfront soil permeameter`)");
  conductivity->add_option("--well-radius", o->permeameter.well_radius, "with --permeameter");
  conductivity->add_option("--reservoir-area", o->permeameter.reservoir_area, "with --permeameter");
  conductivity->add_option("--soil", o->permeameter.soil_category, "with --permeameter")->capture_default_str();
  conductivity->add_flag("--single-head", o->permeameter.single_head_only, "with --permeameter");
  conductivity->add_option("--infiltrometer", o->infiltrometer.file,
                           "tension disc CSV (as `wetfront soil infiltrometer`)");
  conductivity->add_option("--disc-radius", o->infiltrometer.disc_radius, "with --infiltrometer");
  conductivity->add_option("--tower-area", o->infiltrometer.tower_area, "with --infiltrometer");
  conductivity->add_option("--saturated-conductivity", o->saturated_conductivity,
                           "a value with unit, e.g. \"25 cm/d\"");
  cmd->add_option("--pore-connectivity", o->pore_connectivity, "Mualem pore-connectivity exponent l")
      ->capture_default_str()
      ->each([o](const std::string&) { o->pore_connectivity_given = true; });
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
