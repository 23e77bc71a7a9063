// Least-squares steady outflow from reservoir level readings; see steady_rate.hpp.
#include "wetfront/soils/steady_rate.hpp"

#include <cmath>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {
namespace {

struct LineFit {
  double slope = 0.0;      // dL/dt, cm/d
  double intercept = 0.0;  // cm
};

// Ordinary least squares L = intercept + slope t, centred sums for round-off.
LineFit fit_line(std::span<const ReservoirReading> readings) {
  double mean_t = 0.0;
  double mean_level = 0.0;
  for (const auto& r : readings) {
    mean_t += r.time_d;
    mean_level += r.water_level_cm;
  }
  const auto count = static_cast<double>(readings.size());
  mean_t /= count;
  mean_level /= count;
  double s_tt = 0.0;
  double s_tl = 0.0;
  for (const auto& r : readings) {
    s_tt += (r.time_d - mean_t) * (r.time_d - mean_t);
    s_tl += (r.time_d - mean_t) * (r.water_level_cm - mean_level);
  }
  const double slope = s_tl / s_tt;
  return {slope, mean_level - slope * mean_t};
}

}  // namespace

double cm3_per_d_to_cm3_per_min(double cm3_per_d) { return cm3_per_d / (24.0 * 60.0); }

SteadyOutflow steady_outflow(std::span<const ReservoirReading> steady_readings, double reservoir_area_cm2,
                             const SteadinessTolerances& tolerances) {
  if (!(reservoir_area_cm2 > 0.0) || !std::isfinite(reservoir_area_cm2)) {
    throw base::InputError(
        fmt::format("reservoir cross-section area must be positive, got {} cm2", reservoir_area_cm2));
  }
  if (steady_readings.size() < 4) {
    throw base::InputError(
        fmt::format("a steady rate needs at least 4 readings marked steady (two for each half of the "
                    "drift check), got {}",
                    steady_readings.size()));
  }
  for (std::size_t i = 0; i < steady_readings.size(); ++i) {
    const auto& r = steady_readings[i];
    if (!std::isfinite(r.time_d) || !std::isfinite(r.water_level_cm)) {
      throw InvalidReading(i, "time and water level must be finite numbers");
    }
    if (i > 0 && !(r.time_d > steady_readings[i - 1].time_d)) {
      throw InvalidReading(
          i, fmt::format("times must increase strictly: {} d follows {} d", r.time_d, steady_readings[i - 1].time_d));
    }
  }

  const LineFit whole = fit_line(steady_readings);
  const double fall_rate = -whole.slope;
  if (!(fall_rate > 0.0)) {
    throw base::InputError(
        fmt::format("the reservoir level does not fall over the steady readings (fitted rate {:.4g} cm/d "
                    "upward); outflow would be zero or negative",
                    whole.slope));
  }

  // Drift: halves split at the middle reading; with an odd count the middle one is shared.
  const std::size_t n = steady_readings.size();
  const std::size_t half = n / 2;
  const auto first = steady_readings.subspan(0, n % 2 == 0 ? half : half + 1);
  const auto second = steady_readings.subspan(half);
  const double first_rate = -fit_line(first).slope;
  const double second_rate = -fit_line(second).slope;

  double sum_sq = 0.0;
  for (const auto& r : steady_readings) {
    const double residual = r.water_level_cm - (whole.intercept + whole.slope * r.time_d);
    sum_sq += residual * residual;
  }
  // Two fitted parameters leave n - 2 degrees of freedom.
  const double residual_std = std::sqrt(sum_sq / static_cast<double>(n - 2));
  const double total_fall = fall_rate * (steady_readings.back().time_d - steady_readings.front().time_d);

  SteadyOutflow out;
  out.level_fall_rate_cm_per_d = fall_rate;
  out.outflow_cm3_per_d = reservoir_area_cm2 * fall_rate;
  out.first_half_rate_cm_per_d = first_rate;
  out.second_half_rate_cm_per_d = second_rate;
  out.relative_drift = std::abs(first_rate - second_rate) / fall_rate;
  out.residual_std_cm = residual_std;
  out.relative_scatter = residual_std / total_fall;
  out.reading_count = n;

  std::string note;
  if (out.relative_drift > tolerances.max_relative_drift) {
    note = fmt::format("fall rate drifts from {:.4g} to {:.4g} cm/d between the halves ({:.1f}% > {:.1f}% allowed)",
                       first_rate, second_rate, 100.0 * out.relative_drift, 100.0 * tolerances.max_relative_drift);
  }
  if (out.relative_scatter > tolerances.max_relative_scatter) {
    if (!note.empty()) note += "; ";
    note +=
        fmt::format("readings scatter {:.3g} cm about the line, {:.1f}% of the {:.3g} cm fall ({:.1f}% allowed)",
                    residual_std, 100.0 * out.relative_scatter, total_fall, 100.0 * tolerances.max_relative_scatter);
  }
  out.steady = note.empty();
  out.steadiness_note = note;
  return out;
}

}  // namespace wetfront::soils
