// Printing a command's tables and warnings, and writing its results table on --csv.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/report_table.hpp"

namespace wetfront::cli {

// Prints every table to stdout (blank line between), each warning to stderr as
// "warning: ...", and writes the last table to csv_path when it is not empty.
void emit_report(const std::vector<site::ReportTable>& tables, const std::vector<std::string>& warnings,
                 const std::string& csv_path);

}  // namespace wetfront::cli
