#include "input_error.hpp"

#include <fmt/format.h>

namespace wetfront::cli {
namespace {

std::string compose(const std::string& file, std::size_t line, const std::string& column, const std::string& message) {
  std::string where = file;
  if (line > 0) where += fmt::format(":{}", line);
  if (!column.empty()) where += fmt::format("{}column '{}'", where.empty() ? "" : ": ", column);
  return where.empty() ? message : where + ": " + message;
}

}  // namespace

InputError::InputError(std::string file, std::size_t line, std::string column, const std::string& message)
    : std::runtime_error(compose(file, line, column, message)),
      file_(std::move(file)),
      line_(line),
      column_(std::move(column)) {}

}  // namespace wetfront::cli
