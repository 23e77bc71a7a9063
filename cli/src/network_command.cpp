#include "network_command.hpp"

#include <cstdio>
#include <memory>

#include <fmt/format.h>

#include "command_output.hpp"
#include "exit_codes.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/cluster/run_study.hpp"
#include "wetfront/site/network.hpp"
#include "wetfront/site/network_sites.hpp"
#include "wetfront/site/network_summary.hpp"
#include "wetfront/studies/parallel_batch.hpp"

namespace wetfront::cli {

using namespace wetfront::site;
namespace {

struct NetworkOptions {
  std::string network;
  std::vector<std::string> sites;
  std::string summary;
  unsigned threads = 0;
  bool quiet = false;
  bool force = false;
};

NetworkPlan network_plan(const NetworkOptions& options) {
  if (!options.network.empty()) {
    NetworkPlan plan = load_network_file(options.network);
    if (!options.summary.empty()) plan.summary = options.summary;
    return plan;
  }
  if (options.sites.empty()) throw base::InputError("give a network file or --sites with one or more site files");
  std::vector<std::filesystem::path> files(options.sites.begin(), options.sites.end());
  return network_of_sites(std::move(files), options.summary.empty() ? "network" : options.summary);
}

// The network of a loaded plan; `ranks` runs the sites (null: this machine's threads).
void run_network_command(const NetworkOptions& options, const CLI::App& cmd, const NetworkPlan& plan,
                         studies::TaskRunner* ranks) {
  const NetworkSummaryFiles files = network_summary_files(plan);
  // Before any run: the summary's folder, the files read, files of other programs, another writer.
  const auto guard =
      guard_outputs(cmd, {files.study_file, files.sites_csv, files.intervals_csv}, options.force, plan.site_files);
  const unsigned workers = ranks ? ranks->workers() : studies::thread_count(options.threads);
  if (!options.quiet)
    fmt::print(stderr, "wetfront: {} sites on {} {}\n", plan.site_files.size(),
               std::min<std::size_t>(workers, plan.site_files.size()), ranks ? "ranks" : "threads");
  const bool quiet = options.quiet;
  const std::size_t total = plan.site_files.size();
  const auto progress = [quiet, total](std::size_t done, const NetworkSite& s) {
    if (!quiet) fmt::print(stderr, "wetfront: [{}/{}] {}: {}\n", done, total, s.name, status_text(s.status));
  };
  const std::vector<NetworkSite> results =
      run_network_with_files(plan, ranks, workers, WETFRONT_VERSION, options.force, progress);
  const NetworkSummary summary = write_network_summary(files, plan, results, WETFRONT_VERSION);
  std::size_t failed = 0;
  for (const auto& s : results) {
    if (s.status == SiteStatus::done) continue;
    ++failed;
    fmt::print(stderr, "error: site {} ({}): {}: {}\n", s.name, s.site_file.string(), status_text(s.status), s.reason);
  }
  if (!options.quiet) {
    fmt::print("{}\n", format_table(summary.sites));
    fmt::print("{}\n", format_table(summary.intervals));
    fmt::print("{} of {} sites done. Wrote {}, {} and {}\n", results.size() - failed, results.size(),
               files.study_file.string(), files.sites_csv.string(), files.intervals_csv.string());
  }
  if (failed > 0) throw CLI::RuntimeError(exit_some_sites_failed);
}

}  // namespace

void add_network_command(CLI::App& app, const cluster::Session& session) {
  auto options = std::make_shared<NetworkOptions>();
  CLI::App* cmd = app.add_subcommand("network", "Run the seasons of many plots and summarise them side by side");
  auto* network = cmd->add_option("NETWORK", options->network, "network file (TOML); see docs/network-file.md");
  auto* sites = cmd->add_option("--sites", options->sites, "site files to run instead of a network file");
  network->excludes(sites);
  sites->excludes(network);
  cmd->add_option("--summary", options->summary,
                  "summary name without extension (default: the network file's `summary`, or `network` in the "
                  "current folder with --sites)");
  cmd->add_option("--threads", options->threads, "worker threads (default 0: all cores); results do not depend on it");
  cmd->add_flag("--quiet", options->quiet, "print only errors and the failed sites");
  cmd->add_flag("--force", options->force,
                "replace output files that wetfront did not write (files the runs read are never replaced)");
  cmd->footer(
      "Runs every site as `wetfront run` would and writes its run file and CSV tables beside its site file;\n"
      "then writes the summary: NAME-sites.csv (one row per site), NAME-intervals.csv (one row per site and\n"
      "visit interval) and NAME.h5 (the same tables; docs/network-file.md). A site that cannot be read or whose\n"
      "solver fails is listed with its reason and the others go on.\n"
      "Exit codes: 0 every site done, 1 bad network file or options (nothing written), 4 one or more sites\n"
      "failed (the summary names them; the others' files are written).\n"
      "Examples:\n  wetfront network examples/network/network.toml\n"
      "  wetfront network --sites a/site.toml b/site.toml --summary plots");
  cmd->callback([options, cmd, &session] {
    cluster::run_study(
        session,
        [&] {
          if (!session.leader()) return NetworkPlan{};  // the requests name the site files
          NetworkPlan plan = network_plan(*options);
          if (session.distributed()) read_network_inputs(plan);  // for the other ranks
          return plan;
        },
        [](const NetworkPlan&) { return network_site_task(WETFRONT_VERSION); },
        [&](const NetworkPlan& plan, studies::TaskRunner* ranks) { run_network_command(*options, *cmd, plan, ranks); });
  });
}

}  // namespace wetfront::cli
