#include "wetfront/forcing/input_error.hpp"

#include <fmt/format.h>

namespace wetfront::forcing {

namespace {
std::string compose(const InputLocation& where, const std::string& problem) {
  std::string text;
  if (!where.file.empty()) text += where.file;
  if (where.line > 0) text += fmt::format("{}line {}", text.empty() ? "" : ":", where.line);
  if (!where.column.empty()) text += fmt::format("{}column '{}'", text.empty() ? "" : ", ", where.column);
  return text.empty() ? problem : text + ": " + problem;
}
}  // namespace

InputError::InputError(InputLocation where, const std::string& problem)
    : std::runtime_error(compose(where, problem)), where_(std::move(where)), problem_(problem) {}

}  // namespace wetfront::forcing
