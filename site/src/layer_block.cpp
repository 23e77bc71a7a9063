#include "wetfront/site/layer_block.hpp"

#include <optional>
#include <sstream>
#include <stdexcept>

#include <fmt/format.h>
#include <toml++/toml.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace wetfront::site {
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

}  // namespace

LayerBlock layer_block(const LayerInputs& o) {
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
  LayerBlock result;
  std::vector<std::string>& warnings = result.warnings;
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
  result.tables.push_back(table);

  std::ostringstream block;
  // The first line marks the file as wetfront's, so that a later --output may replace it.
  block << fmt::format("{} (`wetfront soil layer`); the comment above each value says where it came from.\n",
                       kLayerBlockMark);
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
  result.text = block.str();

  // The block must read back as TOML with the values just written.
  try {
    const toml::table parsed = toml::parse(result.text);
    if (!parsed["layers"][0]["n"].value<double>()) throw std::logic_error("layer block lost its n");
  } catch (const toml::parse_error& error) {
    throw std::logic_error(fmt::format("internal error: the layer block is not valid TOML: {}", error.description()));
  }
  return result;
}

}  // namespace wetfront::site
