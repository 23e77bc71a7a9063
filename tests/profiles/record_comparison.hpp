// Field-by-field comparison of run records, reporting the first differing field.
#pragma once

#include <cmath>
#include <optional>
#include <vector>
#include <gtest/gtest.h>

#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles::testing {

// Equal, with NaN (no value) equal to NaN.
inline bool same_value(double x, double y) { return (std::isnan(x) && std::isnan(y)) || x == y; }

inline bool same_values(const std::vector<double>& x, const std::vector<double>& y) {
  if (x.size() != y.size()) return false;
  for (std::size_t i = 0; i < x.size(); ++i)
    if (!same_value(x[i], y[i])) return false;
  return true;
}

inline bool alike(double x, double y) { return same_value(x, y); }
inline bool alike(const std::vector<double>& x, const std::vector<double>& y) { return same_values(x, y); }

// EXPECT_EQ on each listed member of x and y; a failure names the member by its place in the list.
template <class T, class... Member>
void expect_same_members(const T& x, const T& y, Member T::*... members) {
  int place = 0;
  const auto same = [&place](const auto& a, const auto& b) {
    ++place;
    EXPECT_EQ(a, b) << "member " << place << " of the list";
  };
  (same(x.*members, y.*members), ...);
}

// The same for numbers and lists of numbers that may hold NaN (no value): NaN equals NaN.
template <class T, class... Member>
void expect_alike_members(const T& x, const T& y, Member T::*... members) {
  int place = 0;
  const auto same = [&place](const auto& a, const auto& b) {
    ++place;
    EXPECT_TRUE(alike(a, b)) << "member " << place << " of the list";
  };
  (same(x.*members, y.*members), ...);
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

inline void expect_same_snapshot(const solver::ProfileSnapshot& a, const solver::ProfileSnapshot& b) {
  using S = solver::ProfileSnapshot;
  expect_same_members(a, b, &S::time_days, &S::head_cm, &S::water_content, &S::conductivity_cm_per_d,
                      &S::sink_rate_per_day, &S::face_flux_cm_per_d, &S::ponded_depth_cm);
}

inline void expect_same_balance(const solver::CumulativeBalance& a, const solver::CumulativeBalance& b) {
  using B = solver::CumulativeBalance;
  expect_same_members(a, b, &B::time_days, &B::water_input_cm, &B::potential_evaporation_cm, &B::actual_evaporation_cm,
                      &B::runoff_cm, &B::infiltration_cm, &B::transpiration_cm, &B::bottom_flux_cm, &B::plane_flux_cm,
                      &B::ponded_depth_cm, &B::soil_storage_cm, &B::balance_error_cm);
}

// The per-interval columns every recharge estimate has.
template <class Estimate>
void expect_same_agreement(const Estimate& x, const Estimate& y) {
  EXPECT_TRUE(same_values(x.amount_cm, y.amount_cm));
  EXPECT_EQ(x.agreement, y.agreement);
  EXPECT_EQ(x.missing, y.missing);
}

inline void expect_same_reading(const ComparedReading& x, const ComparedReading& y) {
  using R = ComparedReading;
  expect_same_members(x, y, &R::sensor, &R::time_days, &R::depth_cm, &R::observed, &R::used);
  EXPECT_TRUE(same_value(x.simulated, y.simulated)) << x.simulated << " " << y.simulated;
}

inline void expect_same_record(const RunRecord& a, const RunRecord& b) {
  expect_same_members(a, b, &RunRecord::site_name, &RunRecord::run_start_date, &RunRecord::program_version,
                      &RunRecord::input_hash);

  const solver::ColumnRun& ra = a.run;
  const solver::ColumnRun& rb = b.run;
  EXPECT_EQ(ra.cell_depths_cm, rb.cell_depths_cm);
  EXPECT_EQ(ra.face_depths_cm, rb.face_depths_cm);
  expect_same_each(ra.profiles, rb.profiles, "profile", expect_same_snapshot);
  expect_same_each(ra.balances, rb.balances, "balance row", expect_same_balance);
  using Statistics = solver::RunStatistics;
  expect_same_members(ra.statistics, rb.statistics, &Statistics::steps, &Statistics::residual_evaluations,
                      &Statistics::jacobian_evaluations, &Statistics::nonlinear_iterations,
                      &Statistics::nonlinear_failures, &Statistics::error_test_failures, &Statistics::surface_switches,
                      &Statistics::bottom_switches);
  EXPECT_EQ(ra.complete, rb.complete);
  expect_same_optional(ra.failure, rb.failure, [](const auto& x, const auto& y) {
    using F = solver::RunFailure;
    expect_same_members(x, y, &F::time_days, &F::depth_cm, &F::reason);
  });

  expect_same_each(a.layers, b.layers, "layer", [](const auto& x, const auto& y) {
    using L = LayerDescription;
    expect_same_members(x, y, &L::name, &L::top_depth_cm, &L::bottom_depth_cm, &L::model_name);
    expect_same_each(x.parameters, y.parameters, "parameter", [](const auto& p, const auto& q) {
      expect_same_members(p, q, &LayerParameter::name, &LayerParameter::value, &LayerParameter::unit);
    });
  });
  expect_same_each(a.sensors, b.sensors, "sensor",
                   [](const auto& x, const auto& y) { expect_same_members(x, y, &Sensor::name, &Sensor::depth_cm); });
  EXPECT_EQ(a.flux_plane_depths_cm, b.flux_plane_depths_cm);
  expect_same_each(a.forcing, b.forcing, "forcing interval", [](const auto& x, const auto& y) {
    using I = ForcingInterval;
    expect_same_members(x, y, &I::start_day, &I::end_day, &I::water_input_cm_per_d, &I::potential_evaporation_cm_per_d,
                        &I::potential_transpiration_cm_per_d);
  });
  EXPECT_EQ(a.visit_days, b.visit_days);
  EXPECT_EQ(a.visit_balance, b.visit_balance);
  expect_same_optional(a.sensor_comparison, b.sensor_comparison, [](const auto& ca, const auto& cb) {
    expect_same_each(ca.pressure_head, cb.pressure_head, "head reading", expect_same_reading);
    expect_same_each(ca.water_content, cb.water_content, "water content reading", expect_same_reading);
    expect_same_each(ca.metrics, cb.metrics, "metrics", [](const auto& x, const auto& y) {
      using M = SensorMetrics;
      expect_same_members(x, y, &M::name, &M::quantity, &M::unit, &M::readings_used, &M::left_out_beyond_working_limit,
                          &M::left_out_outside_run);
      expect_alike_members(x, y, &M::depth_cm, &M::bias, &M::root_mean_square_error, &M::nash_sutcliffe,
                           &M::kling_gupta);
    });
  });
  // The field checks, NaN equal to NaN.
  expect_same_optional(a.darcy_estimate, b.darcy_estimate, [](const auto& x, const auto& y) {
    using D = DarcyEstimateRecord;
    expect_same_members(x, y, &D::upper_sensor, &D::lower_sensor, &D::upper_depth_cm, &D::lower_depth_cm,
                        &D::conductivity_note);
    expect_same_agreement(x, y);
  });
  expect_same_optional(a.water_table_estimate, b.water_table_estimate, [](const auto& x, const auto& y) {
    using W = WaterTableEstimateRecord;
    expect_same_members(x, y, &W::well, &W::specific_yield, &W::recession_cm_per_d, &W::specific_yield_note);
    expect_alike_members(x, y, &W::start_depth_cm, &W::end_depth_cm);
    expect_same_agreement(x, y);
  });
  expect_same_optional(a.stored_water, b.stored_water, [](const auto& x, const auto& y) {
    using S = StoredWaterRecord;
    expect_same_members(x, y, &S::depths_cm, &S::sources, &S::visit_days);
    expect_alike_members(x, y, &S::observed_cm, &S::simulated_cm, &S::observed_change_cm, &S::simulated_change_cm);
  });
}

}  // namespace wetfront::profiles::testing
