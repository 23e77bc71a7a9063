// `wetfront run`, `wetfront check` and `wetfront show`: a season at a site, from the site file
// to the report and the HDF5 run file.
#pragma once

#include <CLI/CLI.hpp>

namespace wetfront::cli {

void add_season_commands(CLI::App& app);

}  // namespace wetfront::cli
