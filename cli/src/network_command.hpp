// `wetfront network`: many site files run side by side, and a network summary.
#pragma once

#include <CLI/CLI.hpp>

#include "wetfront/cluster/ranks.hpp"

namespace wetfront::cli {

// Under mpirun the sites are spread over the session's ranks (study_ranks.hpp, network_sites.hpp).
void add_network_command(CLI::App& app, const cluster::Session& session);

}  // namespace wetfront::cli
