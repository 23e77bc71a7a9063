// The one error type for bad input: a value, file or option the user gave that the program
// cannot use. It names where the problem is (file, line, column when known) and what was
// expected; the `wetfront` program reports it and exits with code 1.
//
// Faults of the program itself (a broken precondition, an impossible state) are not input
// errors: they are std::logic_error and its kin, which the program reports as internal faults
// (exit code 3).
#pragma once

#include <cstddef>
#include <stdexcept>
#include <string>

namespace wetfront::base {

class InputError : public std::runtime_error {
 public:
  // line is 1-based; 0 when the problem is not on one line (a missing file, an option).
  // column: a column or key name; empty when the problem is not about one.
  InputError(std::string file, std::size_t line, std::string column, const std::string& problem);
  explicit InputError(const std::string& problem) : InputError("", 0, "", problem) {}

  const std::string& file() const { return file_; }
  std::size_t line() const { return line_; }
  const std::string& column() const { return column_; }
  // The message without the location.
  const std::string& problem() const { return problem_; }

 private:
  std::string file_;
  std::size_t line_;
  std::string column_;
  std::string problem_;
};

}  // namespace wetfront::base
