// The one reader of field and laboratory CSV files.
//
// Layout: lines starting with '#' are comments and blank lines are skipped anywhere; the
// first other line is the header. Fields are separated by commas and trimmed of white space;
// a field may be quoted with double quotes, and "" inside quotes is a literal quote (the usual
// quoting rules). Every row has as many fields as the header; header names are not empty and
// appear once.
//
// A header cell is a column name, with its unit in square brackets, "time [min]", or after the
// last underscore when that is a known unit, "time_min"; columns without a unit (yes/no flags,
// labels) have none. find_column matches names case-insensitively with underscores read as
// spaces and ignores the unit; find_header matches the header cell exactly as written.
// Every error is an InputError naming the file, the line and the column.
#pragma once

#include <cstddef>
#include <filesystem>
#include <istream>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"
#include "wetfront/base/time_point.hpp"

namespace wetfront::base {

struct CsvColumn {
  std::string header;  // the header cell as written, trimmed, e.g. "time [min]" or "time_min"
  std::string name;    // without its unit, e.g. "time"
  std::string unit;    // e.g. "min"; empty when none
};

class CsvTable {
 public:
  // Throws InputError when the file cannot be opened, has no header, or a row has a
  // different number of fields than the header.
  static CsvTable read(const std::filesystem::path& path);
  // The same from a stream; `source` names it in messages.
  static CsvTable parse(std::istream& in, const std::string& source);

  const std::string& path() const { return path_; }
  std::size_t row_count() const { return rows_.size(); }
  std::size_t column_count() const { return columns_.size(); }
  std::size_t header_line() const { return header_line_; }
  std::size_t line_of(std::size_t row) const { return rows_[row].line; }

  // Column lookup by name, case-insensitive, ignoring the unit.
  std::optional<std::size_t> find_column(std::string_view name) const;
  // As find_column, but a missing column is an InputError listing the columns found.
  std::size_t require_column(std::string_view name) const;
  // Column whose header cell is exactly `header`.
  std::optional<std::size_t> find_header(std::string_view header) const;

  const CsvColumn& column(std::size_t index) const { return columns_[index]; }
  const std::string& text(std::size_t row, std::size_t column) const { return rows_[row].fields[column]; }

  // The field as a number in internal units, converted with the column's unit. The unit must
  // be one of the dimension's accepted units (else the error names the header line).
  double quantity(std::size_t row, std::size_t column, Dimension dimension) const;
  // The field as a plain number, whatever the column's unit (the caller converts); an error at
  // the field when it is not a number. `unit_hint` (e.g. "cm") goes into that message.
  double number(std::size_t row, std::size_t column, std::string_view unit_hint = {}) const;
  // Nothing for an empty field, else as number().
  std::optional<double> optional_number(std::size_t row, std::size_t column) const;
  // A yes/no flag (yes, y, true, 1 / no, n, false, 0; case-insensitive).
  bool flag(std::size_t row, std::size_t column) const;
  // An ISO 8601 date or date-time (time_point.hpp, parse_timestamp).
  TimePoint timestamp(std::size_t row, std::size_t column) const;

  // An InputError at a row and column of this file (column name as in the header cell).
  InputError error_at(std::size_t row, std::size_t column, const std::string& message) const;
  // An InputError at the header line, about one column (empty: the whole header).
  InputError header_error(std::string_view column, const std::string& message) const;

 private:
  struct Row {
    std::size_t line;
    std::vector<std::string> fields;
  };
  std::string path_;
  std::size_t header_line_ = 0;
  std::vector<CsvColumn> columns_;
  std::vector<Row> rows_;
};

}  // namespace wetfront::base
