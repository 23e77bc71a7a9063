#include "field_checks_io.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

#include "cf_variables.hpp"

namespace wetfront::profiles {

namespace {

namespace h5 = hdf5;

void require_length(std::size_t actual, std::size_t expected, std::string_view what) {
  if (actual != expected)
    throw std::invalid_argument(
        fmt::format("{} has {} entries, expected {} (one per visit interval)", what, actual, expected));
}

// The per-interval columns every recharge estimate has (amount, agreement, missing).
template <class Estimate>
void check_agreement_lengths(const Estimate& e, std::size_t intervals, std::string_view estimate) {
  require_length(e.amount_cm.size(), intervals, fmt::format("{} amount", estimate));
  require_length(e.agreement.size(), intervals, fmt::format("{} agreement", estimate));
  require_length(e.missing.size(), intervals, fmt::format("{} missing", estimate));
}

void check_darcy(const DarcyEstimateRecord& d, std::size_t intervals) {
  check_agreement_lengths(d, intervals, "Darcy estimate");
  if (!(d.upper_depth_cm < d.lower_depth_cm))
    throw std::invalid_argument(fmt::format("Darcy estimate: upper cup at {} cm is not above the lower one at {} cm",
                                            d.upper_depth_cm, d.lower_depth_cm));
}

void check_water_table(const WaterTableEstimateRecord& w, std::size_t intervals) {
  check_agreement_lengths(w, intervals, "water-table estimate");
  require_length(w.start_depth_cm.size(), intervals, "water-table estimate start depth");
  require_length(w.end_depth_cm.size(), intervals, "water-table estimate end depth");
  if (!(w.specific_yield > 0 && w.specific_yield < 1))
    throw std::invalid_argument(
        fmt::format("water-table estimate: specific yield {} is not between 0 and 1", w.specific_yield));
}

void check_stored_water(const StoredWaterRecord& s, std::size_t intervals) {
  require_length(s.observed_change_cm.size(), intervals, "stored water observed change");
  require_length(s.simulated_change_cm.size(), intervals, "stored water simulated change");
  const std::size_t visits = s.visit_days.size();
  if (visits != intervals + 1)
    throw std::invalid_argument(fmt::format(
        "stored water has {} visit times, expected {} (the run start and every interval end)", visits, intervals + 1));
  if (s.observed_cm.size() != visits || s.simulated_cm.size() != visits)
    throw std::invalid_argument("stored water: observed and simulated need one value per visit time");
  if (s.depths_cm.size() < 2) throw std::invalid_argument("stored water needs two or more depths");
}

// A per-interval dataset along the root's interval_end.
void along_intervals(const h5::Dataset& dataset, const h5::Dataset& interval_end) {
  h5::attach_dimension_scale(dataset, interval_end, 0);
}

void write_one_text(hid_t parent, std::string_view name, const std::string& text, std::string_view long_name) {
  h5::write_text_scalar(parent, name, text, long_name);
}

void write_one_number(hid_t parent, std::string_view name, double value, std::string_view units,
                      std::string_view long_name) {
  h5::write_double_scalar(parent, name, value, {units, long_name});
}

using cf::set_depth_attributes;

// The visit intervals as a group's own coordinate.
struct Intervals {
  const std::vector<double>& ends;
  const std::string& time_units;
};

h5::Dataset write_interval_ends(hid_t group, const Intervals& intervals) {
  return cf::write_time_axis(group, "interval_end", intervals.ends, intervals.time_units, "end of the visit interval");
}

void write_agreement(hid_t group, const h5::Dataset& interval_end, const std::vector<double>& amount,
                     const std::vector<std::string>& agreement, const std::vector<std::string>& missing,
                     std::string_view amount_long_name) {
  along_intervals(h5::write_vector(group, "amount", amount, {"cm", amount_long_name}), interval_end);
  along_intervals(h5::write_texts(group, "agreement", agreement,
                                  {"",
                                   "against the model's drainage at the recharge plane: agree, differ (signs differ "
                                   "or one exceeds the other by more than a factor of 2) or no estimate"}),
                  interval_end);
  along_intervals(
      h5::write_texts(group, "missing", missing, {"", "why the interval has no estimate (empty when it has one)"}),
      interval_end);
}

void write_darcy(hid_t parent, const DarcyEstimateRecord& d, const Intervals& intervals) {
  h5::Group group = h5::create_group(parent, "darcy");
  const h5::Dataset interval_end = write_interval_ends(group.id(), intervals);
  // The pair as dimension `sensor` (names as its coordinate), their depths along it.
  h5::Dataset sensor = h5::write_texts(group.id(), "sensor", {d.upper_sensor, d.lower_sensor},
                                       {"", "tensiometer pair, the upper first"});
  h5::make_coordinate(sensor);
  const double depths[2] = {d.upper_depth_cm, d.lower_depth_cm};
  h5::Dataset depth = h5::write_vector(group.id(), "sensor_depth", depths, {"cm", "depth of each tensiometer cup"});
  set_depth_attributes(depth);
  h5::attach_dimension_scale(depth, sensor, 0);
  write_one_text(
      group.id(), "conductivity_note", d.conductivity_note,
      "which layer's hydraulic model gives the conductivity, at which head, and how an interval's estimate is formed");
  write_agreement(group.id(), interval_end, d.amount_cm, d.agreement, d.missing,
                  "Darcy estimate of the flow below the pair in the interval (positive downward; NaN: no estimate)");
}

void write_water_table(hid_t parent, const WaterTableEstimateRecord& w, const Intervals& intervals) {
  h5::Group group = h5::create_group(parent, "water_table");
  const h5::Dataset interval_end = write_interval_ends(group.id(), intervals);
  write_one_text(group.id(), "well", w.well, "observation well read for the water-table level");
  write_one_number(group.id(), "specific_yield", w.specific_yield, "1",
                   "specific yield of the aquifer at the water table");
  write_one_text(group.id(), "specific_yield_note", w.specific_yield_note, "where the specific yield comes from");
  write_one_number(group.id(), "recession_rate", w.recession_cm_per_d, "cm/d",
                   "fall of the water table without recharge (antecedent recession)");
  h5::Dataset start = h5::write_vector(group.id(), "start_depth", w.start_depth_cm,
                                       {"cm", "water-table depth read at the start of the interval (NaN: no reading)"});
  h5::set_text_attribute(start.id(), ".", "positive", "down");
  along_intervals(start, interval_end);
  h5::Dataset end = h5::write_vector(group.id(), "end_depth", w.end_depth_cm,
                                     {"cm", "water-table depth read at the end of the interval (NaN: no reading)"});
  h5::set_text_attribute(end.id(), ".", "positive", "down");
  along_intervals(end, interval_end);
  write_agreement(group.id(), interval_end, w.amount_cm, w.agreement, w.missing,
                  "water-table-fluctuation recharge in the interval: specific yield x rise (NaN: no estimate)");
}

void write_stored_water(hid_t file, const StoredWaterRecord& s, const Intervals& intervals) {
  h5::Group group = h5::create_group(file, "stored_water");
  const h5::Dataset interval_end = write_interval_ends(group.id(), intervals);
  const h5::Dataset depth =
      cf::write_depth_axis(group.id(), "depth", s.depths_cm, "water-content depths the storage spans");
  h5::make_coordinate(
      h5::write_texts(group.id(), "source", s.sources, {"", "probes and core samples that give the readings"}));
  const h5::Dataset time = cf::write_time_axis(group.id(), "storage_time", s.visit_days, intervals.time_units,
                                               "the run start and the end of every visit interval");
  h5::attach_dimension_scale(
      h5::write_vector(
          group.id(), "observed", s.observed_cm,
          {"cm", "water stored over the depths from the readings (trapezoid; NaN: a depth has no reading)"}),
      time, 0);
  h5::attach_dimension_scale(
      h5::write_vector(group.id(), "simulated", s.simulated_cm,
                       {"cm", "water stored over the depths in the model at the same depths and times"}),
      time, 0);
  along_intervals(
      h5::write_vector(group.id(), "observed_change", s.observed_change_cm,
                       {"cm", "change of the observed storage over the interval (positive: gained; NaN: missing)"}),
      interval_end);
  along_intervals(h5::write_vector(group.id(), "simulated_change", s.simulated_change_cm,
                                   {"cm", "change of the simulated storage over the interval (positive: gained)"}),
                  interval_end);
}

// What write_agreement wrote: the estimate's amount, agreement and missing per interval.
template <class Estimate>
void read_agreement(hid_t group, std::size_t intervals, Estimate& e) {
  e.amount_cm = h5::read_doubles_of_length(group, "amount", intervals);
  e.agreement = h5::read_texts_of_length(group, "agreement", intervals);
  e.missing = h5::read_texts_of_length(group, "missing", intervals);
}

DarcyEstimateRecord read_darcy(hid_t parent, std::size_t intervals) {
  h5::Group group = h5::open_group(parent, "darcy");
  DarcyEstimateRecord d;
  const auto sensors = h5::read_texts_of_length(group.id(), "sensor", 2);
  const auto depths = h5::read_doubles_of_length(group.id(), "sensor_depth", 2);
  d.upper_sensor = sensors[0];
  d.lower_sensor = sensors[1];
  d.upper_depth_cm = depths[0];
  d.lower_depth_cm = depths[1];
  d.conductivity_note = h5::read_text_scalar(group.id(), "conductivity_note");
  read_agreement(group.id(), intervals, d);
  return d;
}

WaterTableEstimateRecord read_water_table(hid_t parent, std::size_t intervals) {
  h5::Group group = h5::open_group(parent, "water_table");
  WaterTableEstimateRecord w;
  w.well = h5::read_text_scalar(group.id(), "well");
  w.specific_yield = h5::read_double_scalar(group.id(), "specific_yield");
  w.specific_yield_note = h5::read_text_scalar(group.id(), "specific_yield_note");
  w.recession_cm_per_d = h5::read_double_scalar(group.id(), "recession_rate");
  w.start_depth_cm = h5::read_doubles_of_length(group.id(), "start_depth", intervals);
  w.end_depth_cm = h5::read_doubles_of_length(group.id(), "end_depth", intervals);
  read_agreement(group.id(), intervals, w);
  return w;
}

StoredWaterRecord read_stored_water(hid_t file, std::size_t intervals) {
  h5::Group group = h5::open_group(file, "stored_water");
  StoredWaterRecord s;
  std::vector<std::size_t> dims;
  s.depths_cm = h5::read_doubles(group.id(), "depth", 1, dims);
  s.sources = h5::read_texts(group.id(), "source");
  s.visit_days = h5::read_doubles_of_length(group.id(), "storage_time", intervals + 1);
  s.observed_cm = h5::read_doubles_of_length(group.id(), "observed", intervals + 1);
  s.simulated_cm = h5::read_doubles_of_length(group.id(), "simulated", intervals + 1);
  s.observed_change_cm = h5::read_doubles_of_length(group.id(), "observed_change", intervals);
  s.simulated_change_cm = h5::read_doubles_of_length(group.id(), "simulated_change", intervals);
  return s;
}

}  // namespace

void check_field_checks(const RunRecord& record) {
  const std::size_t intervals = record.visit_balance.size();
  if (record.darcy_estimate) check_darcy(*record.darcy_estimate, intervals);
  if (record.water_table_estimate) check_water_table(*record.water_table_estimate, intervals);
  if (record.stored_water) check_stored_water(*record.stored_water, intervals);
}

void write_field_checks(hid_t file, const RunRecord& record, const std::string& time_units,
                        const std::vector<double>& interval_ends) {
  const Intervals intervals{interval_ends, time_units};
  if (record.darcy_estimate || record.water_table_estimate) {
    h5::Group group = h5::create_group(file, "recharge_estimates");
    if (record.darcy_estimate) write_darcy(group.id(), *record.darcy_estimate, intervals);
    if (record.water_table_estimate) write_water_table(group.id(), *record.water_table_estimate, intervals);
  }
  if (record.stored_water) write_stored_water(file, *record.stored_water, intervals);
}

void read_field_checks(hid_t file, RunRecord& record) {
  const std::size_t intervals = record.visit_balance.size();
  if (h5::has_link(file, "recharge_estimates")) {
    h5::Group group = h5::open_group(file, "recharge_estimates");
    if (h5::has_link(group.id(), "darcy")) record.darcy_estimate = read_darcy(group.id(), intervals);
    if (h5::has_link(group.id(), "water_table")) record.water_table_estimate = read_water_table(group.id(), intervals);
  }
  if (h5::has_link(file, "stored_water")) record.stored_water = read_stored_water(file, intervals);
}

}  // namespace wetfront::profiles
