#include "report_table.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>

#include <fmt/format.h>

#include "input_error.hpp"

namespace wetfront::cli {
namespace {

std::string csv_field(const std::string& text) {
  if (text.find_first_of(",\"\n") == std::string::npos) return text;
  std::string quoted = "\"";
  for (const char c : text) {
    if (c == '"') quoted += '"';
    quoted += c;
  }
  return quoted + "\"";
}

}  // namespace

std::string number(double value, int significant) {
  if (!std::isfinite(value)) return fmt::format("{}", value);
  return fmt::format("{:.{}g}", value, significant);
}

std::string percent(double fraction) { return fmt::format("{:.2f}", 100.0 * fraction); }

std::string format_table(const ReportTable& table) {
  std::vector<std::size_t> widths(table.headers.size(), 0);
  for (std::size_t c = 0; c < table.headers.size(); ++c) widths[c] = table.headers[c].size();
  for (const auto& row : table.rows) {
    for (std::size_t c = 0; c < row.size() && c < widths.size(); ++c) widths[c] = std::max(widths[c], row[c].size());
  }
  std::string out;
  if (!table.title.empty()) out += table.title + "\n";
  auto append_row = [&](const std::vector<std::string>& cells) {
    std::string line = " ";
    for (std::size_t c = 0; c < widths.size(); ++c) {
      const std::string cell = c < cells.size() ? cells[c] : "";
      // First column left-aligned (labels), the rest right-aligned (numbers).
      line += c == 0 ? fmt::format(" {:<{}}", cell, widths[c]) : fmt::format(" {:>{}}", cell, widths[c]);
    }
    out += line + "\n";
  };
  append_row(table.headers);
  std::size_t total = 1;
  for (const auto w : widths) total += w + 1;
  out += " ";
  out.append(total, '-');
  out += "\n";
  for (const auto& row : table.rows) append_row(row);
  return out;
}

void write_csv(const ReportTable& table, const std::string& path) {
  std::ofstream out(path);
  if (!out) throw InputError(path, 0, "", "cannot open the file for writing (option --csv)");
  auto write_row = [&](const std::vector<std::string>& cells) {
    for (std::size_t c = 0; c < cells.size(); ++c) out << (c > 0 ? "," : "") << csv_field(cells[c]);
    out << '\n';
  };
  write_row(table.headers);
  for (const auto& row : table.rows) write_row(row);
  if (!out) throw InputError(path, 0, "", "writing the CSV file failed");
}

}  // namespace wetfront::cli
