#include "wetfront/site/network_summary.hpp"

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/site/season_tables.hpp"

namespace wetfront::site {
namespace {

std::string mm_or_blank(const std::optional<double>& cm) { return cm ? mm(*cm) : std::string(); }

}  // namespace

NetworkSummaryFiles network_summary_files(const NetworkPlan& plan) {
  const std::string summary = plan.summary.string();
  return {summary + ".h5", summary + "-sites.csv", summary + "-intervals.csv"};
}

ReportTable sites_table(const std::vector<NetworkSite>& sites) {
  ReportTable table;
  table.title =
      "Network: season per site [mm] (fluxes positive downward; field estimates summed over the visit intervals "
      "that have one; blank where none)";
  table.headers = {"site",
                   "status",
                   "from",
                   "to",
                   "plane [cm]",
                   "rain + irrigation [mm]",
                   "evaporation [mm]",
                   "transpiration [mm]",
                   "runoff [mm]",
                   "storage change [mm]",
                   "drainage at plane [mm]",
                   "Darcy estimate [mm]",
                   "water-table estimate [mm]",
                   "head RMSE [cm]",
                   "head bias [cm]",
                   "head readings",
                   "site file",
                   "reason"};
  for (const auto& s : sites) {
    if (!s.has_run()) {
      std::vector<std::string> row{s.name, status_text(s.status)};
      row.resize(table.headers.size() - 2);
      row.push_back(s.site_file.string());
      row.push_back(s.reason);
      table.add_row(std::move(row));
      continue;
    }
    table.add_row({s.name, status_text(s.status), s.run_start, s.run_end, number(s.plane_depth_cm),
                   mm(s.water_input_cm), mm(s.evaporation_cm), mm(s.transpiration_cm), mm(s.runoff_cm),
                   mm(s.storage_change_cm), mm(s.drainage_cm), mm_or_blank(s.darcy_cm), mm_or_blank(s.water_table_cm),
                   s.head_rmse_cm ? number(*s.head_rmse_cm) : "", s.head_bias_cm ? number(*s.head_bias_cm) : "",
                   fmt::format("{}", s.head_readings), s.site_file.string(), s.reason});
  }
  return table;
}

ReportTable intervals_table(const std::vector<NetworkSite>& sites) {
  ReportTable table;
  table.title = "Network: recharge per visit interval [mm] (positive downward)";
  table.headers = {"site", "from", "to", "drainage at plane [mm]", "Darcy estimate [mm]", "water-table estimate [mm]"};
  for (const auto& s : sites) {
    for (const auto& i : s.intervals) {
      table.add_row({s.name, i.start_date, i.end_date, mm(i.drainage_cm), mm_or_blank(i.darcy_cm),
                     mm_or_blank(i.water_table_cm)});
    }
  }
  return table;
}

NetworkSummary write_network_summary(const NetworkSummaryFiles& files, const NetworkPlan& plan,
                                     const std::vector<NetworkSite>& sites, const std::string& program_version) {
  const std::string run_id = new_run_id();
  NetworkSummary summary{sites_table(sites), intervals_table(sites)};
  summary.sites.run_id = summary.intervals.run_id = run_id;
  write_files_together({{files.sites_csv, summary.sites}, {files.intervals_csv, summary.intervals}}, [&] {
    try {
      profiles::write_study(files.study_file, network_record(plan, sites, program_version, run_id));
    } catch (const profiles::RunFileError& error) {
      throw base::InputError(error.what());
    }
  });
  return summary;
}

}  // namespace wetfront::site
