#include "command_output.hpp"

#include <cstdio>

#include <fmt/format.h>

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive

void emit_report(const std::vector<ReportTable>& tables, const std::vector<std::string>& warnings,
                 const std::string& csv_path) {
  for (std::size_t i = 0; i < tables.size(); ++i) {
    fmt::print("{}{}", i > 0 ? "\n" : "", format_table(tables[i]));
  }
  for (const auto& w : warnings) fmt::print(stderr, "warning: {}\n", w);
  if (!csv_path.empty() && !tables.empty()) {
    write_csv(tables.back(), csv_path);
    fmt::print("\nResults written to {}\n", csv_path);
  }
}

}  // namespace wetfront::cli
