// The summary of a network: one row per site and one per site and visit interval, written as
// NAME-sites.csv, NAME-intervals.csv and NAME.h5 (docs/network-file.md) as one set.
#pragma once

#include <filesystem>
#include <string>
#include <vector>

#include "wetfront/site/network.hpp"
#include "wetfront/site/report_table.hpp"

namespace wetfront::site {

struct NetworkSummaryFiles {
  std::filesystem::path study_file;     // NAME.h5
  std::filesystem::path sites_csv;      // NAME-sites.csv
  std::filesystem::path intervals_csv;  // NAME-intervals.csv
};

// The files of the plan's summary (plan.summary has no extension).
NetworkSummaryFiles network_summary_files(const NetworkPlan& plan);

// One row per site: status, period, season totals, estimates and the fit of the heads.
ReportTable sites_table(const std::vector<NetworkSite>& sites);

// One row per site and visit interval.
ReportTable intervals_table(const std::vector<NetworkSite>& sites);

struct NetworkSummary {
  ReportTable sites;
  ReportTable intervals;
};

// Writes the summary files under one new run id and returns the tables written. Throws
// base::InputError naming a file that cannot be written; then none of them appears.
NetworkSummary write_network_summary(const NetworkSummaryFiles& files, const NetworkPlan& plan,
                                     const std::vector<NetworkSite>& sites, const std::string& program_version);

}  // namespace wetfront::site
