// Tensiometer readings converted to pressure head at the porous cup.
//
// A tensiometer read at a gauge above ground holds a water column from the gauge down to the
// cup; the column adds its length to the head at the cup (hydrostatics, common practice):
//     h_cup = -tension_as_head + (gauge_height_above_ground + cup_depth)      [cm of water]
// A transducer at the cup reads the cup directly: h_cup = -tension_as_head.
// 1 kPa = 1 centibar = 10 mbar = 10.197 cm of water (common practice; 1000 Pa / (rho g) with
// rho = 1000 kg/m3 and g = 9.80665 m/s2 gives 10.1972 cm).
//
// The water column is at its lowest pressure at the instrument, so the working limit applies
// to the tension as read. Readings beyond it (about 80 to 85 kPa is common practice, where the
// column starts to cavitate) are kept but marked unreliable.
#pragma once

#include <span>
#include <vector>

#include "wetfront/observations/observation.hpp"

namespace wetfront::observations {

inline constexpr double kCmOfWaterPerKilopascal = 10.197;  // common practice

enum class TensionUnit { kilopascal, centibar, millibar, cm_of_water };

// A tension (suction) as read: positive when the soil is drier than saturation.
struct Tension {
  double value = 0;
  TensionUnit unit = TensionUnit::kilopascal;
};

double tension_in_kilopascal(Tension tension);
double tension_as_head_cm(Tension tension);

enum class ReadingPoint { gauge_above_ground, transducer_at_cup };

struct TensiometerInstallation {
  double cup_depth_cm = 0;  // depth of the cup centre, positive downward
  ReadingPoint read_at = ReadingPoint::gauge_above_ground;
  double gauge_height_above_ground_cm = 0;  // used only for gauge_above_ground
};

// Pressure head at the cup, cm of water (negative when unsaturated).
double cup_pressure_head_cm(const TensiometerInstallation& installation, Tension tension);

// Readings with a tension above this are unreliable. Default 80 kPa (pressure -80 kPa).
struct WorkingLimit {
  double tension_kilopascal = 80.0;
};

bool within_working_limit(Tension tension, WorkingLimit limit);

struct TensiometerReading {
  double day = 0;  // days since the run start
  Tension tension;
};

// Every reading as a cup head; unreliable ones are kept, marked, and counted.
struct CupHeadSeries {
  std::vector<Observation> heads;  // value = pressure head at the cup, cm of water
  int unreliable_count = 0;
};

CupHeadSeries cup_pressure_heads(const TensiometerInstallation& installation,
                                 std::span<const TensiometerReading> readings, WorkingLimit limit = {});

}  // namespace wetfront::observations
