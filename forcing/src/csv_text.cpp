#include "csv_text.hpp"

#include <cerrno>
#include <cmath>
#include <cstdlib>
#include <fstream>

#include <fmt/format.h>

#include "wetfront/forcing/input_error.hpp"

namespace wetfront::forcing::csv {

namespace {

std::string trim(std::string_view s) {
  const auto first = s.find_first_not_of(" \t\r");
  if (first == std::string_view::npos) return {};
  const auto last = s.find_last_not_of(" \t\r");
  return std::string(s.substr(first, last - first + 1));
}

std::vector<std::string> split(std::string_view line) {
  std::vector<std::string> out;
  std::size_t from = 0;
  while (true) {
    const auto comma = line.find(',', from);
    out.push_back(trim(line.substr(from, comma == std::string_view::npos ? std::string_view::npos : comma - from)));
    if (comma == std::string_view::npos) break;
    from = comma + 1;
  }
  return out;
}

std::string joined(std::span<const std::string_view> names) {
  std::string s;
  for (std::size_t i = 0; i < names.size(); ++i) s += fmt::format("{}'{}'", i == 0 ? "" : (i + 1 == names.size() ? " or " : ", "), names[i]);
  return s;
}

}  // namespace

std::optional<std::size_t> Table::column(std::string_view name) const {
  for (std::size_t i = 0; i < header.size(); ++i)
    if (header[i] == name) return i;
  return std::nullopt;
}

std::size_t Table::required_column(std::string_view name, std::string_view purpose) const {
  if (auto c = column(name)) return *c;
  throw InputError({file, header_line, {}}, fmt::format("no column '{}' in the header; expected it for {}", name, purpose));
}

std::pair<std::size_t, std::size_t> Table::one_of(std::span<const std::string_view> names, std::string_view purpose) const {
  std::optional<std::pair<std::size_t, std::size_t>> found;
  for (std::size_t i = 0; i < names.size(); ++i) {
    if (auto c = column(names[i])) {
      if (found)
        throw InputError({file, header_line, std::string(names[i])},
                         fmt::format("both '{}' and '{}' are present; expected only one column for {}",
                                     names[found->first], names[i], purpose));
      found = std::make_pair(i, *c);
    }
  }
  if (!found)
    throw InputError({file, header_line, {}},
                     fmt::format("no column for {} in the header; expected one of {}", purpose, joined(names)));
  return *found;
}

Table read(const std::filesystem::path& path) {
  Table t;
  t.file = path.string();
  std::ifstream in(path);
  if (!in) throw InputError({t.file, 0, {}}, "cannot open the file for reading");
  std::string line;
  int number_of_line = 0;
  while (std::getline(in, line)) {
    ++number_of_line;
    const std::string text = trim(line);
    if (text.empty() || text.front() == '#') continue;
    auto fields = split(text);
    if (t.header.empty()) {
      for (std::size_t i = 0; i < fields.size(); ++i) {
        if (fields[i].empty())
          throw InputError({t.file, number_of_line, {}}, fmt::format("header field {} is empty; expected a column name", i + 1));
        for (std::size_t j = 0; j < i; ++j)
          if (fields[j] == fields[i])
            throw InputError({t.file, number_of_line, fields[i]}, "column name appears twice in the header");
      }
      t.header = std::move(fields);
      t.header_line = number_of_line;
      continue;
    }
    if (fields.size() != t.header.size())
      throw InputError({t.file, number_of_line, {}},
                       fmt::format("{} fields; expected {} as in the header (line {})", fields.size(), t.header.size(),
                                   t.header_line));
    t.rows.push_back({number_of_line, std::move(fields)});
  }
  if (t.header.empty()) throw InputError({t.file, 0, {}}, "the file has no header line; expected column names first");
  return t;
}

std::optional<double> optional_number(const Table& t, const Row& r, std::size_t column) {
  const std::string& text = r.fields[column];
  if (text.empty()) return std::nullopt;
  errno = 0;
  char* end = nullptr;
  const double value = std::strtod(text.c_str(), &end);
  if (end != text.c_str() + text.size() || errno == ERANGE || !std::isfinite(value))
    throw InputError({t.file, r.line, t.header[column]}, fmt::format("'{}' is not a number; expected a decimal number", text));
  return value;
}

double number(const Table& t, const Row& r, std::size_t column) {
  if (auto v = optional_number(t, r, column)) return *v;
  throw InputError({t.file, r.line, t.header[column]}, "empty field; expected a number");
}

TimePoint time(const Table& t, const Row& r, std::size_t column) {
  const std::string& text = r.fields[column];
  if (auto tp = parse_timestamp(text)) return *tp;
  throw InputError({t.file, r.line, t.header[column]},
                   fmt::format("'{}' is not a date or date-time; expected YYYY-MM-DD, YYYY-MM-DDTHH:MM or "
                               "YYYY-MM-DDTHH:MM:SS",
                               text));
}

}  // namespace wetfront::forcing::csv
