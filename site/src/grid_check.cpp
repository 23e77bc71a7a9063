#include "wetfront/site/grid_check.hpp"

#include <algorithm>
#include <cmath>
#include <map>

namespace wetfront::site {

namespace {

double season_recharge(const profiles::RunRecord& record) {
  if (record.run.balances.empty()) return 0.0;
  const auto& last = record.run.balances.back();
  return last.plane_flux_cm.empty() ? last.bottom_flux_cm : last.plane_flux_cm.front();
}

void compare(const std::vector<profiles::ComparedReading>& coarse, const std::vector<profiles::ComparedReading>& fine,
             const std::string& quantity, const std::string& unit, double limit, std::vector<SensorGridChange>& out) {
  std::map<std::string, std::size_t> row_of;
  std::vector<double> sum_of_squares;
  const std::size_t n = std::min(coarse.size(), fine.size());  // the same readings in the same order
  for (std::size_t k = 0; k < n; ++k) {
    const auto& a = coarse[k];
    const auto& b = fine[k];
    // The readings the fit uses (a tensiometer reading beyond its working limit is not one).
    if (!a.used || !std::isfinite(a.simulated) || !std::isfinite(b.simulated) || a.sensor != b.sensor) continue;
    auto [it, added] = row_of.try_emplace(a.sensor, out.size());
    if (added) {
      out.push_back({a.sensor, quantity, unit, 0, 0, 0, false});
      sum_of_squares.resize(out.size(), 0.0);
    }
    const double change = b.simulated - a.simulated;
    auto& row = out[it->second];
    ++row.readings;
    row.largest_change = std::max(row.largest_change, std::abs(change));
    sum_of_squares[it->second] += change * change;
  }
  for (std::size_t r = 0; r < out.size(); ++r) {
    if (out[r].quantity != quantity || out[r].readings == 0) continue;
    out[r].rms_change = std::sqrt(sum_of_squares[r] / out[r].readings);
    out[r].too_coarse = out[r].rms_change > limit;
  }
}

}  // namespace

bool GridCheck::too_coarse() const {
  return !finer_complete || recharge_too_coarse ||
         std::any_of(sensors.begin(), sensors.end(), [](const auto& s) { return s.too_coarse; });
}

solver::GridRequest halved(const solver::GridRequest& request) {
  solver::GridRequest finer = request;
  finer.cell_split = 2 * request.cell_split;
  return finer;
}

GridCheck check_grid(const SiteSetup& site, const SeasonResult& result, const std::string& program_version,
                     const Simulate& simulate) {
  SiteSetup finer_site = site;
  finer_site.grid = halved(site.grid);
  const SeasonResult finer = run_season(finer_site, program_version, simulate);

  GridCheck check;
  check.cells = result.record.run.cell_depths_cm.size();
  check.finer_cells = finer.record.run.cell_depths_cm.size();
  check.finer_complete = finer.complete;
  if (!finer.complete && finer.record.run.failure) check.finer_failure = finer.record.run.failure->reason;
  check.recharge_cm = season_recharge(result.record);
  check.finer_recharge_cm = season_recharge(finer.record);
  const double scale = std::max(std::abs(check.finer_recharge_cm), 1e-3);  // 0.01 mm: below it, no relative change
  check.recharge_change = (check.finer_recharge_cm - check.recharge_cm) / scale;
  check.recharge_too_coarse = std::abs(check.recharge_change) > kGridRechargeLimit;
  if (result.record.sensor_comparison && finer.record.sensor_comparison) {
    const auto& a = *result.record.sensor_comparison;
    const auto& b = *finer.record.sensor_comparison;
    compare(a.pressure_head, b.pressure_head, "pressure head", "cm", kGridHeadLimitCm, check.sensors);
    compare(a.water_content, b.water_content, "water content", "cm3/cm3", kGridWaterContentLimit, check.sensors);
  }
  return check;
}

}  // namespace wetfront::site
