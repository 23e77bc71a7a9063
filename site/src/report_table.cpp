#include "wetfront/site/report_table.hpp"

#include <algorithm>
#include <cmath>
#include <memory>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/file_save.hpp"
#include "wetfront/site/output_files.hpp"

namespace wetfront::site {
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

std::string csv_text(const ReportTable& table) {
  std::string out;
  auto write_row = [&](const std::vector<std::string>& cells) {
    for (std::size_t c = 0; c < cells.size(); ++c) {
      if (c > 0) out += ',';
      out += csv_field(cells[c]);
    }
    out += '\n';
  };
  if (table.run_id.empty()) {
    write_row(table.headers);
    for (const auto& row : table.rows) write_row(row);
    return out;
  }
  std::vector<std::string> headers = table.headers;
  headers.push_back(kRunIdColumn);
  write_row(headers);
  for (auto row : table.rows) {
    row.resize(table.headers.size());
    row.push_back(table.run_id);
    write_row(row);
  }
  return out;
}

namespace {
ReportTable with_run_id(const ReportTable& table) {
  ReportTable copy = table;
  if (copy.run_id.empty()) copy.run_id = new_run_id();
  return copy;
}
}  // namespace

void write_csv(const ReportTable& table, const std::string& path) {
  try {
    profiles::StagedFile(path, csv_text(with_run_id(table))).commit();
  } catch (const std::exception& error) {
    throw base::InputError(path, 0, "", fmt::format("cannot write the CSV file: {}", error.what()));
  }
}

void write_files_together(const std::vector<std::pair<std::filesystem::path, ReportTable>>& tables,
                          const std::function<void()>& write_main) {
  std::vector<std::unique_ptr<profiles::StagedFile>> staged;
  for (const auto& [path, table] : tables) {
    try {
      staged.push_back(std::make_unique<profiles::StagedFile>(path, csv_text(with_run_id(table))));
    } catch (const std::exception& error) {
      throw base::InputError(path.string(), 0, "", fmt::format("cannot write the CSV file: {}", error.what()));
    }
  }
  write_main();
  for (std::size_t i = 0; i < staged.size(); ++i) {
    try {
      staged[i]->commit();
    } catch (const std::exception& error) {
      throw base::InputError(tables[i].first.string(), 0, "",
                             fmt::format("cannot write the CSV file: {}", error.what()));
    }
  }
}

}  // namespace wetfront::site
