// The forcing files' view of a CSV file read by base::CsvTable (comments, quoting and field
// counts are its rules): header cells matched exactly as written ("rain_mm"), and the field
// parsers the forcing readers share. Every failure names file, line and column.
#pragma once

#include <cstddef>
#include <filesystem>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "wetfront/base/time_point.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing::csv {

struct Row {
  int line = 0;
  std::vector<std::string> fields;
};

struct Table {
  std::string file;
  int header_line = 0;
  std::vector<std::string> header;
  std::vector<Row> rows;

  std::optional<std::size_t> column(std::string_view name) const;
  // The column named `name`; base::InputError naming what the file must contain when absent.
  std::size_t required_column(std::string_view name, std::string_view purpose) const;
  // Exactly one of `names` must be present; returns its index in `names` and its column.
  std::pair<std::size_t, std::size_t> one_of(std::span<const std::string_view> names, std::string_view purpose) const;
};

Table read(const std::filesystem::path& file);

// Field parsers. Empty fields are errors for number() and time(); optional_number() returns
// nothing for an empty field.
double number(const Table& t, const Row& r, std::size_t column);
std::optional<double> optional_number(const Table& t, const Row& r, std::size_t column);
base::TimePoint time(const Table& t, const Row& r, std::size_t column);

}  // namespace wetfront::forcing::csv
