#include "soil_commands.hpp"

namespace wetfront::cli {

void add_soil_commands(CLI::App& app) {
  CLI::App* soil = app.add_subcommand(
      "soil", "Soil hydraulic parameters from field and laboratory measurements (see docs/soil-data.md)");
  soil->require_subcommand(1);
  add_cores_command(*soil);
  add_retention_command(*soil);
  add_permeameter_command(*soil);
  add_infiltrometer_command(*soil);
  add_texture_command(*soil);
  add_layer_command(*soil);
}

}  // namespace wetfront::cli
