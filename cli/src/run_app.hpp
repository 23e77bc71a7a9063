// Parses the command line and runs the chosen command, turning errors into exit codes:
// 0 ok, 1 bad input (file, line and field named on stderr), 2 solver failure, 3 a fault of the
// program or the machine (an unexpected exception, reported with its message).
#pragma once

#include <CLI/CLI.hpp>

namespace wetfront::cli {

int run_app(CLI::App& app, int argc, char** argv);

}  // namespace wetfront::cli
