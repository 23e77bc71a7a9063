// `wetfront network`: many site files run side by side, and a network summary.
#pragma once

#include <CLI/CLI.hpp>

#include "wetfront/cluster/ranks.hpp"

namespace wetfront::cli {

// Under mpirun rank 0 runs the network on its threads (the sites are not spread over ranks yet).
void add_network_command(CLI::App& app, const cluster::Session& session);

}  // namespace wetfront::cli
