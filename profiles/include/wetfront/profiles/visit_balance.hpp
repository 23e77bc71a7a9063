// Water balance per interval between field visits, from the cumulative balance rows.
//
// Each interval term is the difference of the same cumulative numbers at the interval ends,
// so the intervals telescope: summed over the season they give the season total (last row
// minus first row), with no error beyond the rounding of the additions themselves.
#pragma once

#include <span>
#include <vector>

#include "wetfront/solver/column_run.hpp"

namespace wetfront::profiles {

// Amounts over [start_day, end_day], cm of water. Signs as in CumulativeBalance: fluxes
// positive downward, evaporation and transpiration positive amounts leaving the soil.
struct IntervalBalance {
  double start_day = 0;
  double end_day = 0;
  double water_input_cm = 0;
  double potential_evaporation_cm = 0;
  double actual_evaporation_cm = 0;
  double runoff_cm = 0;
  double infiltration_cm = 0;
  double transpiration_cm = 0;
  double bottom_flux_cm = 0;
  std::vector<double> plane_flux_cm;
  double ponded_change_cm = 0;         // surface water at end minus at start
  double storage_change_cm = 0;        // soil water at end minus at start
  double balance_error_change_cm = 0;  // change of the cumulative balance error

  bool operator==(const IntervalBalance&) const = default;
};

// to - from, term by term. Throws std::invalid_argument when the plane counts differ.
IntervalBalance balance_difference(const solver::CumulativeBalance& from, const solver::CumulativeBalance& to);

// Rows for [first time, visit 1], [visit 1, visit 2], ..., [last visit, last time], where the
// times are those of `balances` (the output times reached). Every visit inside the reached
// range must coincide with a balance time (within 1e-6 d); visits at the first time add no
// row, visits after the last time reached (an incomplete run) are left out. With no visits
// the one row is the season total. Throws std::invalid_argument for visits out of order,
// before the first time, or between output times.
std::vector<IntervalBalance> balance_between_visits(std::span<const solver::CumulativeBalance> balances,
                                                    std::span<const double> visit_days);

// Last row minus first row; throws std::invalid_argument when `balances` is empty.
IntervalBalance season_total(std::span<const solver::CumulativeBalance> balances);

}  // namespace wetfront::profiles
