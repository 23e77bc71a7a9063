// Field-by-field comparison of run records, reporting the first differing field.
#pragma once

#include <cmath>
#include <optional>
#include <vector>
#include <gtest/gtest.h>

#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles::testing {

inline void expect_same_snapshot(const solver::ProfileSnapshot& a, const solver::ProfileSnapshot& b) {
  EXPECT_EQ(a.time_days, b.time_days);
  EXPECT_EQ(a.head_cm, b.head_cm);
  EXPECT_EQ(a.water_content, b.water_content);
  EXPECT_EQ(a.conductivity_cm_per_d, b.conductivity_cm_per_d);
  EXPECT_EQ(a.sink_rate_per_day, b.sink_rate_per_day);
  EXPECT_EQ(a.face_flux_cm_per_d, b.face_flux_cm_per_d);
  EXPECT_EQ(a.ponded_depth_cm, b.ponded_depth_cm);
}

inline void expect_same_balance(const solver::CumulativeBalance& a, const solver::CumulativeBalance& b) {
  EXPECT_EQ(a.time_days, b.time_days);
  EXPECT_EQ(a.water_input_cm, b.water_input_cm);
  EXPECT_EQ(a.potential_evaporation_cm, b.potential_evaporation_cm);
  EXPECT_EQ(a.actual_evaporation_cm, b.actual_evaporation_cm);
  EXPECT_EQ(a.runoff_cm, b.runoff_cm);
  EXPECT_EQ(a.infiltration_cm, b.infiltration_cm);
  EXPECT_EQ(a.transpiration_cm, b.transpiration_cm);
  EXPECT_EQ(a.bottom_flux_cm, b.bottom_flux_cm);
  EXPECT_EQ(a.plane_flux_cm, b.plane_flux_cm);
  EXPECT_EQ(a.ponded_depth_cm, b.ponded_depth_cm);
  EXPECT_EQ(a.soil_storage_cm, b.soil_storage_cm);
  EXPECT_EQ(a.balance_error_cm, b.balance_error_cm);
}

// Equal, with NaN (no value) equal to NaN.
inline bool same_value(double x, double y) { return (std::isnan(x) && std::isnan(y)) || x == y; }

inline bool same_values(const std::vector<double>& x, const std::vector<double>& y) {
  if (x.size() != y.size()) return false;
  for (std::size_t i = 0; i < x.size(); ++i)
    if (!same_value(x[i], y[i])) return false;
  return true;
}

// Both present and alike (`compare` checks their fields), or both absent.
template <class T, class Compare>
void expect_same_optional(const std::optional<T>& a, const std::optional<T>& b, Compare compare) {
  ASSERT_EQ(a.has_value(), b.has_value());
  if (a) compare(*a, *b);
}

// The same number of elements, alike pairwise (`compare` checks their fields), each traced as
// "label i".
template <class T, class Compare>
void expect_same_each(const std::vector<T>& a, const std::vector<T>& b, const char* label, Compare compare) {
  ASSERT_EQ(a.size(), b.size()) << label;
  for (std::size_t i = 0; i < a.size(); ++i) {
    SCOPED_TRACE(::testing::Message() << label << " " << i);
    compare(a[i], b[i]);
  }
}

// The per-interval columns every recharge estimate has.
template <class Estimate>
void expect_same_agreement(const Estimate& x, const Estimate& y) {
  EXPECT_TRUE(same_values(x.amount_cm, y.amount_cm));
  EXPECT_EQ(x.agreement, y.agreement);
  EXPECT_EQ(x.missing, y.missing);
}

