// `wetfront soil ...`: turning field and laboratory measurements into layer parameters.
#pragma once

#include <CLI/CLI.hpp>

namespace wetfront::cli {

// Registers `wetfront soil` and its subcommands on the program's App.
void add_soil_commands(CLI::App& app);

// One registration function per subcommand (each in its own file).
void add_permeameter_command(CLI::App& soil);
void add_infiltrometer_command(CLI::App& soil);
void add_texture_command(CLI::App& soil);
void add_cores_command(CLI::App& soil);
void add_retention_command(CLI::App& soil);
void add_layer_command(CLI::App& soil);

}  // namespace wetfront::cli
