#include "ensemble_member.hpp"

#include <exception>
#include <utility>

#include <fmt/format.h>

#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site::detail {
namespace {

double stored(const solver::CumulativeBalance& b) { return b.soil_storage_cm + b.ponded_depth_cm; }

void fail(EnsembleMember& member, std::string reason) {
  member.complete = false;
  member.failure = std::move(reason);
  member.season.reset();
}

}  // namespace

bool ensure_season(const EnsembleSite& shared, EnsembleMember& member) {
  if (member.season) return true;
  try {
    member.season.emplace(build_season(with_parameters(shared.site, shared.study, member.values), shared.records));
  } catch (const std::exception& error) {  // an unphysical combination of values
    fail(member, error.what());
  }
  return member.complete;
}

void run_stretch(const EnsembleSite& shared, EnsembleMember& member, const std::vector<double>& boundaries,
                 std::size_t first, std::size_t last) {
  if (!member.complete || !ensure_season(shared, member)) return;
  solver::ColumnProblem problem = member.season->problem;
  problem.start_day = boundaries[first];
  problem.end_day = boundaries[last];
  problem.output_days.assign(boundaries.begin() + static_cast<std::ptrdiff_t>(first),
                             boundaries.begin() + static_cast<std::ptrdiff_t>(last) + 1);
  const bool restart = !member.heads_cm.empty();
  if (restart) {
    // The analysed head of each cell at its centre: the table's linear interpolation returns
    // the given heads exactly there.
    const auto centres = problem.grid.cell_depths_cm();
    problem.initial = solver::HeadTable{{centres.begin(), centres.end()}, member.heads_cm};
  }
  solver::ColumnRun run;
  try {
    run = solver::simulate(problem);
  } catch (const std::exception& error) {  // a problem the solver refuses for these values
    fail(member, error.what());
    return;
  }
  if (!run.complete || run.balances.size() != last - first + 1) {
    fail(member, run.failure ? fmt::format("solver failed at day {:.3f} near {:.1f} cm: {}", run.failure->time_days,
                                           run.failure->depth_cm, run.failure->reason)
                             : std::string("solver failed"));
    return;
  }
  for (std::size_t k = first; k < last; ++k) {
    const auto& from = run.balances[k - first];
    const auto& to = run.balances[k - first + 1];
    const profiles::IntervalBalance change = profiles::balance_difference(from, to);
    MemberInterval& interval = member.intervals.at(k);
    interval.drainage_cm = change.plane_flux_cm.at(0);
    interval.net_inflow_cm = change.water_input_cm - change.actual_evaporation_cm - change.runoff_cm -
                             change.transpiration_cm - change.bottom_flux_cm;
    interval.storage_start_cm = stored(from);
    if (k == first && restart) {
      interval.storage_start_cm = member.forecast_storage_cm;
      interval.update_cm = stored(from) - member.forecast_storage_cm;
      interval.soil_change_cm = std::exchange(member.soil_change_cm, 0.0);
    }
    interval.storage_end_cm = stored(to);
    interval.balance_error_cm =
        interval.storage_end_cm - interval.storage_start_cm - interval.net_inflow_cm - interval.update_cm;
  }
  const auto& end = run.profiles.back();
  member.heads_cm = end.head_cm;
  member.water_content = end.water_content;
  member.forecast_storage_cm = stored(run.balances.back());
}

}  // namespace wetfront::site::detail
