#include "wetfront/profiles/visit_balance.hpp"

#include <fmt/format.h>

#include <cmath>
#include <stdexcept>

namespace wetfront::profiles {

namespace {

// A visit closer than this to an output time is taken to be at that time (about 0.1 s).
constexpr double kVisitMatchDays = 1e-6;

}  // namespace

IntervalBalance balance_difference(const solver::CumulativeBalance& from, const solver::CumulativeBalance& to) {
  if (from.plane_flux_cm.size() != to.plane_flux_cm.size())
    throw std::invalid_argument(fmt::format("balance rows at day {} and day {} have {} and {} flux planes",
                                            from.time_days, to.time_days, from.plane_flux_cm.size(),
                                            to.plane_flux_cm.size()));
  IntervalBalance interval;
  interval.start_day = from.time_days;
  interval.end_day = to.time_days;
  interval.water_input_cm = to.water_input_cm - from.water_input_cm;
  interval.potential_evaporation_cm = to.potential_evaporation_cm - from.potential_evaporation_cm;
  interval.actual_evaporation_cm = to.actual_evaporation_cm - from.actual_evaporation_cm;
  interval.runoff_cm = to.runoff_cm - from.runoff_cm;
  interval.infiltration_cm = to.infiltration_cm - from.infiltration_cm;
  interval.transpiration_cm = to.transpiration_cm - from.transpiration_cm;
  interval.bottom_flux_cm = to.bottom_flux_cm - from.bottom_flux_cm;
  interval.plane_flux_cm.resize(to.plane_flux_cm.size());
  for (std::size_t p = 0; p < to.plane_flux_cm.size(); ++p)
    interval.plane_flux_cm[p] = to.plane_flux_cm[p] - from.plane_flux_cm[p];
  // Stored amounts are states, not cumulative fluxes: their change over the interval.
  interval.ponded_change_cm = to.ponded_depth_cm - from.ponded_depth_cm;
  interval.storage_change_cm = to.soil_storage_cm - from.soil_storage_cm;
  interval.balance_error_change_cm = to.balance_error_cm - from.balance_error_cm;
  return interval;
}

std::vector<IntervalBalance> balance_between_visits(std::span<const solver::CumulativeBalance> balances,
                                                    std::span<const double> visit_days) {
  std::vector<IntervalBalance> rows;
  if (balances.empty()) return rows;
  const double first_day = balances.front().time_days;
  const double last_day = balances.back().time_days;
  std::size_t from = 0;  // balance row where the current interval starts
  for (std::size_t v = 0; v < visit_days.size(); ++v) {
    const double visit = visit_days[v];
    if (v > 0 && !(visit > visit_days[v - 1]))
      throw std::invalid_argument(
          fmt::format("visit {} (day {}) is not after visit {} (day {})", v + 1, visit, v, visit_days[v - 1]));
    if (visit < first_day - kVisitMatchDays)
      throw std::invalid_argument(
          fmt::format("visit {} (day {}) is before the first output time (day {})", v + 1, visit, first_day));
    if (visit > last_day + kVisitMatchDays) break;  // not reached by this run
    std::size_t to = from;
    while (to < balances.size() && balances[to].time_days < visit - kVisitMatchDays) ++to;
    if (to == balances.size() || std::abs(balances[to].time_days - visit) > kVisitMatchDays)
      throw std::invalid_argument(
          fmt::format("visit {} (day {}) is not an output time; add the visit days to the output times", v + 1, visit));
    if (to == from) continue;  // a visit at the start of the current interval adds no row
    rows.push_back(balance_difference(balances[from], balances[to]));
    from = to;
  }
  if (from + 1 < balances.size() || rows.empty()) rows.push_back(balance_difference(balances[from], balances.back()));
  return rows;
}

IntervalBalance season_total(std::span<const solver::CumulativeBalance> balances) {
  if (balances.empty()) throw std::invalid_argument("no balance rows: the run reached no output time");
  return balance_difference(balances.front(), balances.back());
}

}  // namespace wetfront::profiles
