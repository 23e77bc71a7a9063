#include "wetfront/site/season_setup.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <memory>
#include <optional>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/base/input_files.hpp"
#include "wetfront/forcing/csv_readers.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/forcing/pan_gauge.hpp"
#include "wetfront/profiles/layer_table.hpp"
#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/solver/grid.hpp"
#include "wetfront/solver/root_uptake.hpp"

namespace wetfront::site {
namespace {

// 64-bit FNV-1a over bytes: identifies the inputs of a run (not a security hash).
class InputDigest {
 public:
  void add_file(const std::filesystem::path& path) {
    add_text(path.filename().string());
    add_text(base::read_input_file(path).value_or(""));
  }
  void add_text(std::string_view text) {
    for (const char c : text) {
      hash_ ^= static_cast<unsigned char>(c);
      hash_ *= 1099511628211ULL;
    }
  }
  std::string hex() const { return fmt::format("fnv1a64:{:016x}", hash_); }

 private:
  std::uint64_t hash_ = 14695981039346656037ULL;
};

// Usual ranges (docs/site-file.md, "Plausible ranges"): outside them a note in the report.
constexpr double kUsualWaterInputPerDay_cm = 20.0;
constexpr double kUsualPanEvaporation_mm_per_day = 15.0;
constexpr std::pair<double, double> kUsualConductivity_cm_per_d{0.1, 1000.0};

std::string gap_text(const forcing::GapReport& gap, base::TimePoint start) {
  return fmt::format("{} to {}", base::format_timestamp(base::time_after(start, gap.start_day)),
                     base::format_timestamp(base::time_after(start, gap.end_day)));
}

forcing::CoveredSeries depth_file_rate(const ForcingFile& file, std::string_view quantity, const SiteSetup& site,
                                       std::vector<std::string>& notes, double& total_cm) {
  const auto series = forcing::read_depth_series_csv(file.path, quantity, site.run_start);
  // Usual range (docs/site-file.md, "Plausible ranges"): up to 200 mm in a day.
  for (const auto& iv : series.intervals) {
    if (iv.depth_cm && *iv.depth_cm > kUsualWaterInputPerDay_cm * std::max(1.0, iv.end_day - iv.start_day)) {
      notes.push_back(
          fmt::format("{}:{}: {:g} mm of {} in one interval is more than usual (up to {:g} mm a day); "
                      "used as given, check it",
                      file.path.string(), iv.source_line, *iv.depth_cm * 10, quantity, kUsualWaterInputPerDay_cm * 10));
      break;
    }
  }
  const auto conversion = forcing::depth_series_to_rate(series, site.run_length_days, file.gaps);
  if (file.gaps == forcing::GapPolicy::fill_with_zero && !conversion.gaps.empty()) {
    double days = 0;
    for (const auto& gap : conversion.gaps) days += gap.end_day - gap.start_day;
    notes.push_back(fmt::format("{}: {} stretch(es) without a record ({:.1f} d in all, first {}) taken as no water",
                                file.path.string(), conversion.gaps.size(), days,
                                gap_text(conversion.gaps.front(), site.run_start)));
  } else {
    for (const auto& gap : conversion.gaps) {
      notes.push_back(
          fmt::format("{}: records stop at {}; the run ends there", file.path.string(), gap_text(gap, site.run_start)));
    }
  }
  const auto& rate = conversion.rate_cm_per_day;
  total_cm = rate.series.integral(0.0, rate.end_day);
  return rate;
}

forcing::CoveredSeries pan_rate(const SiteSetup& site, std::vector<std::string>& notes, double& total_cm) {
  if (site.pan.daily_evaporation)
    return depth_file_rate(*site.pan.daily_evaporation, "pan_evaporation", site, notes, total_cm);
  const ForcingFile& file = *site.pan.readings;
  const auto readings = forcing::read_pan_readings_csv(file.path, site.run_start);
  const auto intervals = forcing::pan_intervals_from_readings(readings, forcing::PanGeometry{}, file.path.string());
  std::size_t outside = 0;
  for (const auto& interval : intervals) outside += interval.outside_operating_range ? 1 : 0;
  for (const auto& interval : intervals) {
    // Usual range: up to 15 mm/d of pan evaporation (hard limit in forcing/pan_gauge.hpp).
    const double days = interval.end_day - interval.start_day;
    if (interval.level_fall_mm > kUsualPanEvaporation_mm_per_day * days + forcing::kPanReadingTolerance_mm) {
      notes.push_back(fmt::format(
          "{}:{}: the pan level fell {:.1f} mm/d, more than usual (up to {:g} mm/d); used "
          "as read, check it",
          file.path.string(), interval.end_line, interval.level_fall_mm / days, kUsualPanEvaporation_mm_per_day));
      break;
    }
  }
  if (outside > 0) {
    notes.push_back(fmt::format(
        "{}: {} pan intervals start or end outside the operating band (50 to 75 mm below the rim); used as read",
        file.path.string(), outside));
  }
  const auto depths =
      forcing::pan_evaporation_depths(intervals, forcing::PanIntervalUse{}, site.run_start, file.path.string());
  const auto conversion = forcing::depth_series_to_rate(depths, site.run_length_days, file.gaps);
  for (const auto& gap : conversion.gaps) {
    notes.push_back(
        fmt::format("{}: no pan evaporation {} ({})", file.path.string(), gap_text(gap, site.run_start),
                    file.gaps == forcing::GapPolicy::fill_with_zero ? "taken as none" : "the run ends there"));
  }
  total_cm = conversion.rate_cm_per_day.series.integral(0.0, conversion.rate_cm_per_day.end_day);
  return conversion.rate_cm_per_day;
}

// The regular output times, the visits and every sensor reading time inside the run, so that
// readings are compared with the integrator's dense output rather than a time interpolation.
std::vector<double> output_days(const SiteSetup& site, double end_day, const std::vector<SensorRecord>& sensors) {
  std::vector<double> days;
  // start + index x interval: repeated addition would store 0.30000000000000004 for 0.1 x 3.
  for (std::size_t i = 0;; ++i) {
    const double t = static_cast<double>(i) * site.output_interval_days;
    if (!(t < end_day - 1e-9)) break;
    days.push_back(t);
  }
  days.push_back(end_day);
  for (const double visit : site.visit_days) {
    if (visit <= end_day + 1e-9) days.push_back(std::min(visit, end_day));
  }
  for (const auto& sensor : sensors) {
    for (const auto& o : sensor.series.observations) {
      if (o.day >= 0 && o.day <= end_day) days.push_back(o.day);
    }
  }
  std::sort(days.begin(), days.end());
  days.erase(std::unique(days.begin(), days.end(), [](double a, double b) { return std::abs(a - b) < 1e-6; }),
             days.end());
  return days;
}

// Refuses, before any output time is laid out, a run whose record would pass [run]
// output_size_limit. Estimate: per output time the two profiles (pressure head and water content
// per cell) and about 16 balance series, 8 bytes each; visits and readings add a few times more.
void check_output_size(const SiteSetup& site, double end_day, std::size_t cells) {
  const double times =
      std::floor(end_day / site.output_interval_days) + 2.0 + static_cast<double>(site.visit_days.size());
  const double bytes = times * (2.0 * static_cast<double>(cells) + 16.0) * 8.0;
  if (bytes <= site.output_size_limit_bytes) return;
  throw base::InputError(
      site.site_file.string(), 0, "run.output_interval",
      fmt::format(
          "output every {:g} d over {:g} d gives about {:.3g} output times on {} cells, a run record of about {:.3g} "
          "GB, beyond the output size limit of {:.3g} GB: choose a longer output_interval, or raise [run] "
          "output_size_limit (e.g. output_size_limit = \"{:.0f} GB\") if the machine has the memory and disk",
          site.output_interval_days, end_day, times, cells, bytes / 1e9, site.output_size_limit_bytes / 1e9,
          std::ceil(bytes / 1e9)));
}

// The parts of a Season gathered before its column problem can be built.
struct Seasonal {
  SiteSetup site;
  double pan_coefficient = 0;
  forcing::SurfaceDemand demand;
  ForcingTotals totals;
  std::vector<std::string> notes;
};

}  // namespace

FieldRecords read_field_records(const SiteSetup& site) {
  FieldRecords records;
  for (const auto& layer : site.layers) {
    const double ks = soils::saturated_conductivity(layer.model);
    if (ks < kUsualConductivity_cm_per_d.first || ks > kUsualConductivity_cm_per_d.second)
      records.notes.push_back(
          fmt::format("layer '{}': saturated conductivity {:g} cm/d is outside the usual range "
                      "({:g} to {:g} cm/d); used as given, check it",
                      layer.name, ks, kUsualConductivity_cm_per_d.first, kUsualConductivity_cm_per_d.second));
  }
  InputDigest digest;
  digest.add_file(site.site_file);
  digest.add_text(site.run_start_text + "/" + site.run_end_text);
  records.water_inputs_cm_per_day.push_back(
      depth_file_rate(site.rain, "rain", site, records.notes, records.totals.rain_cm));
  digest.add_file(site.rain.path);
  if (site.irrigation) {
    records.water_inputs_cm_per_day.push_back(
        depth_file_rate(*site.irrigation, "irrigation", site, records.notes, records.totals.irrigation_cm));
    digest.add_file(site.irrigation->path);
  }
  records.pan_evaporation_cm_per_day = pan_rate(site, records.notes, records.totals.pan_evaporation_cm);
  digest.add_file(site.pan.readings ? site.pan.readings->path : site.pan.daily_evaporation->path);
  for (const auto& sensor : site.sensors) digest.add_file(sensor.readings);
  records.sensor_readings = read_sensor_readings(site);
  records.input_hash = digest.hex();
  return records;
}

Season prepare_season(SiteSetup site) {
  const FieldRecords records = read_field_records(site);
  return build_season(std::move(site), records);
}

Season build_season(SiteSetup site_setup, const FieldRecords& records) {
  Seasonal season;
  season.site = std::move(site_setup);
  season.totals = records.totals;
  season.notes = records.notes;
  const SiteSetup& site = season.site;
  const std::string site_file = site.site_file.string();

  forcing::SurfaceDemandInputs inputs;
  inputs.run_length_days = site.run_length_days;
  inputs.water_inputs = records.water_inputs_cm_per_day;
  inputs.pan_evaporation = records.pan_evaporation_cm_per_day;
  try {
    season.pan_coefficient = forcing::pan_coefficient(site.pan.coefficient);
    inputs.crop = forcing::CropFromReference{season.pan_coefficient, site.crop.kc_curve};
    inputs.split = site.crop.split;
    inputs.root_depth_cm = site.crop.root_depth_cm;
    inputs.max_step_days = 1.0;
    season.demand = forcing::surface_demand(inputs);
  } catch (const base::InputError& error) {
    throw base::InputError(site_file, 0, "",
                           fmt::format("surface demand from [weather], [pan] and [crop]: {}", error.what()));
  }
  const double end_day = season.demand.end_day;
  if (end_day < site.run_length_days - 1e-9) {
    season.notes.push_back(fmt::format("the run stops at {} instead of {}, where the field records stop",
                                       base::format_timestamp(base::time_after(site.run_start, end_day)),
                                       site.run_end_text));
  }
  season.totals.potential_transpiration_cm = season.demand.potential_transpiration_cm_per_day.integral(0.0, end_day);

  std::optional<soils::LayeredProfile> soil;
  std::optional<solver::Grid> grid;
  try {
    soil.emplace(site.layers);
    grid.emplace(solver::graded_grid(site.grid));
  } catch (const std::invalid_argument& error) {
    throw base::InputError(site_file, 0, "", fmt::format("[[layer]] / [grid]: {}", error.what()));
  }
  check_output_size(site, end_day, grid->cell_count());
  std::shared_ptr<const solver::CellSink> roots;
  try {
    solver::RootUptakeSettings uptake{site.crop.uptake_response, site.crop.root_shape, season.demand.root_depth_cm,
                                      season.demand.potential_transpiration_cm_per_day};
    roots = std::make_shared<solver::RootUptake>(std::move(uptake), *grid);
  } catch (const std::invalid_argument& error) {
    throw base::InputError(site_file, 0, "", fmt::format("[crop] root uptake: {}", error.what()));
  }
  solver::ColumnProblem problem{
      .soil = std::move(*soil),
      .grid = std::move(*grid),
      .top = solver::LimitedFlux{season.demand.water_input_cm_per_day, season.demand.potential_evaporation_cm_per_day,
                                 site.dry_limit_head_cm, site.max_ponded_depth_cm},
      .bottom = site.bottom,
      .initial = site.initial,
      .sink = std::move(roots),
      .flux_plane_depths_cm = {site.recharge_plane_depth_cm},
      .specific_storage_per_cm = site.specific_storage_per_cm,
      .face_conductivity = site.face_conductivity,
      .start_day = 0,
      .end_day = end_day,
      .output_days = output_days(site, end_day, records.sensor_readings),
      .settings = site.settings};
  return Season{.site = std::move(season.site),
                .pan_coefficient = season.pan_coefficient,
                .demand = std::move(season.demand),
                .problem = std::move(problem),
                .totals = season.totals,
                .roots_simulated = true,
                .notes = std::move(season.notes),
                .input_hash = records.input_hash,
                .sensor_readings = records.sensor_readings};
}

profiles::RunRecord make_record(const Season& season, solver::ColumnRun run, const std::string& program_version) {
  const SiteSetup& site = season.site;
  profiles::RunRecord record;
  record.site_name = site.name;
  record.run_start_date = site.run_start_text;
  record.program_version = program_version;
  record.input_hash = season.input_hash;
  record.layers = profiles::describe_layers(season.problem.soil);
  for (const auto& sensor : site.sensors)
    record.sensors.push_back({sensor.name + " (" + sensor.kind + ")", sensor.depth_cm});
  record.flux_plane_depths_cm = season.problem.flux_plane_depths_cm;
  const auto& d = season.demand;
  for (std::size_t i = 0; i < d.water_input_cm_per_day.start_days.size(); ++i) {
    const double start = d.water_input_cm_per_day.start_days[i];
    const double end =
        i + 1 < d.water_input_cm_per_day.start_days.size() ? d.water_input_cm_per_day.start_days[i + 1] : d.end_day;
    if (end <= start) continue;
    record.forcing.push_back({start, end, d.water_input_cm_per_day.values[i],
                              d.potential_evaporation_cm_per_day.values[i],
                              d.potential_transpiration_cm_per_day.values[i]});
  }
  const double reached = run.balances.empty() ? 0.0 : run.balances.back().time_days;
  for (const double visit : site.visit_days) {
    if (visit > 1e-9 && visit <= reached + 1e-6) record.visit_days.push_back(visit);
  }
  record.run = std::move(run);
  if (!record.run.balances.empty()) {
    record.visit_balance = profiles::balance_between_visits(record.run.balances, record.visit_days);
  }
  return record;
}

}  // namespace wetfront::site
