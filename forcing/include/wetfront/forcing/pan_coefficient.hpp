// Pan coefficient Kp of a Class A pan: reference evapotranspiration ETo = Kp * Epan
// (Allen et al. 1998, FAO Irrigation and Drainage Paper 56, eq. 55).
//
// Kp depends on the ground upwind of the pan (case A: pan set in a short green crop, with
// green fetch of the given distance beyond it; case B: pan set in dry fallow ground), the
// mean wind speed at 2 m, the mean relative humidity, and the fetch distance. FAO-56 gives it
// as a table by classes (Table 5) and as regression equations fitted to that table (after
// Allen & Pruitt 1991).
#pragma once

#include <string_view>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

enum class PanSurroundings {
  green_fetch,  // case A: pan in a short green crop
  dry_fetch,    // case B: pan in dry fallow ground
};

enum class WindClass { light, moderate, strong, very_strong };  // <2, 2-5, 5-8, >8 m/s
enum class HumidityClass { low, medium, high };                 // <40, 40-70, >70 %
enum class FetchClass { m1, m10, m100, m1000 };                 // 1, 10, 100, 1000 m

struct PanSite {
  PanSurroundings surroundings = PanSurroundings::green_fetch;
  double wind_speed_2m_m_per_s = 2.0;      // mean wind speed at 2 m height
  double mean_relative_humidity_pct = 55;  // mean relative humidity, percent
  double fetch_m = 10;                     // distance of green crop (A) or dry ground (B) upwind
};

// Class of a value; a value on a class boundary belongs to the middle class (2 m/s moderate,
// 5 m/s moderate, 8 m/s strong; 40 % and 70 % medium). The fetch class is the tabulated
// distance nearest on a logarithmic scale.
WindClass wind_class_of(double wind_speed_2m_m_per_s);
HumidityClass humidity_class_of(double mean_relative_humidity_pct);
FetchClass fetch_class_of(double fetch_m);

// FAO-56 Table 5 entry.
double class_a_pan_coefficient_from_table(PanSurroundings surroundings, WindClass wind, HumidityClass humidity,
                                          FetchClass fetch);
double class_a_pan_coefficient_from_table(const PanSite& site);

// FAO-56 regression equations for Table 5. Valid for 1 <= u2 <= 8 m/s, 30 <= RHmean <= 84 %
// and 1 <= fetch <= 1000 m; outside that range base::InputError names the input.
double class_a_pan_coefficient_from_regression(const PanSite& site);

struct PanCoefficientChoice {
  enum class Method { user_value, table, regression };
  Method method = Method::user_value;
  double user_value = 0.7;  // used with Method::user_value; must lie in (0, 1.2]
  PanSite site;             // used with Method::table and Method::regression
};

double pan_coefficient(const PanCoefficientChoice& choice);

std::string_view to_string(PanSurroundings s);
std::string_view to_string(WindClass c);
std::string_view to_string(HumidityClass c);
std::string_view to_string(FetchClass c);

}  // namespace wetfront::forcing
