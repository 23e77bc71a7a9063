#include "wetfront/base/csv_table.hpp"
#include "wetfront/base/input_files.hpp"

#include <algorithm>
#include <cctype>
#include <sstream>

#include <fmt/format.h>

namespace wetfront::base {
namespace {

// Lower case, with underscores read as spaces: "Water_Level" and "water level" match.
std::string lower(std::string_view text) {
  std::string out(text);
  std::transform(out.begin(), out.end(), out.begin(),
                 [](unsigned char c) { return c == '_' ? ' ' : static_cast<char>(std::tolower(c)); });
  return out;
}

// Splits one line at commas outside double quotes; "" inside quotes is a literal quote.
std::vector<std::string> split_fields(const std::string& line, const std::string& path, std::size_t line_number) {
  std::vector<std::string> fields;
  std::string current;
  bool quoted = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const char c = line[i];
    if (quoted) {
      if (c == '"' && i + 1 < line.size() && line[i + 1] == '"') {
        current += '"';
        ++i;
      } else if (c == '"') {
        quoted = false;
      } else {
        current += c;
      }
    } else if (c == '"') {
      quoted = true;
    } else if (c == ',') {
      fields.push_back(trim(current));
      current.clear();
    } else {
      current += c;
    }
  }
  if (quoted) throw InputError(path, line_number, "", "a quoted field is not closed on this line");
  fields.push_back(trim(current));
  return fields;
}

CsvColumn parse_header_cell(const std::string& cell, const std::string& path, std::size_t line_number) {
  const auto open = cell.find('[');
  if (open == std::string::npos) {
    // The laboratory files' style, "water_level_cm": a known unit after the last underscore.
    const auto underscore = cell.rfind('_');
    if (underscore != std::string::npos && is_known_unit(std::string_view(cell).substr(underscore + 1))) {
      return {cell, cell.substr(0, underscore), cell.substr(underscore + 1)};
    }
    return {cell, cell, ""};
  }
  const auto close = cell.find(']', open);
  if (close == std::string::npos || trim(std::string_view(cell).substr(close + 1)) != "") {
    throw InputError(path, line_number, cell,
                     "a header cell is a name with its unit in square brackets, e.g. 'time [min]'");
  }
  return {cell, trim(std::string_view(cell).substr(0, open)),
          trim(std::string_view(cell).substr(open + 1, close - open - 1))};
}

}  // namespace

CsvTable CsvTable::read(const std::filesystem::path& path) {
  std::error_code error;
  if (std::filesystem::is_directory(path, error))
    throw InputError(path.string(), 0, "", "is a folder, not a CSV file; give the name of a file");
  const std::optional<std::string> bytes = read_input_file(path);
  if (!bytes) throw InputError(path.string(), 0, "", "cannot open the file for reading");
  std::istringstream in(*bytes);
  return parse(in, path.string());
}

CsvTable CsvTable::parse(std::istream& in, const std::string& source) {
  CsvTable table;
  table.path_ = source;
  std::string line;
  std::size_t line_number = 0;
  while (std::getline(in, line)) {
    ++line_number;
    // A UTF-8 byte-order mark, as spreadsheet "CSV UTF-8" exports write it: invisible, not data.
    if (line_number == 1 && line.rfind("\xEF\xBB\xBF", 0) == 0) line.erase(0, 3);
    if (!line.empty() && line.back() == '\r') line.pop_back();
    const std::string trimmed = trim(line);
    if (trimmed.empty() || trimmed.front() == '#') continue;
    auto fields = split_fields(line, source, line_number);
    if (table.columns_.empty()) {
      table.header_line_ = line_number;
      for (std::size_t i = 0; i < fields.size(); ++i) {
        if (fields[i].empty()) throw InputError(source, line_number, "", "the header has an empty column name");
        if (std::find(fields.begin(), fields.begin() + static_cast<std::ptrdiff_t>(i), fields[i]) !=
            fields.begin() + static_cast<std::ptrdiff_t>(i))
          throw InputError(source, line_number, fields[i], "appears more than once in the header");
        table.columns_.push_back(parse_header_cell(fields[i], source, line_number));
      }
      continue;
    }
    if (fields.size() != table.columns_.size()) {
      throw InputError(source, line_number, "",
                       fmt::format("expected {} comma-separated fields as in the header (line {}), found {}",
                                   table.columns_.size(), table.header_line_, fields.size()));
    }
    table.rows_.push_back({line_number, std::move(fields)});
  }
  if (table.columns_.empty()) throw InputError(source, 0, "", "the file has no header line (only comments or nothing)");
  return table;
}

