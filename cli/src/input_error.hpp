// Bad input at the command line's boundary: names the file, line and column at fault and
// what was expected. The program reports it and exits with code 1.
#pragma once

#include <cstddef>
#include <stdexcept>
#include <string>

namespace wetfront::cli {

// Exit codes of the `wetfront` program.
enum ExitCode : int { exit_ok = 0, exit_bad_input = 1, exit_solver_failure = 2, exit_internal_failure = 3 };

class InputError : public std::runtime_error {
 public:
  // line is 1-based; 0 when the problem is not on one line (a missing file, an option).
  InputError(std::string file, std::size_t line, std::string column, const std::string& message);
  explicit InputError(const std::string& message) : InputError("", 0, "", message) {}

  const std::string& file() const { return file_; }
  std::size_t line() const { return line_; }
  const std::string& column() const { return column_; }

 private:
  std::string file_;
  std::size_t line_;
  std::string column_;
};

}  // namespace wetfront::cli
