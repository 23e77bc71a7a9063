#include "wetfront/site/anchored_season.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "anchored_members.hpp"
#include "ensemble_member.hpp"
#include "member_state.hpp"
#include "visit_readings.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/site/run_season.hpp"
#include "wetfront/studies/ensemble_filter.hpp"
#include "wetfront/studies/parallel_batch.hpp"
#include "wetfront/studies/parameter_sampling.hpp"
#include "wetfront/studies/parameter_uncertainty.hpp"

namespace wetfront::site {
namespace {

using detail::EnsembleMember;

// An ensemble whose forecasts of the readings spread less than this fraction of the reading
// uncertainty (median over the visit's readings) gives the readings almost no weight: collapsed.
constexpr double kCollapseRatio = 0.1;
constexpr double kMissing = std::numeric_limits<double>::quiet_NaN();
// A visit's innovations lie outside when their mean square, each scaled by the forecast spread
// and reading uncertainty together, exceeds this (2 sd; common practice); a warning when at
// least this share of the visits (and two) do.
constexpr double kOutsideMeanSquare = 4.0;
constexpr double kOutsideShare = 1.0 / 3.0;

std::vector<std::size_t> complete_members(const std::vector<EnsembleMember>& members) {
  std::vector<std::size_t> alive;
  for (std::size_t j = 0; j < members.size(); ++j)
    if (members[j].complete) alive.push_back(j);
  return alive;
}

// The members' forecasts of the readings: values at the readings' depths in the profile at the
// visit (heads for tensiometers, water contents for probes and cores).
double predicted(const EnsembleMember& member, const std::vector<double>& centres, const VisitReading& reading,
                 const std::vector<double>& contents) {
  const bool head = reading.quantity == kPressureHead;
  const observations::SimulatedProfiles profile{{0.0}, centres, {head ? member.heads_cm : contents}};
  return observations::simulated_value_at(profile, 0.0, reading.depth_cm).value();
}

// Heads enter the filter as log10(1 cm + suction), the scale of the members' state
// (member_state.hpp); a reading's uncertainty carries over to first order at the reading. Water
// contents enter as they are.
double filter_value(const VisitReading& reading, double value) {
  return reading.quantity == kPressureHead ? detail::log_suction(value) : value;
}
double filter_uncertainty(const VisitReading& reading) {
  return reading.quantity == kPressureHead
             ? reading.uncertainty / ((1.0 + std::max(-reading.value, 0.0)) * std::log(10.0))
             : reading.uncertainty;
}

double mean_of(const Eigen::VectorXd& row) { return row.mean(); }
double spread_of(const Eigen::VectorXd& row) {
  return std::sqrt((row.array() - row.mean()).square().sum() / static_cast<double>(row.size() - 1));
}

class Ensemble {
 public:
  Ensemble(const detail::EnsembleSite& shared, const AnchorSettings& settings, std::vector<double> centres)
      : shared_(shared), settings_(settings), centres_(std::move(centres)) {}

  std::vector<EnsembleMember> members;

