// Tensiometer readings to cup pressure head; see tensiometer.hpp for the hydrostatics.
#include "wetfront/observations/tensiometer.hpp"

#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

double tension_in_kilopascal(Tension tension) {
  switch (tension.unit) {
    case TensionUnit::kilopascal:
    case TensionUnit::centibar: return tension.value;
    case TensionUnit::millibar: return tension.value / 10.0;
    case TensionUnit::cm_of_water: return tension.value / kCmOfWaterPerKilopascal;
  }
  throw base::InputError("unknown tension unit");
}

double tension_as_head_cm(Tension tension) {
  if (tension.unit == TensionUnit::cm_of_water) return tension.value;
  return tension_in_kilopascal(tension) * kCmOfWaterPerKilopascal;
}

double cup_pressure_head_cm(const TensiometerInstallation& installation, Tension tension) {
  if (installation.cup_depth_cm < 0)
    throw base::InputError(fmt::format("tensiometer cup depth {} cm is above the surface; depths are positive downward",
                                       installation.cup_depth_cm));
  const double head_as_read = -tension_as_head_cm(tension);
  if (installation.read_at == ReadingPoint::transducer_at_cup) return head_as_read;
  if (installation.gauge_height_above_ground_cm < 0)
    throw base::InputError(
        fmt::format("gauge height {} cm above ground must not be negative", installation.gauge_height_above_ground_cm));
  // The water column from the gauge down to the cup adds its length to the head at the cup.
  return head_as_read + installation.gauge_height_above_ground_cm + installation.cup_depth_cm;
}

bool within_working_limit(Tension tension, WorkingLimit limit) {
  return tension_in_kilopascal(tension) <= limit.tension_kilopascal;
}

CupHeadSeries cup_pressure_heads(const TensiometerInstallation& installation,
                                 std::span<const TensiometerReading> readings, WorkingLimit limit) {
  CupHeadSeries series;
  series.heads.reserve(readings.size());
  for (const TensiometerReading& reading : readings) {
    const bool reliable = within_working_limit(reading.tension, limit);
    if (!reliable) ++series.unreliable_count;
    series.heads.push_back(
        {reading.day, installation.cup_depth_cm, cup_pressure_head_cm(installation, reading.tension), reliable});
  }
  return series;
}

}  // namespace wetfront::observations
