// The sensor check to and from the run file: metrics (/sensor_comparison/metrics), the Darcy
// and water-table estimates (/recharge_estimates) and the stored water (/stored_water). What
// `show` reads back gives the same report sections as `run` printed: agreement and reasons are
// recomputed from the stored amounts with the same rule (compare_with_model).
#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "wetfront/site/sensor_check.hpp"

namespace wetfront::site {
namespace {

constexpr double kMissing = std::numeric_limits<double>::quiet_NaN();

double or_missing(const std::optional<double>& value) { return value.value_or(kMissing); }

std::optional<double> present(double value) { return std::isnan(value) ? std::nullopt : std::optional<double>(value); }

std::string agreement_text(const EstimateInterval& i) {
  return !i.estimate_cm ? "no estimate" : i.disagree ? "differ" : "agree";
}

// The intervals of an estimate back from its amounts and the model's drainage per interval.
std::vector<EstimateInterval> intervals_from(const profiles::RunRecord& record, const std::vector<double>& amount_cm,
                                             const std::vector<std::string>& missing) {
  std::vector<EstimateInterval> intervals;
  for (std::size_t i = 0; i < record.visit_balance.size() && i < amount_cm.size(); ++i) {
    const auto& b = record.visit_balance[i];
    EstimateInterval interval;
    interval.start_day = b.start_day;
    interval.end_day = b.end_day;
    interval.model_cm = b.plane_flux_cm.empty() ? 0.0 : b.plane_flux_cm.front();
    interval.estimate_cm = present(amount_cm[i]);
    interval.missing = i < missing.size() ? missing[i] : "";
    compare_with_model(interval);
    intervals.push_back(std::move(interval));
  }
  return intervals;
}

// The readings within the run's times but above the shallowest or below the deepest cell
// centre: not stored as a count, so counted again from the stored readings, the output times
// and the cell depths (a stored reading is unused and has no simulated value there).
void count_outside_depth(const profiles::RunRecord& record, SensorCheck& check) {
  const auto& times = record.run.balances;  // one row per output time
  const auto& depths = record.run.cell_depths_cm;
  if (times.size() < 2 || depths.empty()) return;
  auto outside = [&](const profiles::ComparedReading& r) {
    return !r.used && r.time_days >= times.front().time_days && r.time_days <= times.back().time_days &&
           (r.depth_cm < depths.front() || r.depth_cm > depths.back());
  };
  const auto& c = *record.sensor_comparison;
  for (const auto* readings : {&c.pressure_head, &c.water_content}) {
    const std::string quantity(readings == &c.pressure_head ? kPressureHead : kWaterContent);
    for (const auto& r : *readings) {
      if (!outside(r)) continue;
      for (auto& row : check.sensors) {
        if (row.name == r.sensor) ++row.outside_depth;
      }
      for (auto& row : check.pooled) {
        if (row.quantity == quantity) ++row.outside_depth;
      }
    }
  }
}

// The water-content sources from the metric rows: a row named like a probe of the run file's
// sensor list ("P20 (water content probe)") is that probe; a row "C at 20 cm" of a core-samples
// entry C is that entry at its depth.
std::vector<StorageSource> storage_sources(const profiles::RunRecord& record, const SensorCheck& check) {
  std::vector<StorageSource> sources;
  const std::string probe_suffix = fmt::format(" ({})", kWaterContentProbe);
  const std::string core_suffix = fmt::format(" ({})", kCoreSamples);
  for (const auto& row : check.sensors) {
    if (row.quantity != kWaterContent) continue;
    for (const auto& sensor : record.sensors) {
      if (sensor.name == row.name + probe_suffix) {
        sources.push_back({row.name, false, row.depth_cm});
      } else if (sensor.name.ends_with(core_suffix)) {
        const std::string core = sensor.name.substr(0, sensor.name.size() - core_suffix.size());
        if (row.name.starts_with(core + " at ")) sources.push_back({core, true, row.depth_cm});
      }
    }
  }
  return sources;
}

}  // namespace

void store_field_checks(const SensorCheck& check, profiles::RunRecord& record) {
  if (check.darcy) {
    const DarcyCheck& d = *check.darcy;
    profiles::DarcyEstimateRecord stored{
        d.upper_name, d.lower_name, d.upper_depth_cm, d.lower_depth_cm, d.soil_note, {}, {}, {}};
    for (const auto& i : d.intervals) {
      stored.amount_cm.push_back(or_missing(i.estimate_cm));
      stored.agreement.push_back(agreement_text(i));
      stored.missing.push_back(i.missing);
    }
    record.darcy_estimate = std::move(stored);
  }
  if (check.water_table) {
    const WaterTableCheck& w = *check.water_table;
    profiles::WaterTableEstimateRecord stored;
    stored.well = w.well;
    stored.specific_yield = w.specific_yield;
    stored.recession_cm_per_d = w.recession_cm_per_d;
    stored.specific_yield_note = w.specific_yield_note;
    for (const auto& i : w.intervals) {
      stored.start_depth_cm.push_back(or_missing(i.start_depth_cm));
      stored.end_depth_cm.push_back(or_missing(i.end_depth_cm));
      stored.amount_cm.push_back(or_missing(i.estimate_cm));
      stored.agreement.push_back(agreement_text(i));
      stored.missing.push_back(i.missing);
    }
    record.water_table_estimate = std::move(stored);
  }
  if (check.storage && check.storage->usable() && !check.storage->visits.empty()) {
    const StorageCheck& s = *check.storage;
    profiles::StoredWaterRecord stored;
    stored.depths_cm = s.depths_cm;
    stored.sources = s.probe_names;
    for (const auto& v : s.visits) {
      stored.visit_days.push_back(v.day);
      stored.observed_cm.push_back(or_missing(v.observed_cm));
      stored.simulated_cm.push_back(or_missing(v.simulated_cm));
    }
    for (const auto& i : s.intervals) {
      stored.observed_change_cm.push_back(or_missing(i.observed_change_cm));
      stored.simulated_change_cm.push_back(or_missing(i.simulated_change_cm));
    }
    record.stored_water = std::move(stored);
  }
}

SensorCheck check_from_record(const profiles::RunRecord& record) {
  SensorCheck check;
  if (record.sensor_comparison) {
    for (const auto& m : record.sensor_comparison->metrics) {
      SensorFitRow row{
          m.name, "", m.depth_cm, m.quantity, m.unit, {}, m.left_out_beyond_working_limit, m.left_out_outside_run};
      row.metrics.count = m.readings_used;
      row.metrics.bias = m.bias;
      row.metrics.root_mean_square_error = m.root_mean_square_error;
      row.metrics.nash_sutcliffe = m.nash_sutcliffe;
      row.metrics.kling_gupta = m.kling_gupta;
      (std::isnan(m.depth_cm) ? check.pooled : check.sensors).push_back(std::move(row));
    }
    count_outside_depth(record, check);
  }
  if (record.darcy_estimate) {
    const auto& d = *record.darcy_estimate;
    check.darcy = DarcyCheck{d.upper_sensor,   d.lower_sensor,      d.upper_depth_cm,
                             d.lower_depth_cm, d.conductivity_note, intervals_from(record, d.amount_cm, d.missing)};
  }
  if (record.water_table_estimate) {
    const auto& w = *record.water_table_estimate;
    WaterTableCheck water_table{w.well, w.specific_yield, w.recession_cm_per_d, w.specific_yield_note,
                                intervals_from(record, w.amount_cm, w.missing)};
    for (std::size_t i = 0; i < water_table.intervals.size(); ++i) {
      if (i < w.start_depth_cm.size()) water_table.intervals[i].start_depth_cm = present(w.start_depth_cm[i]);
      if (i < w.end_depth_cm.size()) water_table.intervals[i].end_depth_cm = present(w.end_depth_cm[i]);
    }
    check.water_table = std::move(water_table);
  }
  if (record.stored_water) {
    const auto& s = *record.stored_water;
    StorageCheck storage;
    storage.depths_cm = s.depths_cm;
    storage.probe_names = s.sources;
    for (std::size_t i = 0; i < s.visit_days.size(); ++i) {
      storage.visits.push_back({s.visit_days[i], present(s.observed_cm[i]), present(s.simulated_cm[i])});
    }
    for (std::size_t i = 0; i < record.visit_balance.size() && i < s.observed_change_cm.size(); ++i) {
      storage.intervals.push_back({record.visit_balance[i].start_day, record.visit_balance[i].end_day,
                                   present(s.observed_change_cm[i]), present(s.simulated_change_cm[i])});
    }
    check.storage = std::move(storage);
  } else if (record.sensor_comparison) {
    // No stored water in the file: the site had water contents at fewer than two depths; find
    // them by the rule `run` used, so that the report says the same.
    StorageCheck storage;
    choose_storage_depths(storage_sources(record, check), storage);
    if (!storage.usable()) check.storage = std::move(storage);
  }
  return check;
}

}  // namespace wetfront::site