inline void expect_same_record(const RunRecord& a, const RunRecord& b) {
  EXPECT_EQ(a.site_name, b.site_name);
  EXPECT_EQ(a.run_start_date, b.run_start_date);
  EXPECT_EQ(a.program_version, b.program_version);
  EXPECT_EQ(a.input_hash, b.input_hash);

  const solver::ColumnRun& ra = a.run;
  const solver::ColumnRun& rb = b.run;
  EXPECT_EQ(ra.cell_depths_cm, rb.cell_depths_cm);
  EXPECT_EQ(ra.face_depths_cm, rb.face_depths_cm);
  expect_same_each(ra.profiles, rb.profiles, "profile", expect_same_snapshot);
  expect_same_each(ra.balances, rb.balances, "balance row", expect_same_balance);
  EXPECT_EQ(ra.statistics.steps, rb.statistics.steps);
  EXPECT_EQ(ra.statistics.residual_evaluations, rb.statistics.residual_evaluations);
  EXPECT_EQ(ra.statistics.jacobian_evaluations, rb.statistics.jacobian_evaluations);
  EXPECT_EQ(ra.statistics.nonlinear_iterations, rb.statistics.nonlinear_iterations);
  EXPECT_EQ(ra.statistics.nonlinear_failures, rb.statistics.nonlinear_failures);
  EXPECT_EQ(ra.statistics.error_test_failures, rb.statistics.error_test_failures);
  EXPECT_EQ(ra.statistics.surface_switches, rb.statistics.surface_switches);
  EXPECT_EQ(ra.statistics.bottom_switches, rb.statistics.bottom_switches);
  EXPECT_EQ(ra.complete, rb.complete);
  ASSERT_EQ(ra.failure.has_value(), rb.failure.has_value());
  if (ra.failure) {
    EXPECT_EQ(ra.failure->time_days, rb.failure->time_days);
    EXPECT_EQ(ra.failure->depth_cm, rb.failure->depth_cm);
    EXPECT_EQ(ra.failure->reason, rb.failure->reason);
  }

  expect_same_each(a.layers, b.layers, "layer", [](const auto& x, const auto& y) {
    EXPECT_EQ(x.name, y.name);
    EXPECT_EQ(x.top_depth_cm, y.top_depth_cm);
    EXPECT_EQ(x.bottom_depth_cm, y.bottom_depth_cm);
    EXPECT_EQ(x.model_name, y.model_name);
    expect_same_each(x.parameters, y.parameters, "parameter", [](const auto& p, const auto& q) {
      EXPECT_EQ(p.name, q.name);
      EXPECT_EQ(p.value, q.value);
      EXPECT_EQ(p.unit, q.unit);
    });
  });
  expect_same_each(a.sensors, b.sensors, "sensor", [](const auto& x, const auto& y) {
    EXPECT_EQ(x.name, y.name);
    EXPECT_EQ(x.depth_cm, y.depth_cm);
  });
  EXPECT_EQ(a.flux_plane_depths_cm, b.flux_plane_depths_cm);
  expect_same_each(a.forcing, b.forcing, "forcing interval", [](const auto& x, const auto& y) {
    EXPECT_EQ(x.start_day, y.start_day);
    EXPECT_EQ(x.end_day, y.end_day);
    EXPECT_EQ(x.water_input_cm_per_d, y.water_input_cm_per_d);
    EXPECT_EQ(x.potential_evaporation_cm_per_d, y.potential_evaporation_cm_per_d);
    EXPECT_EQ(x.potential_transpiration_cm_per_d, y.potential_transpiration_cm_per_d);
  });
  EXPECT_EQ(a.visit_days, b.visit_days);
  EXPECT_EQ(a.visit_balance, b.visit_balance);
  ASSERT_EQ(a.sensor_comparison.has_value(), b.sensor_comparison.has_value());
  if (a.sensor_comparison) {
    // NaN: an undefined metric or a reading outside the run.
    const auto& ca = *a.sensor_comparison;
    const auto& cb = *b.sensor_comparison;
    const auto same_reading = [](const auto& x, const auto& y) {
      EXPECT_EQ(x.sensor, y.sensor);
      EXPECT_EQ(x.time_days, y.time_days);
      EXPECT_EQ(x.depth_cm, y.depth_cm);
      EXPECT_EQ(x.observed, y.observed);
      EXPECT_TRUE(same_value(x.simulated, y.simulated)) << x.simulated << " " << y.simulated;
      EXPECT_EQ(x.used, y.used);
    };
    expect_same_each(ca.pressure_head, cb.pressure_head, "head reading", same_reading);
    expect_same_each(ca.water_content, cb.water_content, "water content reading", same_reading);
    expect_same_each(ca.metrics, cb.metrics, "metrics", [](const auto& x, const auto& y) {
      EXPECT_EQ(x.name, y.name);
      EXPECT_EQ(x.quantity, y.quantity);
      EXPECT_EQ(x.unit, y.unit);
      EXPECT_TRUE(same_value(x.depth_cm, y.depth_cm));
      EXPECT_EQ(x.readings_used, y.readings_used);
      EXPECT_EQ(x.left_out_beyond_working_limit, y.left_out_beyond_working_limit);
      EXPECT_EQ(x.left_out_outside_run, y.left_out_outside_run);
      EXPECT_TRUE(same_value(x.bias, y.bias));
      EXPECT_TRUE(same_value(x.root_mean_square_error, y.root_mean_square_error));
      EXPECT_TRUE(same_value(x.nash_sutcliffe, y.nash_sutcliffe));
      EXPECT_TRUE(same_value(x.kling_gupta, y.kling_gupta));
    });
  }
  // The field checks, NaN equal to NaN.
  expect_same_optional(a.darcy_estimate, b.darcy_estimate, [](const auto& x, const auto& y) {
    EXPECT_EQ(x.upper_sensor, y.upper_sensor);
    EXPECT_EQ(x.lower_sensor, y.lower_sensor);
    EXPECT_EQ(x.upper_depth_cm, y.upper_depth_cm);
    EXPECT_EQ(x.lower_depth_cm, y.lower_depth_cm);
    EXPECT_EQ(x.conductivity_note, y.conductivity_note);
    expect_same_agreement(x, y);
  });
  expect_same_optional(a.water_table_estimate, b.water_table_estimate, [](const auto& x, const auto& y) {
    EXPECT_EQ(x.well, y.well);
    EXPECT_EQ(x.specific_yield, y.specific_yield);
    EXPECT_EQ(x.recession_cm_per_d, y.recession_cm_per_d);
    EXPECT_EQ(x.specific_yield_note, y.specific_yield_note);
    EXPECT_TRUE(same_values(x.start_depth_cm, y.start_depth_cm));
    EXPECT_TRUE(same_values(x.end_depth_cm, y.end_depth_cm));
    expect_same_agreement(x, y);
  });
  expect_same_optional(a.stored_water, b.stored_water, [](const auto& x, const auto& y) {
    EXPECT_EQ(x.depths_cm, y.depths_cm);
    EXPECT_EQ(x.sources, y.sources);
    EXPECT_EQ(x.visit_days, y.visit_days);
    EXPECT_TRUE(same_values(x.observed_cm, y.observed_cm));
    EXPECT_TRUE(same_values(x.simulated_cm, y.simulated_cm));
    EXPECT_TRUE(same_values(x.observed_change_cm, y.observed_change_cm));
    EXPECT_TRUE(same_values(x.simulated_change_cm, y.simulated_change_cm));
  });
}

}  // namespace wetfront::profiles::testing
