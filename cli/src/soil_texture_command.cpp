// `wetfront soil texture [NAME]`: class-average van Genuchten-Mualem parameters of a USDA
// texture class (Carsel & Parrish 1988), or all twelve.
#include <memory>

#include <fmt/format.h>

#include "command_output.hpp"
#include "wetfront/base/input_error.hpp"
#include "soil_commands.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive

void add_texture_command(CLI::App& soil) {
  auto options = std::make_shared<TableCommandOptions<std::string>>();  // inputs: the class name
  CLI::App* cmd = soil.add_subcommand(
      "texture", "Class-average van Genuchten-Mualem parameters of a USDA texture class (Carsel & Parrish 1988)");
  cmd->add_option("NAME", options->inputs, "texture class, e.g. \"sandy loam\"; all classes when left out");
  finish_table_command(
      cmd, options->csv_path, options->force, "also write the table to this CSV file",
      "Examples:\n  wetfront soil texture \"silt loam\"\n  wetfront soil texture --csv classes.csv", [options] {
        ReportTable table;
        table.title = "Class-average parameters, Carsel & Parrish (1988); pore connectivity l = 0.5 (Mualem 1976)";
        table.headers = {"texture class", "theta_r [cm3/cm3]", "theta_s [cm3/cm3]", "alpha [1/cm]",
                         "n [-]",         "Ks [cm/d]"};
        auto add = [&](std::string_view name, const soils::VanGenuchtenMualem& p) {
          table.add_row({std::string(name), number(p.residual_water_content), number(p.saturated_water_content),
                         number(p.alpha_per_cm), number(p.n), number(p.saturated_conductivity_cm_per_d)});
        };
        if (options->inputs.empty()) {
          for (const auto& c : soils::texture_classes()) add(c.name, c.parameters);
        } else {
          try {
            add(options->inputs, soils::texture_class_parameters(options->inputs));
          } catch (const base::InputError& error) {
            throw base::InputError(fmt::format("texture class: {}", error.what()));
          }
        }
        emit_report({table}, {}, options->csv_path);
      });
}

}  // namespace wetfront::cli
