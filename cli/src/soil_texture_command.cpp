// `wetfront soil texture [NAME]`: class-average van Genuchten-Mualem parameters of a USDA
// texture class (Carsel & Parrish 1988), or all twelve.
#include <memory>

#include "command_output.hpp"
#include "soil_commands.hpp"
#include "wetfront/site/lab_analysis.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive

void add_texture_command(CLI::App& soil) {
  auto options = std::make_shared<TableCommandOptions<std::string>>();  // inputs: the class name
  CLI::App* cmd = soil.add_subcommand(
      "texture", "Class-average van Genuchten-Mualem parameters of a USDA texture class (Carsel & Parrish 1988)");
  cmd->add_option("NAME", options->inputs, "texture class, e.g. \"sandy loam\"; all classes when left out");
  finish_table_command(cmd, options->csv_path, options->force, "also write the table to this CSV file",
                       "Examples:\n  wetfront soil texture \"silt loam\"\n  wetfront soil texture --csv classes.csv",
                       [options] { emit_report({texture_table(options->inputs)}, {}, options->csv_path); });
}

}  // namespace wetfront::cli
