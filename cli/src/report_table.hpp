// A results table printed with aligned columns and written as CSV on request. Column
// headers carry their unit the same way input files do: "Kfs [cm/d]".
#pragma once

#include <string>
#include <vector>

namespace wetfront::cli {

struct ReportTable {
  std::string title;                       // printed above the table; not written to CSV
  std::vector<std::string> headers;        // "name [unit]"
  std::vector<std::vector<std::string>> rows;

  void add_row(std::vector<std::string> cells) { rows.push_back(std::move(cells)); }
};

// Aligned text with a rule under the header.
std::string format_table(const ReportTable& table);
// Writes header and rows as CSV (fields with commas or quotes are quoted). Throws
// InputError naming the path when it cannot be written.
void write_csv(const ReportTable& table, const std::string& path);

// Number formatting for reports: up to `significant` significant digits, no exponent for
// ordinary magnitudes.
std::string number(double value, int significant = 4);
// A fraction shown as a percentage with two decimals (no unit sign; the header says [%]).
std::string percent(double fraction);

}  // namespace wetfront::cli
