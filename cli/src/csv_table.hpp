// Reading field and laboratory CSV files.
//
// Layout: lines starting with '#' are comments and blank lines are skipped anywhere; the
// first other line is the header. A header cell is a column name with its unit in square
// brackets, "time [min]", or (as in the laboratory files) after the last underscore,
// "time_min"; columns without a unit (yes/no flags, labels) have none. Names match
// case-insensitively with underscores read as spaces. Fields
// are separated by commas; a field may be quoted with double quotes. Every error names the
// file, the line and the column.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "input_error.hpp"
#include "quantity.hpp"

namespace wetfront::cli {

struct CsvColumn {
  std::string name;  // as written, trimmed, e.g. "time"
  std::string unit;  // inside the brackets, e.g. "min"; empty when none
};

class CsvTable {
 public:
  // Throws InputError when the file cannot be opened, has no header, or a row has a
  // different number of fields than the header.
  static CsvTable read(const std::string& path);

  const std::string& path() const { return path_; }
  std::size_t row_count() const { return rows_.size(); }
  std::size_t header_line() const { return header_line_; }
  std::size_t line_of(std::size_t row) const { return rows_[row].line; }

  // Column lookup by name, case-insensitive, ignoring the unit.
  std::optional<std::size_t> find_column(std::string_view name) const;
  // As find_column, but a missing column is an InputError listing the columns found.
  std::size_t require_column(std::string_view name) const;

  const CsvColumn& column(std::size_t index) const { return columns_[index]; }
  const std::string& text(std::size_t row, std::size_t column) const { return rows_[row].fields[column]; }

  // The field as a number in internal units, converted with the column's unit. The unit must
  // be one of the dimension's accepted units (else the error names the header line).
  double quantity(std::size_t row, std::size_t column, Dimension dimension) const;
  // The field as a plain number, whatever the column's unit (the caller converts); an error at
  // the field when it is not a number.
  double number(std::size_t row, std::size_t column) const;
  // A yes/no flag (yes, y, true, 1 / no, n, false, 0; case-insensitive).
  bool flag(std::size_t row, std::size_t column) const;

  // An InputError at a row and column of this file.
  InputError error_at(std::size_t row, std::size_t column, const std::string& message) const;

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

}  // namespace wetfront::cli