  // The update at one visit: every complete member's heads (and parameters, on request) from
  // the visit's readings.
  VisitUpdate analyse(const detail::ReadingsAtVisit& visit, std::uint64_t step) {
    const std::vector<std::size_t> alive = complete_members(members);
    const auto n_members = static_cast<Eigen::Index>(alive.size());
    const auto n_readings = static_cast<Eigen::Index>(visit.readings.size());
    const auto n_cells = static_cast<Eigen::Index>(centres_.size());
    const auto& parameters = shared_.study.parameters;
    const auto n_parameters = settings_.update_parameters ? static_cast<Eigen::Index>(parameters.size()) : 0;
    Eigen::MatrixXd states(n_cells + n_parameters, n_members);
    Eigen::MatrixXd forecasts(n_readings, n_members);
    Eigen::VectorXd readings(n_readings), sd(n_readings);
    for (Eigen::Index r = 0; r < n_readings; ++r) {
      const VisitReading& reading = visit.readings[static_cast<std::size_t>(r)];
      readings[r] = filter_value(reading, reading.value);
      sd[r] = filter_uncertainty(reading);
    }
    for (Eigen::Index j = 0; j < n_members; ++j) {
      const EnsembleMember& m = members[alive[static_cast<std::size_t>(j)]];
      for (Eigen::Index i = 0; i < n_cells; ++i)
        states(i, j) = detail::log_suction(m.heads_cm[static_cast<std::size_t>(i)]);
      for (Eigen::Index k = 0; k < n_parameters; ++k)
        states(n_cells + k, j) = studies::to_search_scale(parameters[static_cast<std::size_t>(k)].range,
                                                          m.values[static_cast<std::size_t>(k)]);
      for (Eigen::Index r = 0; r < n_readings; ++r)
        forecasts(r, j) = predicted(m, centres_, visit.readings[static_cast<std::size_t>(r)], m.water_content);
    }
    // Every member's perturbation by its own number, whichever members are still running.
    const Eigen::MatrixXd all_perturbed =
        studies::perturbed_readings(readings, sd, members.size(), settings_.seed, step);
    Eigen::MatrixXd perturbed(n_readings, n_members);
    for (Eigen::Index j = 0; j < n_members; ++j)
      perturbed.col(j) = all_perturbed.col(static_cast<Eigen::Index>(alive[static_cast<std::size_t>(j)]));
    Eigen::MatrixXd filtered(n_readings, n_members);
    for (Eigen::Index r = 0; r < n_readings; ++r)
      for (Eigen::Index j = 0; j < n_members; ++j)
        filtered(r, j) = filter_value(visit.readings[static_cast<std::size_t>(r)], forecasts(r, j));
    const Eigen::MatrixXd analysed =
        studies::analysed_states(states, filtered, perturbed, sd.array().square(), localisation(visit, states.rows()));

    VisitUpdate update;
    update.readings = visit.readings;
    update.stored_water_increment_cm.assign(members.size(), kMissing);
    // The readings as the analysed members give them (members that an update made unphysical
    // are left out).
    Eigen::VectorXd after_sum = Eigen::VectorXd::Zero(n_readings);
    double after_count = 0;
    for (Eigen::Index j = 0; j < n_members; ++j) {
      EnsembleMember& m = members[alive[static_cast<std::size_t>(j)]];
      apply(m, analysed.col(j), n_cells);
      if (!m.complete) continue;
      ++after_count;
      for (Eigen::Index r = 0; r < n_readings; ++r)
        after_sum[r] += predicted(m, centres_, visit.readings[static_cast<std::size_t>(r)], m.water_content);
    }
    std::vector<double> spread_ratios;
    double mean_square = 0;
    for (Eigen::Index r = 0; r < n_readings; ++r) {
      VisitReading& reading = update.readings[static_cast<std::size_t>(r)];
      reading.forecast_mean = mean_of(forecasts.row(r));
      reading.forecast_spread = spread_of(forecasts.row(r));
      reading.analysis_mean = after_count > 0 ? after_sum[r] / after_count : kMissing;
      spread_ratios.push_back(reading.forecast_spread / reading.uncertainty);
      const double innovation = reading.value - reading.forecast_mean;
      mean_square += innovation * innovation /
                     (reading.forecast_spread * reading.forecast_spread + reading.uncertainty * reading.uncertainty);
    }
    update.collapsed = studies::percentile(spread_ratios, 0.5) < kCollapseRatio;
    update.outside = mean_square / static_cast<double>(n_readings) > kOutsideMeanSquare;
    return update;
  }

 private:
  // Weights by distance in depth: cell to reading and reading to reading; parameters take every
  // reading in full.
  studies::Localisation localisation(const detail::ReadingsAtVisit& visit, Eigen::Index rows) const {
    studies::Localisation weights;
    if (!(settings_.reach_cm > 0)) return weights;
    const auto n_readings = static_cast<Eigen::Index>(visit.readings.size());
    auto depth = [&](Eigen::Index r) { return visit.readings[static_cast<std::size_t>(r)].depth_cm; };
    weights.state_reading = Eigen::MatrixXd::Ones(rows, n_readings);
    weights.reading_reading = Eigen::MatrixXd::Ones(n_readings, n_readings);
    for (Eigen::Index r = 0; r < n_readings; ++r) {
      for (std::size_t i = 0; i < centres_.size(); ++i)
        weights.state_reading(static_cast<Eigen::Index>(i), r) =
            studies::gaspari_cohn(centres_[i] - depth(r), settings_.reach_cm);
      for (Eigen::Index q = 0; q < n_readings; ++q)
        weights.reading_reading(q, r) = studies::gaspari_cohn(depth(q) - depth(r), settings_.reach_cm);
    }
    return weights;
  }

