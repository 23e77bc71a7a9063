#include "visit_analysis.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "member_state.hpp"
#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/studies/parameter_uncertainty.hpp"

namespace wetfront::site::detail {
namespace {

// An ensemble whose forecasts of the readings spread less than this fraction of the reading
// uncertainty (median over the visit's readings) gives the readings almost no weight: collapsed.
constexpr double kCollapseRatio = 0.1;
constexpr double kMissing = std::numeric_limits<double>::quiet_NaN();
// A visit's innovations lie outside when their mean square, each scaled by the forecast spread
// and reading uncertainty together, exceeds this (2 sd; common practice).
constexpr double kOutsideMeanSquare = 4.0;

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
  return reading.quantity == kPressureHead ? log_suction(value) : value;
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

}  // namespace

std::vector<std::size_t> complete_members(const std::vector<EnsembleMember>& members) {
  std::vector<std::size_t> alive;
  for (std::size_t j = 0; j < members.size(); ++j)
    if (members[j].complete) alive.push_back(j);
  return alive;
}

VisitUpdate VisitAnalysis::analyse(std::vector<EnsembleMember>& members, const ReadingsAtVisit& visit,
                                   std::uint64_t step) const {
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
    for (Eigen::Index i = 0; i < n_cells; ++i) states(i, j) = log_suction(m.heads_cm[static_cast<std::size_t>(i)]);
    for (Eigen::Index k = 0; k < n_parameters; ++k)
      states(n_cells + k, j) = studies::to_search_scale(parameters[static_cast<std::size_t>(k)].range,
                                                        m.values[static_cast<std::size_t>(k)]);
    for (Eigen::Index r = 0; r < n_readings; ++r)
      forecasts(r, j) = predicted(m, centres_, visit.readings[static_cast<std::size_t>(r)], m.water_content);
  }
  // Every member's perturbation by its own number, whichever members are still running.
  const Eigen::MatrixXd all_perturbed = studies::perturbed_readings(readings, sd, members.size(), settings_.seed, step);
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

// Weights by distance in depth: cell to reading and reading to reading; parameters take every
// reading in full.
studies::Localisation VisitAnalysis::localisation(const ReadingsAtVisit& visit, Eigen::Index rows) const {
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
void VisitAnalysis::apply(EnsembleMember& m, const Eigen::VectorXd& analysed, Eigen::Index n_cells) const {
  const auto& parameters = shared_.study.parameters;
  if (settings_.update_parameters) {
    for (std::size_t k = 0; k < parameters.size(); ++k) {
      const auto& range = parameters[k].range;
      const double low = studies::to_search_scale(range, range.lower);
      const double high = studies::to_search_scale(range, range.upper);
      const double value = std::clamp(analysed[n_cells + static_cast<Eigen::Index>(k)], low, high);
      m.values[k] = value == low ? range.lower : value == high ? range.upper : studies::from_search_scale(range, value);
    }
    const soils::LayeredProfile old_soil = m.season->problem.soil;
    m.season.reset();
    if (!ensure_season(shared_, m)) return;
    // The new soil holds other water at the forecast heads: part of this update's term.
    const solver::Grid& grid = m.season->problem.grid;
    m.soil_change_cm = 0;
    for (std::size_t i = 0; i < centres_.size(); ++i)
      m.soil_change_cm += (soils::water_content(m.season->problem.soil.model_at(centres_[i]), m.heads_cm[i]) -
                           soils::water_content(old_soil.model_at(centres_[i]), m.heads_cm[i])) *
                          grid.cell_thickness_cm(i);
  }
  const std::vector<double> log_suctions(analysed.data(), analysed.data() + n_cells);
  m.heads_cm = heads_from_log_suction(m.season->problem.soil, centres_, m.heads_cm, log_suctions);
  for (std::size_t i = 0; i < centres_.size(); ++i)
    m.water_content[i] = soils::water_content(m.season->problem.soil.model_at(centres_[i]), m.heads_cm[i]);
}

}  // namespace wetfront::site::detail
