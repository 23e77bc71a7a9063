// Which sensor readings a parameter study and an anchored season compare with the model, and
// with what uncertainty (adjustable_parameters.hpp, "Scoring"): tensiometer heads, and probe and
// core water contents when [fit] gives their uncertainty. Well levels describe the water table
// below the column, which the bottom boundary holds, and are not compared.
#pragma once

#include "wetfront/site/adjustable_parameters.hpp"
#include "wetfront/site/sensor_readings.hpp"

namespace wetfront::site::detail {

inline bool is_head(const SensorRecord& r) { return r.quantity == kPressureHead; }
inline bool is_water_content(const SensorRecord& r) { return r.quantity == kWaterContent; }

// Whether a reading enters the comparison: reliable, inside the run, of a compared quantity.
inline bool compared(const SensorRecord& r, const observations::Observation& o, const FitWeights& weights,
                     double end_day) {
  if (!o.reliable || o.day < 0 || o.day > end_day + 1e-9) return false;
  return is_head(r) || (is_water_content(r) && weights.water_content_uncertainty.has_value());
}

// The reading uncertainty (sd) of a compared reading's quantity.
inline double reading_uncertainty(const SensorRecord& r, const FitWeights& weights) {
  return is_head(r) ? weights.head_uncertainty_cm : *weights.water_content_uncertainty;
}

}  // namespace wetfront::site::detail
