#include "wetfront/site/anchored_output.hpp"

#include <cmath>
#include <functional>
#include <limits>

#include <fmt/format.h>

#include "study_tables.hpp"
#include "wetfront/site/sensor_readings.hpp"

namespace wetfront::site {
namespace {

using profiles::StudyColumn;

constexpr double kMissing = std::numeric_limits<double>::quiet_NaN();
constexpr double kMmPerCm = 10.0;

std::string mm(double cm) { return std::isnan(cm) ? "" : number(cm * kMmPerCm); }

double estimate_at(const std::vector<EstimateInterval>& intervals, double end_day) {
  for (const auto& interval : intervals)
    if (std::abs(interval.end_day - end_day) < 1e-6 && interval.estimate_cm) return *interval.estimate_cm;
  return kMissing;
}
double darcy_at(const AnchoredSeason& season, double end_day) {
  return season.darcy ? estimate_at(season.darcy->intervals, end_day) : kMissing;
}
double water_table_at(const AnchoredSeason& season, double end_day) {
  return season.water_table ? estimate_at(season.water_table->intervals, end_day) : kMissing;
}
double free_run_at(const AnchoredSeason& season, std::size_t interval) {
  return interval < season.free_run_drainage_cm.size() ? season.free_run_drainage_cm[interval] : kMissing;
}

// Mean innovation and mean forecast spread of one quantity's readings at a visit (NaN: none).
struct QuantitySummary {
  std::size_t readings = 0;
  double innovation = kMissing;
  double spread = kMissing;
};
QuantitySummary summary(const VisitUpdate& visit, std::string_view quantity) {
  QuantitySummary s;
  double innovation = 0, spread = 0;
  for (const auto& r : visit.readings) {
    if (r.quantity != quantity) continue;
    ++s.readings;
    innovation += r.value - r.forecast_mean;
    spread += r.forecast_spread;
  }
  if (s.readings > 0) {
    s.innovation = innovation / static_cast<double>(s.readings);
    s.spread = spread / static_cast<double>(s.readings);
  }
  return s;
}

EnsembleBand increment_band(const VisitUpdate& visit) {
  std::vector<double> values;
  for (double v : visit.stored_water_increment_cm)
    if (!std::isnan(v)) values.push_back(v);
  return ensemble_band(values);
}

// A table given column by column: each header beside how a row's cell reads.
template <class Row>
struct TableColumn {
  std::string header;
  std::function<std::string(const Row&)> cell;
};
template <class Row>
ReportTable column_table(std::string title, const std::vector<TableColumn<Row>>& columns,
                         const std::vector<Row>& rows) {
  ReportTable table;
  table.title = std::move(title);
  for (const auto& column : columns) table.headers.push_back(column.header);
  for (const Row& row : rows) {
    std::vector<std::string> cells;
    for (const auto& column : columns) cells.push_back(column.cell(row));
    table.add_row(std::move(cells));
  }
  return table;
}

}  // namespace

ReportTable anchored_interval_table(const AnchoredSeason& season) {
  const auto drainage = [&](std::size_t i) { return drainage_band(season, i); };
  const auto end = [&](std::size_t i) { return season.interval_end_days[i]; };
  std::vector<TableColumn<std::size_t>> columns{
      {"from", [&](std::size_t i) { return i == 0 ? std::string("start") : season.interval_end_dates[i - 1]; }},
      {"to", [&](std::size_t i) { return season.interval_end_dates[i]; }},
      {"free run [mm]", [&](std::size_t i) { return mm(free_run_at(season, i)); }},
      {"anchored mean [mm]", [&](std::size_t i) { return mm(drainage(i).mean); }},
      {"anchored 5 % [mm]", [&](std::size_t i) { return mm(drainage(i).lower); }},
      {"anchored 95 % [mm]", [&](std::size_t i) { return mm(drainage(i).upper); }},
      {"Darcy [mm]", [&](std::size_t i) { return mm(darcy_at(season, end(i))); }},
      {"water table [mm]", [&](std::size_t i) { return mm(water_table_at(season, end(i))); }},
      {"update mean [mm]", [&](std::size_t i) { return mm(update_band(season, i).mean); }}};
  if (season.settings.update_parameters)
    columns.push_back({"of which new soils [mm]", [&](std::size_t i) { return mm(soil_change_band(season, i).mean); }});
  std::vector<std::size_t> intervals(season.interval_end_days.size());
  for (std::size_t i = 0; i < intervals.size(); ++i) intervals[i] = i;
  return column_table("Drainage at the recharge plane per visit interval (positive downward)", columns, intervals);
}

ReportTable anchored_visit_table(const AnchoredSeason& season) {
  struct VisitRow {
    const VisitUpdate* visit;
    QuantitySummary heads, contents;
    EnsembleBand added;
  };
  const auto value = [](double v) { return std::isnan(v) ? std::string() : number(v, 3); };
  const std::vector<TableColumn<VisitRow>> columns{
      {"visit", [](const VisitRow& r) { return r.visit->date; }},
      {"readings", [](const VisitRow& r) { return std::to_string(r.visit->readings.size()); }},
      {"head innovation [cm]", [&](const VisitRow& r) { return value(r.heads.innovation); }},
      {"head spread [cm]", [&](const VisitRow& r) { return value(r.heads.spread); }},
      {"water content innovation [cm3/cm3]", [&](const VisitRow& r) { return value(r.contents.innovation); }},
      {"water content spread [cm3/cm3]", [&](const VisitRow& r) { return value(r.contents.spread); }},
      {"stored water added mean [mm]", [](const VisitRow& r) { return mm(r.added.mean); }},
      {"added 5 % [mm]", [](const VisitRow& r) { return mm(r.added.lower); }},
      {"added 95 % [mm]", [](const VisitRow& r) { return mm(r.added.upper); }},
      {"warning", [](const VisitRow& r) {
         std::string warning = r.visit->collapsed ? "collapsed" : "";
         if (r.visit->outside) warning += warning.empty() ? "outside spread" : "; outside spread";
         return warning;
       }}};
  std::vector<VisitRow> rows;
  for (const auto& visit : season.visits)
    rows.push_back({&visit, summary(visit, kPressureHead), summary(visit, kWaterContent), increment_band(visit)});
  return column_table("Updates at the visits (innovation = reading - forecast mean)", columns, rows);
}

void write_anchored_file(const std::filesystem::path& path, const SiteSetup& site, const ParameterStudy& study,
                         const AnchoredSeason& season, const std::string& program_version, const std::string& run_id) {
  profiles::StudyRecord record =
      detail::study_record(site, study, season.input_hash, "anchored season", program_version, run_id);
  const AnchorSettings& s = season.settings;
  // The readings weigh in through their uncertainties, not through a calibration's objective.
  std::erase_if(record.notes, [](const auto& note) { return note.first == "objective"; });
  record.notes.push_back(
      {"method",
       "ensemble Kalman filter with perturbed readings (Evensen 1994; Burgers, van "
       "Leeuwen & Evensen 1998); update variable: pressure head of every cell as log10(1 cm + suction)"});
  record.notes.push_back({"members", std::to_string(s.members)});
  record.notes.push_back({"seed", std::to_string(s.seed)});
  record.notes.push_back(
      {"members_drawn_from", s.calibration_file.empty()
                                 ? "the [[adjustable]] ranges (Latin hypercube)"
                                 : fmt::format("the calibrated values and covariance of {}, truncated to the ranges",
                                               s.calibration_file.string())});
  record.notes.push_back({"localisation_reach", fmt::format("{} cm (Gaspari-Cohn weights, zero beyond twice this; 0: "
                                                            "none)",
                                                            s.reach_cm)});
  record.notes.push_back({"parameters_updated", s.update_parameters ? "yes (state augmentation)" : "no"});
  std::string warnings;
  for (const auto& w : season.warnings) warnings += w + "\n";
  record.notes.push_back({"warnings", warnings});
  record.tables.push_back(detail::parameter_table(study));

  const std::size_t members = season.members.size();
  const StudyColumn member_axis{"member", "1", "number of the ensemble member", {}};
  StudyColumn member_numbers = member_axis;
  for (std::size_t j = 0; j < members; ++j) member_numbers.values.push_back(static_cast<double>(j + 1));

  profiles::StudyTable intervals;
  intervals.group = "intervals";
  intervals.axis = {"interval_end", "days since run start",
                    "end of the visit interval (its start is the previous end, or the run start)",
                    season.interval_end_days};
  StudyColumn free_run{
      "free_run_drainage", "cm", "drainage at the recharge plane of the free run with the site's values", {}};
  StudyColumn mean{"drainage_mean", "cm", "ensemble mean of the drainage at the recharge plane", {}};
  StudyColumn lower{"drainage_5th_percentile", "cm", "5th percentile of the members' drainage", {}};
  StudyColumn upper{"drainage_95th_percentile", "cm", "95th percentile of the members' drainage", {}};
  StudyColumn darcy{"darcy_estimate", "cm", "Darcy estimate from the tensiometer pair (NaN: none)", {}};
  StudyColumn water_table{"water_table_estimate", "cm", "water-table-fluctuation estimate (NaN: none)", {}};
  profiles::StudyMatrix drainage{
      "member_drainage", "cm", "each member's drainage at the recharge plane (positive downward)", member_numbers, {}};
  profiles::StudyMatrix update{"member_update",
                               "cm",
                               "stored water each member's update added at the interval's start (negative: removed)",
                               member_numbers,
                               {}};
  profiles::StudyMatrix soil_change{"member_soil_change",
                                    "cm",
                                    "part of member_update: the stored water a parameter update's new soil holds "
                                    "more at the same heads (0 without parameter updates)",
                                    member_numbers,
                                    {}};
  for (std::size_t i = 0; i < season.interval_end_days.size(); ++i) {
    const EnsembleBand band = drainage_band(season, i);
    free_run.values.push_back(free_run_at(season, i));
    mean.values.push_back(band.mean);
    lower.values.push_back(band.lower);
    upper.values.push_back(band.upper);
    darcy.values.push_back(darcy_at(season, season.interval_end_days[i]));
    water_table.values.push_back(water_table_at(season, season.interval_end_days[i]));
    for (std::size_t j = 0; j < members; ++j) {
      const bool ok = season.member_complete[j];
      drainage.values.push_back(ok ? season.members[j][i].drainage_cm : kMissing);
      update.values.push_back(ok ? season.members[j][i].update_cm : kMissing);
      soil_change.values.push_back(ok ? season.members[j][i].soil_change_cm : kMissing);
    }
  }
  intervals.columns = {free_run, mean, lower, upper, darcy, water_table};
  intervals.matrices = {drainage, update, soil_change};
  record.tables.push_back(std::move(intervals));

  profiles::StudyTable visits;
  visits.group = "visits";
  visits.axis = {"visit", "days since run start", "time of the visit whose readings updated the members", {}};
  StudyColumn count{"readings", "1", "readings used in the update", {}};
  profiles::StudyMatrix added{
      "stored_water_added", "cm", "stored water each member's update added (NaN: member failed)", member_numbers, {}};
  for (const auto& visit : season.visits) {
    visits.axis.values.push_back(visit.day);
    count.values.push_back(static_cast<double>(visit.readings.size()));
    added.values.insert(added.values.end(), visit.stored_water_increment_cm.begin(),
                        visit.stored_water_increment_cm.end());
  }
  visits.columns = {count};
  visits.matrices = {added};
  if (!season.visits.empty()) record.tables.push_back(std::move(visits));

  profiles::StudyTable readings;
  readings.group = "readings";
  readings.axis = {"reading", "1", "number of the reading used", {}};
  profiles::StudyTextColumn sensor{"sensor", "sensor that gave the reading", {}};
  profiles::StudyTextColumn quantity{"quantity", "pressure head (cm) or water content (cm3/cm3)", {}};
  // Each numeric column beside how a reading at its visit gives its value.
  using ReadingValue = double (*)(const VisitUpdate&, const VisitReading&);
  std::vector<std::pair<StudyColumn, ReadingValue>> numeric{
      {{"visit_time", "days since run start", "visit the reading updated", {}},
       [](const VisitUpdate& v, const VisitReading&) { return v.day; }},
      {{"depth", "cm", "depth below the soil surface", {}},
       [](const VisitUpdate&, const VisitReading& r) { return r.depth_cm; }},
      {{"value", "", "the reading, in the unit of its quantity", {}},
       [](const VisitUpdate&, const VisitReading& r) { return r.value; }},
      {{"uncertainty", "", "reading uncertainty (standard deviation), in the unit of its quantity", {}},
       [](const VisitUpdate&, const VisitReading& r) { return r.uncertainty; }},
      {{"forecast_mean", "", "members' mean forecast of the reading", {}},
       [](const VisitUpdate&, const VisitReading& r) { return r.forecast_mean; }},
      {{"forecast_spread", "", "standard deviation of the members' forecasts", {}},
       [](const VisitUpdate&, const VisitReading& r) { return r.forecast_spread; }},
      {{"analysis_mean", "", "members' mean after the update", {}},
       [](const VisitUpdate&, const VisitReading& r) { return r.analysis_mean; }}};
  for (const auto& visit : season.visits) {
    for (const auto& r : visit.readings) {
      readings.axis.values.push_back(static_cast<double>(readings.axis.values.size() + 1));
      sensor.values.push_back(r.sensor);
      quantity.values.push_back(r.quantity);
      for (auto& [column, value_of] : numeric) column.values.push_back(value_of(visit, r));
    }
  }
  readings.texts = {sensor, quantity};
  for (auto& entry : numeric) readings.columns.push_back(std::move(entry.first));
  if (!readings.axis.values.empty()) record.tables.push_back(std::move(readings));

  profiles::StudyTable member_table;
  member_table.group = "members";
  member_table.axis = member_numbers;
  StudyColumn complete{"complete", "1", "1 when the member ran the whole season, else 0", {}};
  StudyColumn parameter_axis{"parameter_number", "1", "number of the adjustable parameter (site-file order)", {}};
  for (std::size_t k = 0; k < study.parameters.size(); ++k) parameter_axis.values.push_back(static_cast<double>(k + 1));
  profiles::StudyMatrix drawn{
      "drawn_values", "", "parameter values as drawn, in the unit of each parameter", parameter_axis, {}};
  profiles::StudyMatrix final_values{
      "final_values", "", "parameter values after the last update, in the unit of each parameter", parameter_axis, {}};
  for (std::size_t j = 0; j < members; ++j) {
    complete.values.push_back(season.member_complete[j] ? 1 : 0);
    drawn.values.insert(drawn.values.end(), season.drawn_parameters[j].begin(), season.drawn_parameters[j].end());
    final_values.values.insert(final_values.values.end(), season.final_parameters[j].begin(),
                               season.final_parameters[j].end());
  }
  member_table.columns = {complete};
  member_table.matrices = {drawn, final_values};
  record.tables.push_back(std::move(member_table));
  detail::save_study(path, record);
}

}  // namespace wetfront::site
