#include "wetfront/site/anchored_season.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "anchored_members.hpp"
#include "ensemble_member.hpp"
#include "visit_analysis.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/site/report_table.hpp"
#include "wetfront/site/run_season.hpp"
#include "wetfront/studies/parallel_batch.hpp"
#include "wetfront/studies/parameter_uncertainty.hpp"

namespace wetfront::site {
namespace {

using detail::EnsembleMember;

// A warning when the innovations lie outside (visit_analysis.hpp) at least this share of the
// visits, and at least two.
constexpr double kOutsideShare = 1.0 / 3.0;
constexpr double kMissing = std::numeric_limits<double>::quiet_NaN();
// Updates above this share of the anchored drainage get a warning (add_update_warning).
constexpr double kLargeUpdateShare = 0.25;

void add_warnings(AnchoredSeason& season) {
  std::size_t collapsed = 0, outside = 0;
  std::string first_collapsed, first_outside;
  for (const auto& visit : season.visits) {
    if (visit.collapsed && collapsed++ == 0) first_collapsed = visit.date;
    if (visit.outside && outside++ == 0) first_outside = visit.date;
  }
  const std::size_t visits = season.visits.size();
  if (collapsed > 0)
    season.warnings.push_back(fmt::format(
        "the ensemble collapsed at {} of {} visits (first {}): its forecasts of the readings spread less than a "
        "tenth of the reading uncertainty, so the readings barely move it; {}",
        collapsed, visits, first_collapsed,
        season.settings.calibration_file.empty()
            ? "use more members, wider [[adjustable]] ranges, or --update-parameters"
            : "the calibration's covariance is narrow, so the members stay close together and the band is about as "
              "narrow as the calibration's; draw them from the ranges for a wider ensemble"));
  if (outside >= 2 && static_cast<double>(outside) >= kOutsideShare * static_cast<double>(visits))
    season.warnings.push_back(fmt::format(
        "at {} of {} visits (first {}) the readings lay well outside the forecasts' spread and the reading "
        "uncertainty together: a sign of a wrong model structure (soil layers, boundaries, forcing) rather than "
        "wrong parameter values",
        outside, visits, first_outside));
}

// Without parameter updates, updates that add (or remove) a large share of the anchored drainage
// over the season mean that the members keep losing water the readings still show: their
// parameters, not their soil water, disagree with the readings (docs/anchored-season.md).
void add_update_warning(AnchoredSeason& season) {
  if (season.settings.update_parameters) return;
  double drainage_cm = 0, update_cm = 0;
  for (std::size_t i = 0; i < season.interval_end_days.size(); ++i) {
    drainage_cm += drainage_band(season, i).mean;
    update_cm += update_band(season, i).mean;
  }
  if (std::abs(update_cm) <= kNegligibleRechargeCm || std::abs(update_cm) <= kLargeUpdateShare * std::abs(drainage_cm))
    return;
  season.warnings.push_back(fmt::format(
      "the updates {} {} mm over the season, against {} mm of anchored drainage: the members' parameters rather than "
      "their soil water disagree with the readings, and the drainage may follow the updates; use --update-parameters "
      "or --calibration",
      update_cm > 0 ? "added" : "removed", number(10 * std::abs(update_cm)), number(10 * drainage_cm)));
}

}  // namespace

EnsembleBand ensemble_band(const std::vector<double>& values) {
  if (values.empty()) return {kMissing, kMissing, kMissing};
  double sum = 0;
  for (double v : values) sum += v;
  return {sum / static_cast<double>(values.size()), studies::percentile(values, 0.05),
          studies::percentile(values, 0.95)};
}

namespace {
EnsembleBand member_band(const AnchoredSeason& season, std::size_t interval, double MemberInterval::*amount) {
  std::vector<double> values;
  for (std::size_t j = 0; j < season.members.size(); ++j)
    if (season.member_complete[j]) values.push_back(season.members[j].at(interval).*amount);
  return ensemble_band(values);
}
}  // namespace

EnsembleBand drainage_band(const AnchoredSeason& season, std::size_t interval) {
  return member_band(season, interval, &MemberInterval::drainage_cm);
}
EnsembleBand update_band(const AnchoredSeason& season, std::size_t interval) {
  return member_band(season, interval, &MemberInterval::update_cm);
}
EnsembleBand soil_change_band(const AnchoredSeason& season, std::size_t interval) {
  return member_band(season, interval, &MemberInterval::soil_change_cm);
}

AnchoredSeason run_anchored_season(const SiteSetup& site, const ParameterStudy& study, const AnchorSettings& settings,
                                   const std::string& program_version,
                                   const std::function<void(std::size_t, std::size_t)>& progress) {
  const std::string file = site.site_file.string();
  if (study.parameters.empty())
    throw base::InputError(file, 0, "",
                           "no [[adjustable]] entries: the members are drawn from their ranges (docs/site-file.md, "
                           "\"Parameter studies\")");
  if (settings.members < 2) throw base::InputError(file, 0, "", "an ensemble needs at least two members");
  const FieldRecords records = read_field_records(site);
  const Season base = build_season(site, records);
  const auto centres_span = base.problem.grid.cell_depths_cm();
  std::vector<double> centres(centres_span.begin(), centres_span.end());

  AnchoredSeason season;
  season.settings = settings;
  season.input_hash = records.input_hash;
  // Interval boundaries: the run start, the visits inside the run, the run end.
  std::vector<double> boundaries{base.problem.start_day};
  std::vector<double> visit_days;
  std::vector<std::string> visit_dates;
  for (std::size_t v = 0; v < site.visit_days.size(); ++v) {
    const double day = site.visit_days[v];
    if (day <= base.problem.start_day + 1e-9 || day >= base.problem.end_day - 1e-6) continue;
    boundaries.push_back(day);
    visit_days.push_back(day);
    visit_dates.push_back(v < site.visit_dates.size() ? site.visit_dates[v] : fmt::format("day {}", day));
  }
  boundaries.push_back(base.problem.end_day);
  season.interval_start_days.assign(boundaries.begin(), boundaries.end() - 1);
  season.interval_end_days.assign(boundaries.begin() + 1, boundaries.end());
  season.interval_end_dates = visit_dates;
  season.interval_end_dates.push_back(site.run_end_text);
  const std::vector<detail::ReadingsAtVisit> visits =
      detail::readings_by_visit(records.sensor_readings, visit_days, study.weights, base.problem.end_day, centres,
                                season.readings_not_at_a_visit);

  const detail::EnsembleSite shared{site, study, records};
  const detail::VisitAnalysis analysis(shared, settings, centres);
  std::vector<EnsembleMember> members;
  detail::DrawnMembers drawn = detail::draw_members(study, settings, records.input_hash);
  season.drawn_parameters = std::move(drawn.values);
  for (const auto& values : season.drawn_parameters) {
    EnsembleMember member;
    member.values = values;
    member.intervals.resize(boundaries.size() - 1);
    members.push_back(std::move(member));
  }

  // Stretches from one visit with readings to the next; boundary index of each analysis.
  std::vector<std::size_t> stops;
  for (const auto& visit : visits) stops.push_back(visit.visit + 1);
  stops.push_back(boundaries.size() - 1);
  std::size_t first = 0, done = 0;
  const std::size_t planned = stops.size() * settings.members;
  for (std::size_t s = 0; s < stops.size(); ++s) {
    studies::run_batch(
        members.size(), settings.threads,
        [&](std::size_t j) { detail::run_stretch(shared, members[j], boundaries, first, stops[s]); },
        [&](std::size_t) {
          if (progress) progress(++done, planned);
        });
    if (detail::complete_members(members).size() < 2) {
      const auto failed =
          std::find_if(members.begin(), members.end(), [](const EnsembleMember& m) { return !m.complete; });
      throw base::InputError(file, 0, "",
                             fmt::format("fewer than two members ran through day {:.1f}; the first failure: {}",
                                         boundaries[stops[s]], failed->failure));
    }
    if (s + 1 < stops.size()) {
      VisitUpdate update = analysis.analyse(members, visits[s], s);
      update.day = visit_days[visits[s].visit];
      update.date = visit_dates[visits[s].visit];
      season.visits.push_back(std::move(update));
    }
    first = stops[s];
  }
  // The stored water each update added, known once the next stretch started from it.
  for (std::size_t s = 0; s < season.visits.size(); ++s)
    for (std::size_t j = 0; j < members.size(); ++j)
      if (members[j].complete)
        season.visits[s].stored_water_increment_cm[j] = members[j].intervals.at(stops[s]).update_cm;

  for (auto& member : members) {
    season.final_parameters.push_back(member.values);
    season.member_complete.push_back(member.complete);
    season.member_failures.push_back(member.failure);
    season.members.push_back(std::move(member.intervals));
  }
  const SeasonResult free_run = run_season(site, program_version);
  for (const auto& interval : free_run.record.visit_balance)
    season.free_run_drainage_cm.push_back(interval.plane_flux_cm.at(0));
  season.darcy = free_run.sensors.darcy;
  season.water_table = free_run.sensors.water_table;
  season.warnings = std::move(drawn.warnings);
  add_warnings(season);
  add_update_warning(season);
  return season;
}

}  // namespace wetfront::site
