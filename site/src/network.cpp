#include "wetfront/site/network.hpp"

#include <array>
#include <cmath>
#include <cstdint>
#include <mutex>
#include <set>
#include <string_view>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/base/time_point.hpp"
#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/site/season_tables.hpp"
#include "wetfront/site/site_keys.hpp"
#include "wetfront/studies/parallel_batch.hpp"

namespace wetfront::site {
namespace {

constexpr double kMissing = std::numeric_limits<double>::quiet_NaN();

// The estimate for the interval ending at end_day, if it has one.
std::optional<double> estimate_for(const std::vector<EstimateInterval>& intervals, double start_day, double end_day) {
  for (const auto& i : intervals) {
    if (std::abs(i.end_day - end_day) < 1e-9 && std::abs(i.start_day - start_day) < 1e-9) return i.estimate_cm;
  }
  return std::nullopt;
}

// The sum over the intervals that have an estimate; empty when none has one.
std::optional<double> total_of(const std::vector<NetworkInterval>& intervals,
                               std::optional<double> NetworkInterval::*member) {
  std::optional<double> sum;
  for (const auto& i : intervals) {
    if (i.*member) sum = sum.value_or(0.0) + *(i.*member);
  }
  return sum;
}

void check_distinct(const std::vector<std::filesystem::path>& files, const std::string& where) {
  std::set<std::filesystem::path> seen;
  for (const auto& f : files) {
    const auto key = std::filesystem::weakly_canonical(f);
    if (!seen.insert(key).second)
      throw base::InputError(
          fmt::format("{}: the site file {} is listed twice (its run file would be written twice)", where, f.string()));
  }
}

}  // namespace

std::string status_text(SiteStatus status) {
  switch (status) {
    case SiteStatus::done: return "done";
    case SiteStatus::bad_input: return "bad input";
    case SiteStatus::solver_failure: return "solver failure";
    case SiteStatus::program_fault: return "program fault";
  }
  return "unknown";
}

NetworkPlan load_network_file(const std::filesystem::path& network_file) {
  const toml::table document = read_site_document(network_file);
  const SiteTable root(document, "", network_file.string());
  static constexpr std::array<std::string_view, 3> kKeys{"name", "sites", "summary"};
  root.only_keys(kKeys);
  NetworkPlan plan;
  plan.name = root.optional_text("name").value_or(network_file.stem().string());
  const std::filesystem::path folder = network_file.parent_path();
  const std::vector<std::string> sites = root.text_list("sites");
  if (sites.empty()) root.fail("sites", "lists no site files; expected at least one path to a site file");
  for (const auto& s : sites) plan.site_files.push_back(folder / s);
  std::set<std::filesystem::path> seen;
  for (std::size_t i = 0; i < plan.site_files.size(); ++i) {
    if (!seen.insert(std::filesystem::weakly_canonical(plan.site_files[i])).second)
      root.fail_entry(
          "sites", i,
          fmt::format("{} is listed twice; each site file once (its run file would be written twice)", sites[i]));
  }
  const std::string summary = root.optional_text("summary").value_or(network_file.stem().string());
  if (summary.empty()) root.fail("summary", "is empty; expected a file name without extension, e.g. \"network\"");
  plan.summary = folder / summary;
  const auto summary_folder = plan.summary.parent_path();
  if (!summary_folder.empty() && !std::filesystem::is_directory(summary_folder))
    root.fail("summary", fmt::format("names the folder {}, which does not exist", summary_folder.string()));
  return plan;
}

NetworkPlan network_of_sites(std::vector<std::filesystem::path> site_files, std::filesystem::path summary) {
  if (site_files.empty()) throw base::InputError("no site files given; expected one or more site files (TOML)");
  check_distinct(site_files, "command line");
  const auto folder = summary.parent_path();
  if (!folder.empty() && !std::filesystem::is_directory(folder))
    throw base::InputError(
        fmt::format("--summary {}: the folder {} does not exist", summary.string(), folder.string()));
  NetworkPlan plan;
  plan.name = summary.stem().string();
  plan.site_files = std::move(site_files);
  plan.summary = std::move(summary);
  return plan;
}

NetworkSite summarise_site(const std::filesystem::path& site_file, const SeasonResult& result) {
  const profiles::RunRecord& record = result.record;
  NetworkSite site;
  site.site_file = site_file;
  site.name = record.site_name;
  site.status = result.complete ? SiteStatus::done : SiteStatus::solver_failure;
  if (!result.complete) {
    const auto& failure = record.run.failure;
    site.reason = failure && !failure->reason.empty() ? failure->reason : std::string("the solver stopped early");
  }
  site.run_start = record.run_start_date;
  site.input_hash = record.input_hash;
  const double reached = record.run.balances.empty() ? 0.0 : record.run.balances.back().time_days;
  site.run_end = date_after(record.run_start_date, reached);
  if (!record.flux_plane_depths_cm.empty()) site.plane_depth_cm = record.flux_plane_depths_cm.front();
  const profiles::IntervalBalance total = profiles::season_total(record.run.balances);
  site.water_input_cm = total.water_input_cm;
  site.runoff_cm = total.runoff_cm;
  site.evaporation_cm = total.actual_evaporation_cm;
  site.transpiration_cm = total.transpiration_cm;
  site.storage_change_cm = total.storage_change_cm + total.ponded_change_cm;
  site.drainage_cm = total.plane_flux_cm.empty() ? 0.0 : total.plane_flux_cm.front();
  site.bottom_flux_cm = total.bottom_flux_cm;
  const SensorCheck& sensors = result.sensors;
  for (const auto& b : record.visit_balance) {
    NetworkInterval i;
    i.start_day = b.start_day;
    i.end_day = b.end_day;
    i.start_date = date_after(record.run_start_date, b.start_day);
    i.end_date = date_after(record.run_start_date, b.end_day);
    i.drainage_cm = b.plane_flux_cm.empty() ? 0.0 : b.plane_flux_cm.front();
    if (sensors.darcy) i.darcy_cm = estimate_for(sensors.darcy->intervals, b.start_day, b.end_day);
    if (sensors.water_table) i.water_table_cm = estimate_for(sensors.water_table->intervals, b.start_day, b.end_day);
    site.intervals.push_back(std::move(i));
  }
  if (sensors.darcy) site.darcy_cm = total_of(site.intervals, &NetworkInterval::darcy_cm);
  if (sensors.water_table) site.water_table_cm = total_of(site.intervals, &NetworkInterval::water_table_cm);
  for (const auto& row : sensors.pooled) {
    if (row.quantity != "pressure head" || row.metrics.count == 0) continue;
    site.head_readings = row.metrics.count;
    site.head_rmse_cm = row.metrics.root_mean_square_error;
    site.head_bias_cm = row.metrics.bias;
  }
  return site;
}

NetworkSite run_network_site(const std::filesystem::path& file, const std::string& program_version,
                             const SiteFinished& finished, const SiteStarting& starting) {
  NetworkSite site;
  site.site_file = file;
  site.name = file.stem().string();
  // Every exception of a site is caught here, so a network never stops early.
  try {
    const SiteSetup setup = load_site_file(file);
    site.name = setup.name;
    if (starting) starting(setup);
    const SeasonResult result = run_season(setup, program_version);
    site = summarise_site(file, result);
    if (finished) {
      try {
        finished(result);
      } catch (const std::exception& error) {
        // The run is summarised, but its own files are not there: the site counts as failed.
        site.status = SiteStatus::bad_input;
        site.reason = fmt::format("its run files could not be written: {}", error.what());
      }
    }
  } catch (const base::InputError& error) {
    site.status = SiteStatus::bad_input;
    site.reason = error.what();
  } catch (const std::exception& error) {
    site.status = SiteStatus::program_fault;
    site.reason = error.what();
  }
  return site;
}

std::vector<NetworkSite> run_network(const NetworkPlan& plan, unsigned threads, const std::string& program_version,
                                     const SiteFinished& finished, const NetworkProgress& progress,
                                     const SiteStarting& starting) {
  std::vector<NetworkSite> sites(plan.site_files.size());
  std::mutex progress_lock;
  std::size_t done = 0;
  studies::run_batch(sites.size(), threads, [&](std::size_t k) {
    NetworkSite& site = sites[k];
    site = run_network_site(plan.site_files[k], program_version, finished, starting);
    if (progress) {
      const std::lock_guard lock(progress_lock);
      progress(++done, site);
    }
  });
  return sites;
}

profiles::StudyRecord network_record(const NetworkPlan& plan, const std::vector<NetworkSite>& sites,
                                     const std::string& program_version, const std::string& run_id) {
  using profiles::StudyColumn;
  using profiles::StudyTextColumn;
  profiles::StudyRecord record;
  record.study_kind = "plot network";
  record.site_name = plan.name;
  record.program_version = program_version;
  record.run_id = run_id;
  record.run_start_date = "1970-01-01";  // no common time axis: every date is stored as text
  for (const auto& s : sites) {
    if (s.has_run()) {
      record.run_start_date = s.run_start;
      break;
    }
  }
  // FNV-1a over every site's input digest and status, in network order.
  std::uint64_t hash = 1469598103934665603ULL;
  for (const auto& s : sites) {
    for (const char c : s.input_hash + "|" + status_text(s.status) + ";") {
      hash = (hash ^ static_cast<unsigned char>(c)) * 1099511628211ULL;
    }
  }
  record.input_hash = fmt::format("{:016x}", hash);
  record.notes.push_back({"network_sites", fmt::format("{}", sites.size())});
  record.notes.push_back({"dates", "every date is ISO 8601 text; day columns count from each site's own run start"});

  profiles::StudyTable table;
  table.group = "sites";
  table.axis = {"site_number", "1", "number of the site in the network (listed order)", {}};
  StudyTextColumn name{"name", "site name", {}}, file{"site_file", "site file", {}},
      status{"status", "done, bad input, solver failure or program fault", {}},
      reason{"reason", "why the site did not finish (empty when done)", {}}, start{"run_start", "run start date", {}},
      end{"run_end", "date the run reached", {}};
  auto mm = [](std::string n, std::string l) { return StudyColumn{std::move(n), "mm", std::move(l), {}}; };
  StudyColumn plane{"recharge_plane_depth", "cm", "depth of the recharge plane below the surface", {}};
  StudyColumn input = mm("water_input", "rain and irrigation reaching the surface over the run"),
              runoff = mm("runoff", "runoff over the run"), evap = mm("evaporation", "evaporation over the run"),
              transp = mm("transpiration", "transpiration over the run"),
              storage = mm("storage_change", "soil and ponded water, end minus start"),
              drainage = mm("drainage", "model drainage across the recharge plane over the run (positive down)"),
              bottom = mm("bottom_flux", "net downward flux out of the column bottom over the run"),
              darcy = mm("darcy_estimate", "Darcy recharge estimate summed over the visit intervals that have one"),
              table_est = mm("water_table_estimate",
                             "water-table-fluctuation recharge estimate summed over the visit intervals that have one"),
              rmse{"head_rmse", "cm", "root mean square error of simulated pressure heads, all tensiometers", {}},
              bias{"head_bias", "cm", "mean simulated minus observed pressure head, all tensiometers", {}},
              count{"head_readings", "1", "tensiometer readings compared", {}};
  auto opt = [](const std::optional<double>& v, double scale = kMmPerCm) { return v ? *v * scale : kMissing; };
  for (std::size_t k = 0; k < sites.size(); ++k) {
    const NetworkSite& s = sites[k];
    const bool ran = s.has_run();
    table.axis.values.push_back(static_cast<double>(k + 1));
    name.values.push_back(s.name);
    file.values.push_back(s.site_file.string());
    status.values.push_back(status_text(s.status));
    reason.values.push_back(s.reason);
    start.values.push_back(s.run_start);
    end.values.push_back(s.run_end);
    plane.values.push_back(s.plane_depth_cm);
    auto put = [&](StudyColumn& c, double cm) { c.values.push_back(ran ? cm * kMmPerCm : kMissing); };
    put(input, s.water_input_cm);
    put(runoff, s.runoff_cm);
    put(evap, s.evaporation_cm);
    put(transp, s.transpiration_cm);
    put(storage, s.storage_change_cm);
    put(drainage, s.drainage_cm);
    put(bottom, s.bottom_flux_cm);
    darcy.values.push_back(opt(s.darcy_cm));
    table_est.values.push_back(opt(s.water_table_cm));
    rmse.values.push_back(opt(s.head_rmse_cm, 1.0));
    bias.values.push_back(opt(s.head_bias_cm, 1.0));
    count.values.push_back(s.head_readings);
  }
  table.texts = {name, file, status, reason, start, end};
  table.columns = {plane, input, runoff, evap, transp, storage, drainage, bottom, darcy, table_est, rmse, bias, count};

  profiles::StudyTable intervals;
  intervals.group = "intervals";
  intervals.axis = {"interval_number", "1", "row: one visit interval of one site", {}};
  StudyColumn site_number{"site_number", "1", "number of the site (see /sites)", {}};
  StudyTextColumn from{"start_date", "start of the visit interval", {}},
      to{"end_date", "end of the visit interval", {}};
  StudyColumn i_drainage = mm("drainage", "model drainage across the recharge plane (positive down)"),
              i_darcy = mm("darcy_estimate", "Darcy recharge estimate from a tensiometer pair"),
              i_table = mm("water_table_estimate", "water-table-fluctuation recharge estimate");
  std::size_t row = 0;
  for (std::size_t k = 0; k < sites.size(); ++k) {
    for (const auto& i : sites[k].intervals) {
      intervals.axis.values.push_back(static_cast<double>(++row));
      site_number.values.push_back(static_cast<double>(k + 1));
      from.values.push_back(i.start_date);
      to.values.push_back(i.end_date);
      i_drainage.values.push_back(i.drainage_cm * kMmPerCm);
      i_darcy.values.push_back(opt(i.darcy_cm));
      i_table.values.push_back(opt(i.water_table_cm));
    }
  }
  intervals.texts = {from, to};
  intervals.columns = {site_number, i_drainage, i_darcy, i_table};
  record.tables = {table, intervals};
  return record;
}

}  // namespace wetfront::site
