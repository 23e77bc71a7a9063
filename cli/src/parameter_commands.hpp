// `wetfront sweep` and `wetfront calibrate`: parameter studies of a site.
#pragma once

#include <CLI/CLI.hpp>

#include "wetfront/cluster/ranks.hpp"

namespace wetfront::cli {

// Under mpirun both spread their runs over the session's ranks (study_ranks.hpp).
void add_parameter_commands(CLI::App& app, const cluster::Session& session);

}  // namespace wetfront::cli