  // The analysed column of one member: parameters first (its soil may change), then heads. A
  // new soil holds a different amount of water at the same heads; that change is part of the
  // update term the next stretch books.
  void apply(EnsembleMember& m, const Eigen::VectorXd& analysed, Eigen::Index n_cells) {
    const auto& parameters = shared_.study.parameters;
    if (settings_.update_parameters) {
      for (std::size_t k = 0; k < parameters.size(); ++k) {
        const auto& range = parameters[k].range;
        const double low = studies::to_search_scale(range, range.lower);
        const double high = studies::to_search_scale(range, range.upper);
        const double value = std::clamp(analysed[n_cells + static_cast<Eigen::Index>(k)], low, high);
        m.values[k] = value == low    ? range.lower
                      : value == high ? range.upper
                                      : studies::from_search_scale(range, value);
      }
      m.season.reset();
      if (!detail::ensure_season(shared_, m)) return;
    }
    const std::vector<double> log_suctions(analysed.data(), analysed.data() + n_cells);
    m.heads_cm = detail::heads_from_log_suction(m.season->problem.soil, centres_, m.heads_cm, log_suctions);
    for (std::size_t i = 0; i < centres_.size(); ++i)
      m.water_content[i] = soils::water_content(m.season->problem.soil.model_at(centres_[i]), m.heads_cm[i]);
  }

  const detail::EnsembleSite& shared_;
  const AnchorSettings& settings_;
  std::vector<double> centres_;
};

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
        "tenth of the reading uncertainty, so the readings barely move it; use more members, wider [[adjustable]] "
        "ranges, or --update-parameters",
        collapsed, visits, first_collapsed));
  if (outside >= 2 && static_cast<double>(outside) >= kOutsideShare * static_cast<double>(visits))
    season.warnings.push_back(fmt::format(
        "at {} of {} visits (first {}) the readings lay well outside the forecasts' spread and the reading "
        "uncertainty together: a sign of a wrong model structure (soil layers, boundaries, forcing) rather than "
        "wrong parameter values",
        outside, visits, first_outside));
}

}  // namespace

EnsembleBand ensemble_band(const std::vector<double>& values) {
  if (values.empty()) return {kMissing, kMissing, kMissing};
  double sum = 0;
  for (double v : values) sum += v;
  return {sum / static_cast<double>(values.size()), studies::percentile(values, 0.05),
          studies::percentile(values, 0.95)};
}

EnsembleBand drainage_band(const AnchoredSeason& season, std::size_t interval) {
  std::vector<double> values;
  for (std::size_t j = 0; j < season.members.size(); ++j)
    if (season.member_complete[j]) values.push_back(season.members[j].at(interval).drainage_cm);
  return ensemble_band(values);
}

EnsembleBand update_band(const AnchoredSeason& season, std::size_t interval) {
  std::vector<double> values;
  for (std::size_t j = 0; j < season.members.size(); ++j)
    if (season.member_complete[j]) values.push_back(season.members[j].at(interval).update_cm);
  return ensemble_band(values);
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
  Ensemble ensemble(shared, settings, centres);
  detail::DrawnMembers drawn = detail::draw_members(study, settings, records.input_hash);
  season.drawn_parameters = std::move(drawn.values);
  for (const auto& values : season.drawn_parameters) {
    EnsembleMember member;
    member.values = values;
    member.intervals.resize(boundaries.size() - 1);
    ensemble.members.push_back(std::move(member));
  }

  // Stretches from one visit with readings to the next; boundary index of each analysis.
  std::vector<std::size_t> stops;
  for (const auto& visit : visits) stops.push_back(visit.visit + 1);
  stops.push_back(boundaries.size() - 1);
  std::size_t first = 0, done = 0;
  const std::size_t planned = stops.size() * settings.members;
  for (std::size_t s = 0; s < stops.size(); ++s) {
    studies::run_batch(
        ensemble.members.size(), settings.threads,
        [&](std::size_t j) { detail::run_stretch(shared, ensemble.members[j], boundaries, first, stops[s]); },
        [&](std::size_t) {
          if (progress) progress(++done, planned);
        });
    if (complete_members(ensemble.members).size() < 2) {
      const auto failed = std::find_if(ensemble.members.begin(), ensemble.members.end(),
                                       [](const EnsembleMember& m) { return !m.complete; });
      throw base::InputError(file, 0, "",
                             fmt::format("fewer than two members ran through day {:.1f}; the first failure: {}",
                                         boundaries[stops[s]], failed->failure));
    }
    if (s + 1 < stops.size()) {
      VisitUpdate update = ensemble.analyse(visits[s], s);
      update.day = visit_days[visits[s].visit];
      update.date = visit_dates[visits[s].visit];
      season.visits.push_back(std::move(update));
    }
    first = stops[s];
  }
  // The stored water each update added, known once the next stretch started from it.
  for (std::size_t s = 0; s < season.visits.size(); ++s)
    for (std::size_t j = 0; j < ensemble.members.size(); ++j)
      if (ensemble.members[j].complete)
        season.visits[s].stored_water_increment_cm[j] = ensemble.members[j].intervals.at(stops[s]).update_cm;

  for (auto& member : ensemble.members) {
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
  return season;
}

}  // namespace wetfront::site
