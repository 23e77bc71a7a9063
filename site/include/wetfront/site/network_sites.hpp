// The sites of a network: each site's own files, and the sites run over the ranks of a
// studies::TaskRunner (rank 0 writes every file; the other ranks send a site's summary and the
// bytes of its files). No MPI here: the runner carries the bytes.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/network.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/studies/task_runner.hpp"

namespace wetfront::site {

// The site's own files, as a season run writes them by default (default_season_files): SITE.h5
// beside the site file, with SITE-visits.csv and, with sensors, SITE-sensors.csv.
OutputPlan site_outputs(const SiteSetup& setup, bool force);

// check_outputs of site_outputs, one site at a time with the writers (it reads HDF5 files).
void check_site_outputs(const SiteSetup& setup, bool force);

// Writes a season's own files (site_outputs), one site at a time (HDF5 is not thread-safe here).
void write_site_files(const SeasonResult& result, bool force);

// Reads every input of every site through base::read_input_file, so that rank 0's recording
// holds them all; a site that cannot be read is left to its run, which reports it.
void read_network_inputs(const NetworkPlan& plan);

// One site on any rank: the request is the site's number in the plan and its site file, the
// result its summary and the bytes of its files (written to a scratch folder of that rank, then
// removed). The other ranks need no plan: nothing of the summary's folder is checked there.
studies::TaskHandler network_site_task(const std::string& program_version);

// Rank 0: every site over `ranks`, each site's files written as its result arrives; the same
// summaries as run_network with write_site_files and the output check. Sites that cannot
// be loaded or whose files may not be written are run on rank 0, which finds the same failure.
std::vector<NetworkSite> run_network_on_ranks(const NetworkPlan& plan, studies::TaskRunner& ranks,
                                              const std::string& program_version, bool force,
                                              const NetworkProgress& progress);

// Every site of the plan with its own files checked before its run and written after it: over
// `ranks` when given (run_network_on_ranks), else on `threads` threads (run_network).
std::vector<NetworkSite> run_network_with_files(const NetworkPlan& plan, studies::TaskRunner* ranks, unsigned threads,
                                                const std::string& program_version, bool force,
                                                const NetworkProgress& progress);

}  // namespace wetfront::site
