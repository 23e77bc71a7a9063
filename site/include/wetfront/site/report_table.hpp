// A results table printed with aligned columns and written as CSV on request. Column
// headers carry their unit the same way input files do: "Kfs [cm/d]".
#pragma once

#include <filesystem>
#include <functional>
#include <string>
#include <utility>
#include <vector>

namespace wetfront::site {

struct ReportTable {
  std::string title;                 // printed above the table; not written to CSV
  std::vector<std::string> headers;  // "name [unit]"
  std::vector<std::vector<std::string>> rows;
  // Written as a last column "run id" in the CSV file (the same value on every row), so that a
  // file of one output set can be matched with the others; write_csv and write_files_together
  // make a new one when it is empty.
  std::string run_id;

  void add_row(std::vector<std::string> cells) { rows.push_back(std::move(cells)); }
};

// Aligned text with a rule under the header.
std::string format_table(const ReportTable& table);
// Header and rows as CSV text (fields with commas or quotes are quoted), with the "run id"
// column when table.run_id is not empty.
std::string csv_text(const ReportTable& table);
// Writes csv_text to `path` under a temporary name, renamed when complete. Throws base::InputError
// naming the path when it cannot be written.
void write_csv(const ReportTable& table, const std::string& path);
// A command's main file and its CSV tables appear together or not at all: the tables are
// staged under temporary names, write_main writes the main file (itself atomically), and only
// then are the tables renamed. Throws base::InputError naming the CSV file that cannot be written;
// what write_main throws passes through, and then no table appears.
void write_files_together(const std::vector<std::pair<std::filesystem::path, ReportTable>>& tables,
                          const std::function<void()>& write_main);

// Number formatting for reports: up to `significant` significant digits, no exponent for
// ordinary magnitudes.
std::string number(double value, int significant = 4);
// A fraction shown as a percentage with two decimals (no unit sign; the header says [%]).
std::string percent(double fraction);

}  // namespace wetfront::site
