#include "wetfront/site/sensor_check.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "wetfront/site/simulated_profiles.hpp"
#include "wetfront/observations/profile_interpolation.hpp"
#include "wetfront/observations/profile_storage.hpp"
#include "wetfront/observations/recharge_estimates.hpp"
#include "wetfront/observations/sensor_comparison.hpp"

namespace wetfront::site {
namespace {

namespace obs = observations;

bool compares(const SensorRecord& r, bool heads) { return r.quantity == (heads ? kPressureHead : kWaterContent); }

std::string pooled_name(const std::vector<const SensorRecord*>& records, bool heads) {
  if (heads) return "all tensiometers";
  bool probes = false, cores = false;
  for (const auto* r : records) (r->kind == kCoreSamples ? cores : probes) = true;
  return probes && cores ? "all probes and cores" : cores ? "all core samples" : "all probes";
}

void compare_kind(const std::vector<SensorRecord>& compared, const obs::SimulatedProfiles& profiles, bool heads,
                  SensorCheck& check, std::vector<std::size_t>& order) {
  std::vector<obs::SensorSeries> series;
  std::vector<const SensorRecord*> records;
  for (const auto& r : compared) {
    if (!compares(r, heads)) continue;
    series.push_back(r.series);
    records.push_back(&r);
  }
  if (series.empty() || profiles.times_day.size() < 2) return;
  const auto report = obs::compare_with_simulation(series, profiles);
  for (std::size_t i = 0; i < records.size(); ++i) {
    const SensorRecord& r = *records[i];
    check.sensors.push_back({r.name, r.kind, r.depth_cm, r.quantity, r.unit, report.sensors[i].metrics,
                             report.sensors[i].unreliable_left_out, report.sensors[i].outside_simulation,
                             report.sensors[i].outside_depth});
    order.push_back(static_cast<std::size_t>(&r - compared.data()));
  }
  check.pooled.push_back({pooled_name(records, heads), "", std::numeric_limits<double>::quiet_NaN(),
                          records.front()->quantity, records.front()->unit, report.overall, report.unreliable_left_out,
                          report.outside_simulation, report.outside_depth});
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
  // What obs::darcy_recharge does: at each visit K(h_mean) with h_mean the arithmetic mean of
  // the two heads; an interval's amount is the mean of the fluxes at its two visits times its
  // length.
  check.soil_note = fmt::format("K from the hydraulic model of layer '{}'", soil.layers()[middle_layer].name);
  if (upper_layer != lower_layer) {
    check.soil_note +=
        fmt::format(" (the cups sit in different layers, '{}' and '{}'; K is taken at their middle depth)",
                    soil.layers()[upper_layer].name, soil.layers()[lower_layer].name);
  }
  check.soil_note +=
      ", at the arithmetic mean head of the pair at each visit; an interval's estimate is the mean of the "
      "fluxes at its two visits times its length";
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
      interval.estimate_cm = obs::darcy_recharge(tensiometers, ends).front().amount_cm;
      compare_with_model(interval);
    } else {
      interval.missing = fmt::format("no reliable reading of both {} and {} within {} d of a visit", upper->name,
                                     lower->name, kVisitReadingWindowDays);
    }
    check.intervals.push_back(std::move(interval));
  }
  return check;
}

}  // namespace

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

void compare_with_model(EstimateInterval& interval) {
  if (!interval.estimate_cm) return;
  const auto agreement = obs::compare_recharge_estimates(interval.model_cm, *interval.estimate_cm,
                                                         {kAgreementFactor, kNegligibleRechargeCm});
  interval.disagree = agreement.disagree;
  interval.ratio = agreement.ratio;
  interval.reasons = agreement.reasons_to_consider;
}

namespace {

// Sorted, with depths closer than kCoreDepthStepCm kept once.
void sort_distinct(std::vector<double>& depths) {
  std::sort(depths.begin(), depths.end());
  depths.erase(std::unique(depths.begin(), depths.end(), same_depth), depths.end());
}

// The series compared with the model: tensiometers and probes as they are, core samples split
// into one series per depth ("NAME at 30 cm"), wells left out (they give the water table).
std::vector<SensorRecord> compared_series(const std::vector<SensorRecord>& readings) {
  std::vector<SensorRecord> compared;
  for (const auto& r : readings) {
    if (r.kind == kObservationWell) continue;
    if (r.kind != kCoreSamples) {
      compared.push_back(r);
      continue;
    }
    std::vector<double> depths;
    for (const auto& o : r.series.observations) depths.push_back(o.depth_cm);
    sort_distinct(depths);
    for (const double depth : depths) {
      SensorRecord one = r;
      one.name = fmt::format("{} at {} cm", r.name, depth);
      one.depth_cm = depth;
      one.series.name = one.name;
      one.series.observations.clear();
      one.lines.clear();
      for (std::size_t k = 0; k < r.series.observations.size(); ++k) {
        if (!same_depth(r.series.observations[k].depth_cm, depth)) continue;
        one.series.observations.push_back(r.series.observations[k]);
        if (k < r.lines.size()) one.lines.push_back(r.lines[k]);
      }
      compared.push_back(std::move(one));
    }
  }
  return compared;
}

// The readings at `depth` that count for a visit on `day`: the nearest reading of every probe
// there within the window; when none of them has one, every core sample at that depth within
// the window.
std::vector<const obs::Observation*> readings_at(const std::vector<const SensorRecord*>& probes,
                                                 const std::vector<const SensorRecord*>& cores, double depth,
                                                 double day) {
  std::vector<const obs::Observation*> found;
  for (const SensorRecord* p : probes) {
    if (!same_depth(p->depth_cm, depth)) continue;
    if (const obs::Observation* o = reading_near(*p, day)) found.push_back(o);
  }
  if (!found.empty()) return found;
  for (const SensorRecord* c : cores) {
    for (const auto& o : c->series.observations) {
      if (same_depth(o.depth_cm, depth) && std::abs(o.day - day) <= kVisitReadingWindowDays) found.push_back(&o);
    }
  }
  return found;
}

}  // namespace

