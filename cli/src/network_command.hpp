// `wetfront network`: many site files run side by side, and a network summary.
#pragma once

#include <CLI/CLI.hpp>

namespace wetfront::cli {

void add_network_command(CLI::App& app);

}  // namespace wetfront::cli
