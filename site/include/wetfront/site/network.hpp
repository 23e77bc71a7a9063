// A network of plots: many site files run on the threads of one machine, each on its own,
// and a summary of them side by side (drainage at each recharge plane per visit interval, the
// Darcy and water-table estimates, the fit of the heads, the season totals). A site that cannot
// be read or whose solver fails is recorded with its reason; the others go on. Prints nothing.
#pragma once

#include <filesystem>
#include <functional>
#include <limits>
#include <optional>
#include <string>
#include <vector>

#include "wetfront/profiles/study_file.hpp"
#include "wetfront/site/run_season.hpp"

namespace wetfront::site {

// A network file (docs/network-file.md): its name, the site files (relative paths resolved
// against the network file's folder) and where the summary goes (NAME-sites.csv,
// NAME-intervals.csv and NAME.h5; relative to the network file's folder).
struct NetworkPlan {
  std::string name;
  std::vector<std::filesystem::path> site_files;
  std::filesystem::path summary;  // without extension
};

// Reads a network file. Throws base::InputError naming the file, line and key: unknown keys, no
// sites, a site listed twice, a summary name with a folder that does not exist.
NetworkPlan load_network_file(const std::filesystem::path& network_file);

// A plan from site files given directly; throws base::InputError for none, one given twice or a
// summary in a folder that does not exist.
NetworkPlan network_of_sites(std::vector<std::filesystem::path> site_files, std::filesystem::path summary);

enum class SiteStatus { done, bad_input, solver_failure, program_fault };
std::string status_text(SiteStatus status);  // "done", "bad input", "solver failure", "program fault"

struct NetworkInterval {
  std::string start_date, end_date;   // ISO 8601
  double start_day = 0, end_day = 0;  // days since the site's run start
  double drainage_cm = 0;             // model: net downward flux across the recharge plane
  std::optional<double> darcy_cm;     // empty: the site has no tensiometer pair or no usable reading
  std::optional<double> water_table_cm;
};

struct NetworkSite {
  std::filesystem::path site_file;
  std::string name;  // from the site file; the file name when it could not be read
  SiteStatus status = SiteStatus::done;
  std::string reason;              // why the site did not finish; empty when done
  std::string run_start, run_end;  // ISO 8601; run_end: where the run reached
  std::string input_hash;          // the run record's digest of the site's inputs
  double plane_depth_cm = std::numeric_limits<double>::quiet_NaN();
  // Season totals (cm; fluxes positive downward, evaporation etc. positive amounts).
  double water_input_cm = 0, runoff_cm = 0, evaporation_cm = 0, transpiration_cm = 0, storage_change_cm = 0,
         drainage_cm = 0, bottom_flux_cm = 0;
  std::optional<double> darcy_cm, water_table_cm;  // sums over the intervals that have one; empty: none has
  // Pooled tensiometers: simulated minus observed pressure head.
  int head_readings = 0;
  std::optional<double> head_rmse_cm, head_bias_cm;
  std::vector<NetworkInterval> intervals;
  bool has_run() const { return status == SiteStatus::done || status == SiteStatus::solver_failure; }
};

// Called on a worker thread with each site's setup before its run, e.g. to check that its
// files may be written. What it throws makes the site a failure (bad input) and it is not run.
using SiteStarting = std::function<void(const SiteSetup&)>;
// Called on a worker thread with each site's finished (or partially finished) run, e.g. to
// write its own files. What it throws makes the site a failure (bad input) with that reason;
// its summary values stay, but has_run() is then false.
using SiteFinished = std::function<void(const SeasonResult&)>;
// Called under a lock after each site with the number of sites done so far.
using NetworkProgress = std::function<void(std::size_t done, const NetworkSite& site)>;

// The summary of one season result.
NetworkSite summarise_site(const std::filesystem::path& site_file, const SeasonResult& result);

// One site of a network: loads it, calls starting, runs the season, summarises it and calls
// finished. Never throws: a failure is the site's status and reason.
NetworkSite run_network_site(const std::filesystem::path& site_file, const std::string& program_version,
                             const SiteFinished& finished = {}, const SiteStarting& starting = {});

// A site's summary as bytes (for a studies::TaskRunner); decode(encode(s)) == s bit for bit.
std::string encode_network_site(const NetworkSite& site);
NetworkSite decode_network_site(std::string_view bytes);

// Runs every site of the plan on studies::thread_count(threads) threads. The result lists the
// sites in plan order and does not depend on the number of threads.
std::vector<NetworkSite> run_network(const NetworkPlan& plan, unsigned threads, const std::string& program_version,
                                     const SiteFinished& finished = {}, const NetworkProgress& progress = {},
                                     const SiteStarting& starting = {});

// The summary as the tables of an HDF5 file (layout in docs/hdf5-layout.md, "Network summary").
profiles::StudyRecord network_record(const NetworkPlan& plan, const std::vector<NetworkSite>& sites,
                                     const std::string& program_version, const std::string& run_id = {});

}  // namespace wetfront::site