void choose_storage_depths(const std::vector<StorageSource>& sources, StorageCheck& check) {
  std::vector<double> probe_depths, core_depths;
  for (const auto& s : sources) (s.core ? core_depths : probe_depths).push_back(s.depth_cm);
  sort_distinct(probe_depths);
  sort_distinct(core_depths);
  check.depths_cm = probe_depths.size() < 2 && core_depths.size() >= 2 ? core_depths : probe_depths;
  check.probe_names.clear();
  for (const bool core : {false, true}) {
    for (const auto& s : sources) {
      if (s.core != core) continue;
      const bool at_a_depth = std::any_of(check.depths_cm.begin(), check.depths_cm.end(),
                                          [&](double d) { return same_depth(d, s.depth_cm); });
      if (at_a_depth &&
          std::find(check.probe_names.begin(), check.probe_names.end(), s.name) == check.probe_names.end()) {
        check.probe_names.push_back(s.name);
      }
    }
  }
}

namespace {

StorageCheck check_storage(const std::vector<SensorRecord>& readings, const profiles::RunRecord& record,
                           const obs::SimulatedProfiles& profiles) {
  StorageCheck check;
  std::vector<const SensorRecord*> probes, cores;
  for (const auto& r : readings) {
    if (r.kind == kWaterContentProbe) probes.push_back(&r);
    if (r.kind == kCoreSamples) cores.push_back(&r);
  }
  std::vector<StorageSource> sources;
  for (const auto* p : probes) sources.push_back({p->name, false, p->depth_cm});
  for (const auto* c : cores) {
    for (const auto& o : c->series.observations) sources.push_back({c->name, true, o.depth_cm});
  }
  choose_storage_depths(sources, check);
  if (!check.usable() || record.visit_balance.empty()) return check;

  const bool simulated_available = profiles.times_day.size() >= 2;
  // The storage at one visit: at each depth the mean of the readings there, and the model at
  // the same reading times and depths.
  auto storage_at = [&](double day) {
    StorageVisit visit{day, std::nullopt, std::nullopt};
    std::vector<double> observed, modelled;
    bool model_complete = simulated_available;
    for (const double depth : check.depths_cm) {
      const auto found = readings_at(probes, cores, depth, day);
      if (found.empty()) return visit;  // a depth without a reading: no storage at this visit
      double sum_observed = 0, sum_model = 0;
      for (const obs::Observation* o : found) {
        sum_observed += o->value;
        if (!model_complete) continue;
        const auto value = obs::simulated_value_at(profiles, o->day, depth);
        if (value)
          sum_model += *value;
        else
          model_complete = false;
      }
      observed.push_back(sum_observed / static_cast<double>(found.size()));
      modelled.push_back(sum_model / static_cast<double>(found.size()));
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
                               change(start.observed_cm, end.observed_cm),
                               change(start.simulated_cm, end.simulated_cm)});
  }
  return check;
}

}  // namespace

StorageCheck check_storage(const std::vector<SensorRecord>& readings, const profiles::RunRecord& record) {
  return check_storage(readings, record, simulated_profiles(record.run, false));
}

SensorCheck check_sensors(const Season& season, const std::vector<SensorRecord>& readings,
                          const profiles::RunRecord& record) {
  return check_sensors(season, readings, record, sensor_profiles(record.run));
}

SensorCheck check_sensors(const Season& season, const std::vector<SensorRecord>& readings,
                          const profiles::RunRecord& record, const SensorProfiles& simulated) {
  SensorCheck check;
  const std::vector<SensorRecord> compared = compared_series(readings);
  std::vector<std::size_t> order;
  compare_kind(compared, simulated.heads, true, check, order);
  compare_kind(compared, simulated.water_contents, false, check, order);
  // Back to site-file order.
  std::vector<SensorFitRow> rows;
  for (std::size_t index = 0; index < compared.size(); ++index) {
    for (std::size_t k = 0; k < order.size(); ++k) {
      if (order[k] == index) rows.push_back(check.sensors[k]);
    }
  }
  check.sensors = std::move(rows);
  check.darcy = darcy_check(season, readings, record);
  check.water_table = check_water_table(season, readings, record);
  check.storage = check_storage(readings, record, simulated.water_contents);
  return check;
}

profiles::SensorComparisonRecord comparison_record(const SensorCheck& check, const std::vector<SensorRecord>& readings,
                                                   const solver::ColumnRun& run) {
  return comparison_record(check, readings, sensor_profiles(run));
}

profiles::SensorComparisonRecord comparison_record(const SensorCheck& check, const std::vector<SensorRecord>& readings,
                                                   const SensorProfiles& simulated) {
  profiles::SensorComparisonRecord stored;
  const std::vector<SensorRecord> compared = compared_series(readings);
  for (const bool heads : {true, false}) {
    const obs::SimulatedProfiles& profiles = heads ? simulated.heads : simulated.water_contents;
    if (profiles.times_day.size() < 2) break;
    for (const auto& r : compared) {
      if (!compares(r, heads)) continue;
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
    stored.metrics.push_back({row.name, row.quantity, row.unit, row.depth_cm, m.count, row.beyond_working_limit,
                              row.outside_run, m.bias, m.root_mean_square_error, m.nash_sutcliffe, m.kling_gupta});
  };
  for (const auto& row : check.sensors) add(row);
  for (const auto& row : check.pooled) add(row);
  return stored;
}

}  // namespace wetfront::site
