// Steady outflow from a Mariotte reservoir read by eye: the crew notes the water level in
// the reservoir at successive times, and marks the readings taken once flow has settled.
//
// Over the steady readings the level falls linearly in time, L(t) = L0 - v t, so the
// outflow is Q = A v with A the reservoir's inner cross-section (continuity). The fall rate
// v comes from an ordinary least-squares line through (t, L). Steadiness is judged by
// two numbers, both reported:
//  - drift: the rates fitted separately to the first and second halves of the steady
//    readings differ by |v1 - v2| / v relative to the whole-run rate;
//  - scatter: the residual standard deviation of the line divided by the total level
//    fall over the steady readings.
// The tolerances are ours (a judgement call, common practice in spirit rather than a
// published rule), and are caller settings.
#pragma once

#include <cstddef>
#include <span>
#include <stdexcept>
#include <string>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

// A reading that breaks a rule of the method; reading_index is 0-based in the span given,
// so a caller that read the values from a file can name the line.
class InvalidReading : public base::InputError {
 public:
  InvalidReading(std::size_t reading_index, const std::string& message)
      : base::InputError(message), reading_index_(reading_index) {}
  std::size_t reading_index() const { return reading_index_; }

 private:
  std::size_t reading_index_;
};

struct ReservoirReading {
  double time_d = 0.0;          // time since the test started, d
  double water_level_cm = 0.0;  // height of the water in the reservoir on its scale, cm (falls as water leaves)
};

struct SteadinessTolerances {
  double max_relative_drift = 0.10;    // |v_first_half - v_second_half| / v, dimensionless
  double max_relative_scatter = 0.05;  // residual std. deviation / total level fall, dimensionless
};

struct SteadyOutflow {
  double outflow_cm3_per_d = 0.0;         // Q = A v, cm3/d
  double level_fall_rate_cm_per_d = 0.0;  // v, cm/d (positive when the level falls)
  double first_half_rate_cm_per_d = 0.0;
  double second_half_rate_cm_per_d = 0.0;
  double relative_drift = 0.0;    // |v1 - v2| / v
  double residual_std_cm = 0.0;   // standard deviation of the residuals about the line, cm
  double relative_scatter = 0.0;  // residual_std_cm / total fall
  std::size_t reading_count = 0;
  bool steady = false;          // both drift and scatter within tolerance
  std::string steadiness_note;  // empty when steady; otherwise says which check failed
};

double cm3_per_d_to_cm3_per_min(double cm3_per_d);

// Fits the steady readings. Requires at least four readings (two per half), a positive
// reservoir area and a falling level (base::InputError otherwise), and times strictly
// increasing (InvalidReading naming the first reading out of order).
SteadyOutflow steady_outflow(std::span<const ReservoirReading> steady_readings, double reservoir_area_cm2,
                             const SteadinessTolerances& tolerances = {});

}  // namespace wetfront::soils
