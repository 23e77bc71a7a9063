#include "csv_text.hpp"

#include <fmt/format.h>

#include "wetfront/base/csv_table.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"

namespace wetfront::forcing::csv {

namespace {

std::string joined(std::span<const std::string_view> names) {
  std::string s;
  for (std::size_t i = 0; i < names.size(); ++i)
    s += fmt::format("{}'{}'", i == 0 ? "" : (i + 1 == names.size() ? " or " : ", "), names[i]);
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
  throw base::InputError(file, header_line, "",
                         fmt::format("no column '{}' in the header; expected it for {}", name, purpose));
}

std::pair<std::size_t, std::size_t> Table::one_of(std::span<const std::string_view> names,
                                                  std::string_view purpose) const {
  std::optional<std::pair<std::size_t, std::size_t>> found;
  for (std::size_t i = 0; i < names.size(); ++i) {
    if (auto c = column(names[i])) {
      if (found)
        throw base::InputError(file, header_line, std::string(names[i]),
                               fmt::format("both '{}' and '{}' are present; expected only one column for {}",
                                           names[found->first], names[i], purpose));
      found = std::make_pair(i, *c);
    }
  }
  if (!found)
    throw base::InputError(file, header_line, "",
                           fmt::format("no column for {} in the header; expected one of {}", purpose, joined(names)));
  return *found;
}

Table read(const std::filesystem::path& path) {
  const base::CsvTable csv = base::CsvTable::read(path);
  Table t;
  t.file = csv.path();
  t.header_line = static_cast<int>(csv.header_line());
  for (std::size_t c = 0; c < csv.column_count(); ++c) t.header.push_back(csv.column(c).header);
  for (std::size_t r = 0; r < csv.row_count(); ++r) {
    Row row{static_cast<int>(csv.line_of(r)), {}};
    for (std::size_t c = 0; c < csv.column_count(); ++c) row.fields.push_back(csv.text(r, c));
    t.rows.push_back(std::move(row));
  }
  return t;
}

std::optional<double> optional_number(const Table& t, const Row& r, std::size_t column) {
  const std::string& text = r.fields[column];
  if (text.empty()) return std::nullopt;
  const auto value = base::to_number(text);
  if (!value)
    throw base::InputError(t.file, r.line, t.header[column],
                           fmt::format("'{}' is not a number; expected a decimal number", text));
  return *value;
}

double number(const Table& t, const Row& r, std::size_t column) {
  if (auto v = optional_number(t, r, column)) return *v;
  throw base::InputError(t.file, r.line, t.header[column], "empty field; expected a number");
}

base::TimePoint time(const Table& t, const Row& r, std::size_t column) {
  const std::string& text = r.fields[column];
  if (auto tp = base::parse_timestamp(text)) return *tp;
  throw base::InputError(t.file, r.line, t.header[column],
                         fmt::format("'{}' is not a date or date-time; expected YYYY-MM-DD, YYYY-MM-DDTHH:MM or "
                                     "YYYY-MM-DDTHH:MM:SS",
                                     text));
}

}  // namespace wetfront::forcing::csv
