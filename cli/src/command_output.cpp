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

void add_force_flag(CLI::App* cmd, bool& force) {
  cmd->add_flag("--force", force, "replace output files that wetfront did not write (never a file the command reads)");
}

void finish_table_command(CLI::App* cmd, std::string& csv_path, bool& force, const std::string& csv_help,
                          const std::string& examples, std::function<void()> action) {
  cmd->add_option("--csv", csv_path, csv_help);
  add_force_flag(cmd, force);
  cmd->footer(examples);
  cmd->callback([cmd, &csv_path, &force, action = std::move(action)] {
    const auto guard = guard_outputs(*cmd, {csv_path}, force);
    action();
  });
}

std::vector<std::filesystem::path> files_named_by(const CLI::App& cmd) {
  std::vector<std::filesystem::path> files;
  const auto collect = [&](const CLI::App& app) {
    for (const CLI::Option* option : app.get_options()) {
      if (option->check_lname("out") || option->check_lname("output") || option->check_lname("csv") ||
          option->check_lname("sensors-csv"))
        continue;
      for (const std::string& value : option->results()) {
        std::error_code error;
        if (!value.empty() && std::filesystem::is_regular_file(value, error)) files.emplace_back(value);
      }
    }
  };
  collect(cmd);
  for (const CLI::App* group : cmd.get_subcommands([](const CLI::App* app) { return app->get_name().empty(); }))
    collect(*group);
  return files;
}

std::unique_ptr<OutputGuard> guard_outputs(const CLI::App& cmd, std::vector<std::filesystem::path> outputs, bool force,
                                           std::vector<std::filesystem::path> more_inputs) {
  std::vector<std::filesystem::path> inputs = files_named_by(cmd);
  inputs.insert(inputs.end(), more_inputs.begin(), more_inputs.end());
  return std::make_unique<OutputGuard>(
      OutputPlan{.outputs = std::move(outputs), .inputs = std::move(inputs), .force = force});
}

}  // namespace wetfront::cli
