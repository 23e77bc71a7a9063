#include "wetfront/base/input_error.hpp"

#include <fmt/format.h>

namespace wetfront::base {
namespace {

// "file:line: column 'name': problem", leaving out the parts that are not known.
std::string compose(const std::string& file, std::size_t line, const std::string& column, const std::string& problem) {
  std::string where = file;
  if (line > 0) where += fmt::format(":{}", line);
  if (!column.empty()) where += fmt::format("{}column '{}'", where.empty() ? "" : ": ", column);
  return where.empty() ? problem : where + ": " + problem;
}

}  // namespace

InputError::InputError(std::string file, std::size_t line, std::string column, const std::string& problem)
    : std::runtime_error(compose(file, line, column, problem)),
      file_(std::move(file)),
      line_(line),
      column_(std::move(column)),
      problem_(problem) {}

}  // namespace wetfront::base
