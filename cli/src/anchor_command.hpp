// `wetfront anchor`: an ensemble of the season updated at each visit from its readings.
#pragma once

#include <CLI/CLI.hpp>

namespace wetfront::cli {

void add_anchor_command(CLI::App& app);

}  // namespace wetfront::cli