std::optional<std::size_t> CsvTable::find_column(std::string_view name) const {
  const std::string wanted = lower(name);
  for (std::size_t i = 0; i < columns_.size(); ++i) {
    if (lower(columns_[i].name) == wanted) return i;
  }
  return std::nullopt;
}

std::optional<std::size_t> CsvTable::find_header(std::string_view header) const {
  for (std::size_t i = 0; i < columns_.size(); ++i) {
    if (columns_[i].header == header) return i;
  }
  return std::nullopt;
}

std::size_t CsvTable::require_column(std::string_view name) const {
  if (const auto index = find_column(name)) return *index;
  std::string found;
  for (const auto& c : columns_) {
    if (!found.empty()) found += ", ";
    found += fmt::format("'{}'", c.name);
  }
  throw header_error(name, fmt::format("required column is missing; the header has {}", found));
}

double CsvTable::quantity(std::size_t row, std::size_t column, Dimension dimension) const {
  const CsvColumn& c = columns_[column];
  if (c.unit.empty()) {
    throw InputError(path_, header_line_, c.name,
                     fmt::format("the header must give a unit in brackets, one of {} (e.g. '{} [{}]')",
                                 accepted_units(dimension), c.name, internal_unit(dimension)));
  }
  if (!to_internal(dimension, 1.0, c.unit)) {
    throw InputError(path_, header_line_, c.name,
                     fmt::format("unit '{}' is not accepted here; use {}", c.unit, accepted_units(dimension)));
  }
  const std::string& field = text(row, column);
  const auto value = to_number(field);
  if (!value) throw error_at(row, column, fmt::format("expected a number in {}, got '{}'", c.unit, field));
  return *to_internal(dimension, *value, c.unit);
}

double CsvTable::number(std::size_t row, std::size_t column, std::string_view unit_hint) const {
  const std::string& field = text(row, column);
  if (const auto value = to_number(field)) return *value;
  if (field.empty()) throw error_at(row, column, "empty field; expected a number");
  throw error_at(row, column,
                 unit_hint.empty() ? fmt::format("expected a number, got '{}'", field)
                                   : fmt::format("expected a number in {}, got '{}'", unit_hint, field));
}

std::optional<double> CsvTable::optional_number(std::size_t row, std::size_t column) const {
  if (text(row, column).empty()) return std::nullopt;
  return number(row, column);
}

bool CsvTable::flag(std::size_t row, std::size_t column) const {
  const std::string value = lower(text(row, column));
  if (value == "yes" || value == "y" || value == "true" || value == "1") return true;
  if (value == "no" || value == "n" || value == "false" || value == "0") return false;
  throw error_at(row, column, fmt::format("expected yes or no, got '{}'", text(row, column)));
}

TimePoint CsvTable::timestamp(std::size_t row, std::size_t column) const {
  const auto when = parse_timestamp(text(row, column));
  if (!when) {
    throw error_at(row, column,
                   fmt::format("expected an ISO 8601 date or date-time (2025-04-08 or 2025-04-08T09:00), got '{}'",
                               text(row, column)));
  }
  return *when;
}

InputError CsvTable::error_at(std::size_t row, std::size_t column, const std::string& message) const {
  return InputError(path_, rows_[row].line, columns_[column].name, message);
}

InputError CsvTable::header_error(std::string_view column, const std::string& message) const {
  return InputError(path_, header_line_, std::string(column), message);
}

}  // namespace wetfront::base
