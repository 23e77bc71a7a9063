// The one error type forcing throws for bad input: it names where the problem is (file, line,
// column when known) and what was expected.
#pragma once

#include <stdexcept>
#include <string>

namespace wetfront::forcing {

struct InputLocation {
  std::string file;     // empty when the data did not come from a file
  int line = 0;         // 1-based; 0 when unknown
  std::string column;   // column name; empty when not about one column
};

class InputError : public std::runtime_error {
 public:
  InputError(InputLocation where, const std::string& problem);
  const InputLocation& where() const { return where_; }
  const std::string& problem() const { return problem_; }

 private:
  InputLocation where_;
  std::string problem_;
};

}  // namespace wetfront::forcing
