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
  ASSERT_EQ(ra.profiles.size(), rb.profiles.size());
  for (std::size_t i = 0; i < ra.profiles.size(); ++i) {
    SCOPED_TRACE(::testing::Message() << "profile " << i);
    expect_same_snapshot(ra.profiles[i], rb.profiles[i]);
  }
  ASSERT_EQ(ra.balances.size(), rb.balances.size());
  for (std::size_t i = 0; i < ra.balances.size(); ++i) {
    SCOPED_TRACE(::testing::Message() << "balance row " << i);
    expect_same_balance(ra.balances[i], rb.balances[i]);
  }
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

  ASSERT_EQ(a.layers.size(), b.layers.size());
  for (std::size_t i = 0; i < a.layers.size(); ++i) {
    SCOPED_TRACE(::testing::Message() << "layer " << i);
    EXPECT_EQ(a.layers[i].name, b.layers[i].name);
    EXPECT_EQ(a.layers[i].top_depth_cm, b.layers[i].top_depth_cm);
    EXPECT_EQ(a.layers[i].bottom_depth_cm, b.layers[i].bottom_depth_cm);
    EXPECT_EQ(a.layers[i].model_name, b.layers[i].model_name);
    ASSERT_EQ(a.layers[i].parameters.size(), b.layers[i].parameters.size());
    for (std::size_t p = 0; p < a.layers[i].parameters.size(); ++p) {
      EXPECT_EQ(a.layers[i].parameters[p].name, b.layers[i].parameters[p].name);
      EXPECT_EQ(a.layers[i].parameters[p].value, b.layers[i].parameters[p].value);
      EXPECT_EQ(a.layers[i].parameters[p].unit, b.layers[i].parameters[p].unit);
    }
  }
  ASSERT_EQ(a.sensors.size(), b.sensors.size());
  for (std::size_t i = 0; i < a.sensors.size(); ++i) {
    EXPECT_EQ(a.sensors[i].name, b.sensors[i].name);
    EXPECT_EQ(a.sensors[i].depth_cm, b.sensors[i].depth_cm);
  }
  EXPECT_EQ(a.flux_plane_depths_cm, b.flux_plane_depths_cm);
  ASSERT_EQ(a.forcing.size(), b.forcing.size());
  for (std::size_t i = 0; i < a.forcing.size(); ++i) {
    SCOPED_TRACE(::testing::Message() << "forcing interval " << i);
    EXPECT_EQ(a.forcing[i].start_day, b.forcing[i].start_day);
    EXPECT_EQ(a.forcing[i].end_day, b.forcing[i].end_day);
    EXPECT_EQ(a.forcing[i].water_input_cm_per_d, b.forcing[i].water_input_cm_per_d);
    EXPECT_EQ(a.forcing[i].potential_evaporation_cm_per_d, b.forcing[i].potential_evaporation_cm_per_d);
    EXPECT_EQ(a.forcing[i].potential_transpiration_cm_per_d, b.forcing[i].potential_transpiration_cm_per_d);
  }
  EXPECT_EQ(a.visit_days, b.visit_days);
  EXPECT_EQ(a.visit_balance, b.visit_balance);
  ASSERT_EQ(a.sensor_comparison.has_value(), b.sensor_comparison.has_value());
  if (a.sensor_comparison) {
    // NaN: an undefined metric or a reading outside the run.
    const auto& ca = *a.sensor_comparison;
    const auto& cb = *b.sensor_comparison;
    for (const auto* lists : {&ca.pressure_head, &ca.water_content}) {
      const auto& other = lists == &ca.pressure_head ? cb.pressure_head : cb.water_content;
      ASSERT_EQ(lists->size(), other.size());
      for (std::size_t i = 0; i < other.size(); ++i) {
        const auto& x = (*lists)[i];
        const auto& y = other[i];
        EXPECT_EQ(x.sensor, y.sensor);
        EXPECT_EQ(x.time_days, y.time_days);
        EXPECT_EQ(x.depth_cm, y.depth_cm);
        EXPECT_EQ(x.observed, y.observed);
        EXPECT_TRUE(same_value(x.simulated, y.simulated)) << x.simulated << " " << y.simulated;
        EXPECT_EQ(x.used, y.used);
      }
    }
    ASSERT_EQ(ca.metrics.size(), cb.metrics.size());
    for (std::size_t i = 0; i < ca.metrics.size(); ++i) {
      const auto& x = ca.metrics[i];
      const auto& y = cb.metrics[i];
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
    }
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
