#include "sensor_check.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/observations/profile_storage.hpp"
#include "wetfront/observations/recharge_estimates.hpp"
#include "wetfront/observations/sensor_comparison.hpp"

namespace wetfront::cli {
namespace {

namespace obs = observations;

obs::SimulatedProfiles simulated(const solver::ColumnRun& run, bool heads) {
  obs::SimulatedProfiles profiles;
  profiles.depths_cm = run.cell_depths_cm;
  for (const auto& snapshot : run.profiles) {
    profiles.times_day.push_back(snapshot.time_days);
    profiles.values.push_back(heads ? snapshot.head_cm : snapshot.water_content);
  }
  return profiles;
}

void compare_kind(const std::vector<SensorRecord>& readings, const solver::ColumnRun& run, bool heads, SensorCheck& check,
                  std::vector<std::size_t>& order) {
  std::vector<obs::SensorSeries> series;
  std::vector<const SensorRecord*> records;
  for (const auto& r : readings) {
    if ((r.kind == "tensiometer") != heads) continue;
    series.push_back(r.series);
    records.push_back(&r);
  }
  if (series.empty() || run.profiles.size() < 2) return;
  const auto report = obs::compare_with_simulation(series, simulated(run, heads));
  for (std::size_t i = 0; i < records.size(); ++i) {
    const SensorRecord& r = *records[i];
    check.sensors.push_back({r.name, r.kind, r.depth_cm, r.quantity, r.unit, report.sensors[i].metrics,
                             report.sensors[i].unreliable_left_out, report.sensors[i].outside_simulation});
    order.push_back(static_cast<std::size_t>(&r - readings.data()));
  }
  check.pooled.push_back({heads ? "all tensiometers" : "all probes", "", std::numeric_limits<double>::quiet_NaN(),
                          records.front()->quantity, records.front()->unit, report.overall, report.unreliable_left_out,
                          report.outside_simulation});
}

// The reliable reading within the window of `day` nearest to it.
const obs::Observation* reading_near(const SensorRecord& r, double day) {
  const obs::Observation* best = nullptr;
  double distance = kVisitReadingWindowDays;
  for (const auto& o : r.series.observations) {
    if (!o.reliable) continue;
    const double d = std::abs(o.day - day);
    if (d <= distance) {
      distance = d;
      best = &o;
    }
  }
  return best;
}

// The head of a reliable reading within the window of `day`, the nearest one.
std::optional<double> head_near(const SensorRecord& r, double day) {
  const obs::Observation* o = reading_near(r, day);
  return o ? std::optional<double>(o->value) : std::nullopt;
}

std::optional<DarcyCheck> darcy_check(const Season& season, const std::vector<SensorRecord>& readings,
                                      const profiles::RunRecord& record) {
  const auto& pair = season.site.darcy_pair;
  if (pair.size() != 2 || record.visit_balance.empty()) return std::nullopt;
  const SensorRecord* upper = nullptr;
  const SensorRecord* lower = nullptr;
  for (const auto& r : readings) {
    if (r.name == pair[0]) upper = &r;
    if (r.name == pair[1]) lower = &r;
  }
  if (!upper || !lower) return std::nullopt;
  DarcyCheck check{upper->name, lower->name, upper->depth_cm, lower->depth_cm, "", {}};
  const auto& soil = season.problem.soil;
  const double middle = 0.5 * (upper->depth_cm + lower->depth_cm);
  const std::size_t upper_layer = soil.layer_index_at(upper->depth_cm);
  const std::size_t lower_layer = soil.layer_index_at(lower->depth_cm);
  const std::size_t middle_layer = soil.layer_index_at(middle);
  check.soil_note = fmt::format("K from the hydraulic model of layer '{}'", soil.layers()[middle_layer].name);
  if (upper_layer != lower_layer) {
    check.soil_note += fmt::format(" (the cups sit in different layers, '{}' and '{}'; K is taken at their middle depth)",
                                   soil.layers()[upper_layer].name, soil.layers()[lower_layer].name);
  }
  const obs::TensiometerPair tensiometers{soil.model_at(middle), upper->depth_cm, lower->depth_cm};
  for (const auto& b : record.visit_balance) {
    DarcyInterval interval;
    interval.start_day = b.start_day;
    interval.end_day = b.end_day;
    interval.model_cm = b.plane_flux_cm.empty() ? 0.0 : b.plane_flux_cm.front();
    std::vector<obs::PairHeads> ends;
    for (const double day : {b.start_day, b.end_day}) {
      const auto hu = head_near(*upper, day);
      const auto hl = head_near(*lower, day);
      if (hu && hl) ends.push_back({day, *hu, *hl});
    }
    if (ends.size() == 2) {
      interval.darcy_cm = obs::darcy_recharge(tensiometers, ends).front().amount_cm;
      const auto agreement = obs::compare_recharge_estimates(interval.model_cm, *interval.darcy_cm,
                                                             {kAgreementFactor, kNegligibleRechargeCm});
      interval.disagree = agreement.disagree;
      interval.ratio = agreement.ratio;
      interval.reasons = agreement.reasons_to_consider;
    } else {
      interval.missing = fmt::format("no reliable reading of both {} and {} within {} d of a visit", upper->name, lower->name,
                                     kVisitReadingWindowDays);
    }
    check.intervals.push_back(std::move(interval));
  }
  return check;
}

}  // namespace

StorageCheck check_storage(const std::vector<SensorRecord>& readings, const profiles::RunRecord& record) {
  StorageCheck check;
  std::vector<const SensorRecord*> probes;
  for (const auto& r : readings) {
    if (r.kind == "tensiometer") continue;
    probes.push_back(&r);
    check.probe_names.push_back(r.name);
    check.depths_cm.push_back(r.depth_cm);
  }
  std::sort(check.depths_cm.begin(), check.depths_cm.end());
  check.depths_cm.erase(std::unique(check.depths_cm.begin(), check.depths_cm.end()), check.depths_cm.end());
  if (!check.usable() || record.visit_balance.empty()) return check;

  const bool simulated_available = record.run.profiles.size() >= 2;
  const obs::SimulatedProfiles profiles = simulated_available ? simulated(record.run, false) : obs::SimulatedProfiles{};
  // The storage at one visit: at each depth the mean of the probes there (nearest reading
  // within the window), and the model at the same reading times and depths.
  auto storage_at = [&](double day) {
    StorageVisit visit{day, std::nullopt, std::nullopt};
    std::vector<double> observed, modelled;
    bool model_complete = simulated_available;
    for (const double depth : check.depths_cm) {
      double sum_observed = 0, sum_model = 0;
      int count = 0;
      for (const SensorRecord* p : probes) {
        if (p->depth_cm != depth) continue;
        const obs::Observation* o = reading_near(*p, day);
        if (!o) return visit;  // a depth without a reading: no storage at this visit
        sum_observed += o->value;
        if (model_complete) {
          const auto value = obs::simulated_value_at(profiles, o->day, o->depth_cm);
          if (value) sum_model += *value;
          else model_complete = false;
        }
        ++count;
      }
      observed.push_back(sum_observed / count);
      modelled.push_back(sum_model / count);
    }
    visit.observed_cm = obs::profile_storage_cm(check.depths_cm, observed);
    if (model_complete) visit.simulated_cm = obs::profile_storage_cm(check.depths_cm, modelled);
    return visit;
  };
  check.visits.push_back(storage_at(record.visit_balance.front().start_day));
  for (const auto& b : record.visit_balance) check.visits.push_back(storage_at(b.end_day));
  auto change = [](const std::optional<double>& start, const std::optional<double>& end) {
    return start && end ? std::optional<double>(*end - *start) : std::nullopt;
  };
  for (std::size_t i = 0; i < record.visit_balance.size(); ++i) {
    const auto& start = check.visits[i];
    const auto& end = check.visits[i + 1];
    check.intervals.push_back({record.visit_balance[i].start_day, record.visit_balance[i].end_day,
                               change(start.observed_cm, end.observed_cm), change(start.simulated_cm, end.simulated_cm)});
  }
  return check;
}

SensorCheck check_sensors(const Season& season, const std::vector<SensorRecord>& readings, const profiles::RunRecord& record) {
  SensorCheck check;
  std::vector<std::size_t> order;
  compare_kind(readings, record.run, true, check, order);
  compare_kind(readings, record.run, false, check, order);
  // Back to site-file order.
  std::vector<SensorFitRow> rows;
  for (std::size_t index = 0; index < readings.size(); ++index) {
    for (std::size_t k = 0; k < order.size(); ++k) {
      if (order[k] == index) rows.push_back(check.sensors[k]);
    }
  }
  check.sensors = std::move(rows);
  check.darcy = darcy_check(season, readings, record);
  check.storage = check_storage(readings, record);
  return check;
}

profiles::SensorComparisonRecord comparison_record(const SensorCheck& check, const std::vector<SensorRecord>& readings,
                                                   const solver::ColumnRun& run) {
  profiles::SensorComparisonRecord stored;
  for (const bool heads : {true, false}) {
    if (run.profiles.size() < 2) break;
    const obs::SimulatedProfiles profiles = simulated(run, heads);
    for (const auto& r : readings) {
      if ((r.kind == "tensiometer") != heads) continue;
      for (const auto& o : r.series.observations) {
        const auto value = obs::simulated_value_at(profiles, o.day, o.depth_cm);
        (heads ? stored.pressure_head : stored.water_content)
            .push_back({r.name, o.day, o.depth_cm, o.value, value.value_or(std::numeric_limits<double>::quiet_NaN()),
                        o.reliable && value.has_value()});
      }
    }
  }
  auto add = [&](const SensorFitRow& row) {
    const auto& m = row.metrics;
    stored.metrics.push_back({row.name, row.quantity, row.unit, row.depth_cm, m.count, row.beyond_working_limit, row.outside_run,
                              m.bias, m.root_mean_square_error, m.nash_sutcliffe, m.kling_gupta});
  };
  for (const auto& row : check.sensors) add(row);
  for (const auto& row : check.pooled) add(row);
  return stored;
}

SensorCheck check_from_record(const profiles::SensorComparisonRecord& stored) {
  SensorCheck check;
  for (const auto& m : stored.metrics) {
    SensorFitRow row{m.name, "", m.depth_cm, m.quantity, m.unit, {}, m.left_out_beyond_working_limit, m.left_out_outside_run};
    row.metrics.count = m.readings_used;
    row.metrics.bias = m.bias;
    row.metrics.root_mean_square_error = m.root_mean_square_error;
    row.metrics.nash_sutcliffe = m.nash_sutcliffe;
    row.metrics.kling_gupta = m.kling_gupta;
    (std::isnan(m.depth_cm) ? check.pooled : check.sensors).push_back(std::move(row));
  }
  return check;
}

}  // namespace wetfront::cli
