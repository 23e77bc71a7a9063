// `wetfront sweep` and `wetfront calibrate`: parameter studies of a site.
#pragma once

#include <CLI/CLI.hpp>

namespace wetfront::cli {

void add_parameter_commands(CLI::App& app);

}  // namespace wetfront::cli
