// Water-table fluctuation (Healy & Cook 2002, Hydrogeology Journal 10:91) per visit interval
// from an observation well, beside the model's drainage at the recharge plane:
//   R = Sy * rise,   rise = (start depth + recession rate * days) - end depth, rises only,
// with the depths the well readings nearest to the interval's ends (within the visit window).
#include <fmt/format.h>

#include "wetfront/site/sensor_check.hpp"
#include "wetfront/observations/recharge_estimates.hpp"

namespace wetfront::site {

std::optional<WaterTableCheck> check_water_table(const Season& season, const std::vector<SensorRecord>& readings,
                                                 const profiles::RunRecord& record) {
  const SensorRecord* well = nullptr;
  for (const auto& r : readings) {
    if (r.kind == kObservationWell) {
      well = &r;
      break;
    }
  }
  if (!well || record.visit_balance.empty()) return std::nullopt;
  const SensorSetup* setup = nullptr;
  for (const auto& s : season.site.sensors) {
    if (s.name == well->name) setup = &s;
  }
  if (!setup) return std::nullopt;
  WaterTableCheck check{well->name, setup->specific_yield, setup->recession_cm_per_d, setup->specific_yield_note, {}};
  const observations::WaterTableFluctuation method{setup->specific_yield, setup->recession_cm_per_d};
  for (const auto& b : record.visit_balance) {
    EstimateInterval interval;
    interval.start_day = b.start_day;
    interval.end_day = b.end_day;
    interval.model_cm = b.plane_flux_cm.empty() ? 0.0 : b.plane_flux_cm.front();
    const observations::Observation* start = reading_near(*well, b.start_day);
    const observations::Observation* end = reading_near(*well, b.end_day);
    if (start) interval.start_depth_cm = start->value;
    if (end) interval.end_depth_cm = end->value;
    if (start && end && end->day > start->day) {
      const observations::WaterTableReading levels[2] = {{start->day, start->value}, {end->day, end->value}};
      interval.estimate_cm = observations::water_table_recharge(method, levels).front().amount_cm;
      compare_with_model(interval);
    } else {
      const char* which = start ? "the end visit" : end ? "the start visit" : "either visit";
      interval.missing = start && end ? fmt::format("the same reading of well {} is nearest to both visits", well->name)
                                      : fmt::format("no reading of well {} within {} d of {}", well->name,
                                                    kVisitReadingWindowDays, which);
    }
    check.intervals.push_back(std::move(interval));
  }
  return check;
}

}  // namespace wetfront::site
