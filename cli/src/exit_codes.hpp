// Exit codes of the `wetfront` program.
#pragma once

namespace wetfront::cli {

enum ExitCode : int {
  exit_ok = 0,
  exit_bad_input = 1,         // base::InputError: the user's input cannot be used; nothing written
  exit_solver_failure = 2,    // the run stopped early; partial results marked incomplete
  exit_internal_failure = 3,  // a fault of the program (or the machine), not of the input
  exit_some_sites_failed = 4,  // `network`: one or more sites failed; the summary names them
};

}  // namespace wetfront::cli
