// Printing a command's tables and warnings, writing its results table on --csv, and guarding the
// files a command writes.
#pragma once

#include <filesystem>
#include <functional>
#include <memory>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "wetfront/site/output_files.hpp"
#include "wetfront/site/report_table.hpp"

namespace wetfront::cli {

// Prints every table to stdout (blank line between), each warning to stderr as
// "warning: ...", and writes the last table to csv_path when it is not empty.
void emit_report(const std::vector<site::ReportTable>& tables, const std::vector<std::string>& warnings,
                 const std::string& csv_path);

// Adds the --force flag (replace output files that wetfront did not write) to `cmd`.
void add_force_flag(CLI::App* cmd, bool& force);

// The options of a command that prints tables: what it reads, a CSV copy of its last table, and
// whether that copy may replace a file wetfront did not write.
template <class Inputs>
struct TableCommandOptions {
  Inputs inputs{};
  std::string csv_path;
  bool force = false;
};

// The end of a command that prints tables: its --csv option (a copy of the last table), --force,
// the examples footer, and the callback, which runs `action` once the CSV path is checked and
// locked (guard_outputs). `csv_path` and `force` must outlive the command (the options struct).
void finish_table_command(CLI::App* cmd, std::string& csv_path, bool& force, const std::string& csv_help,
                          const std::string& examples, std::function<void()> action);

// Every existing file named by an option or argument of `cmd` (its option groups included) other
// than the output options --out, --output, --csv and --sensors-csv: the files the command reads.
std::vector<std::filesystem::path> files_named_by(const CLI::App& cmd);

// site::OutputGuard over `outputs`, with the files named on the command line and `more_inputs`
// as inputs. Call it before any work; keep the result for as long as the command writes.
std::unique_ptr<site::OutputGuard> guard_outputs(const CLI::App& cmd, std::vector<std::filesystem::path> outputs,
                                                 bool force, std::vector<std::filesystem::path> more_inputs = {});

}  // namespace wetfront::cli
