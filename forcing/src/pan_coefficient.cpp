// Class A pan coefficient: FAO-56 Table 5 and its regression equations (Allen et al. 1998,
// FAO Irrigation and Drainage Paper 56, chapter 4, after Allen & Pruitt 1991).
#include "wetfront/forcing/pan_coefficient.hpp"

#include <array>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

namespace {

// kTable[case][wind][fetch][humidity]; rows as printed in FAO-56 Table 5: for each wind class
// the fetch distances 1, 10, 100, 1000 m, columns RHmean low, medium, high.
// Values written from memory, check against the table; they agree with the regression
// equations below within 0.06 at class-representative inputs (tests/forcing).
constexpr std::array<std::array<std::array<std::array<double, 3>, 4>, 4>, 2> kTable{{
    // Case A: pan placed in a short green cropped area.
    {{
        {{{0.55, 0.65, 0.75}, {0.65, 0.75, 0.85}, {0.70, 0.80, 0.85}, {0.75, 0.85, 0.85}}},  // light
        {{{0.50, 0.60, 0.65}, {0.60, 0.70, 0.75}, {0.65, 0.75, 0.80}, {0.70, 0.80, 0.80}}},  // moderate
        {{{0.45, 0.50, 0.60}, {0.55, 0.60, 0.65}, {0.60, 0.65, 0.70}, {0.65, 0.70, 0.75}}},  // strong
        {{{0.40, 0.45, 0.50}, {0.45, 0.55, 0.60}, {0.50, 0.60, 0.65}, {0.55, 0.60, 0.65}}},  // very strong
    }},
    // Case B: pan placed in a dry fallow area.
    {{
        {{{0.70, 0.80, 0.85}, {0.60, 0.70, 0.80}, {0.55, 0.65, 0.75}, {0.50, 0.60, 0.70}}},  // light
        {{{0.65, 0.75, 0.80}, {0.55, 0.65, 0.70}, {0.50, 0.60, 0.65}, {0.45, 0.55, 0.60}}},  // moderate
        {{{0.60, 0.65, 0.70}, {0.50, 0.55, 0.65}, {0.45, 0.50, 0.60}, {0.40, 0.45, 0.55}}},  // strong
        {{{0.50, 0.60, 0.65}, {0.45, 0.50, 0.55}, {0.40, 0.45, 0.50}, {0.35, 0.40, 0.45}}},  // very strong
    }},
}};

void require_in(double value, double lo, double hi, const char* name, const char* unit) {
  if (!(value >= lo && value <= hi))
    throw base::InputError(fmt::format(
        "pan coefficient regression: {} = {:g} {} is outside the range the equation was fitted for ({:g} to {:g} {}); "
        "use the table or a measured pan coefficient",
        name, value, unit, lo, hi, unit));
}

}  // namespace

WindClass wind_class_of(double u2) {
  if (!(u2 >= 0)) throw base::InputError(fmt::format("wind speed {:g} m/s: expected >= 0", u2));
  if (u2 < 2) return WindClass::light;
  if (u2 <= 5) return WindClass::moderate;
  if (u2 <= 8) return WindClass::strong;
  return WindClass::very_strong;
}

HumidityClass humidity_class_of(double rh) {
  if (!(rh >= 0 && rh <= 100))
    throw base::InputError(fmt::format("mean relative humidity {:g} %: expected 0 to 100", rh));
  if (rh < 40) return HumidityClass::low;
  if (rh <= 70) return HumidityClass::medium;
  return HumidityClass::high;
}

FetchClass fetch_class_of(double fetch_m) {
  if (!(fetch_m > 0)) throw base::InputError(fmt::format("fetch {:g} m: expected > 0", fetch_m));
  // Nearest tabulated distance on a log scale: boundaries at 10^0.5, 10^1.5, 10^2.5 m.
  const double decade = std::log10(fetch_m);
  if (decade < 0.5) return FetchClass::m1;
  if (decade < 1.5) return FetchClass::m10;
  if (decade < 2.5) return FetchClass::m100;
  return FetchClass::m1000;
}

double class_a_pan_coefficient_from_table(PanSurroundings s, WindClass w, HumidityClass h, FetchClass f) {
  return kTable[static_cast<std::size_t>(s)][static_cast<std::size_t>(w)][static_cast<std::size_t>(f)]
               [static_cast<std::size_t>(h)];
}

double class_a_pan_coefficient_from_table(const PanSite& site) {
  return class_a_pan_coefficient_from_table(site.surroundings, wind_class_of(site.wind_speed_2m_m_per_s),
                                            humidity_class_of(site.mean_relative_humidity_pct),
                                            fetch_class_of(site.fetch_m));
}

double class_a_pan_coefficient_from_regression(const PanSite& site) {
  const double u2 = site.wind_speed_2m_m_per_s;
  const double rh = site.mean_relative_humidity_pct;
  const double fet = site.fetch_m;
  require_in(u2, 1.0, 8.0, "wind speed at 2 m", "m/s");
  require_in(rh, 30.0, 84.0, "mean relative humidity", "%");
  require_in(fet, 1.0, 1000.0, "fetch", "m");
  const double ln_fet = std::log(fet);
  if (site.surroundings == PanSurroundings::green_fetch) {
    // Case A (FAO-56, regression for Table 5, green fetch):
    // Kp = 0.108 - 0.0286 u2 + 0.0422 ln(FET) + 0.1434 ln(RH) - 0.000631 [ln(FET)]^2 ln(RH)
    const double ln_rh = std::log(rh);
    return 0.108 - 0.0286 * u2 + 0.0422 * ln_fet + 0.1434 * ln_rh - 0.000631 * ln_fet * ln_fet * ln_rh;
  }
  // Case B (FAO-56, regression for Table 5, dry fetch); 86.4 u2 is the wind run in km/d:
  // Kp = 0.61 + 0.00341 RH - 0.000162 u2 RH - 0.00000959 u2 FET + 0.00327 u2 ln(FET)
  //      - 0.00289 u2 ln(86.4 u2) - 0.0106 ln(86.4 u2) ln(FET) + 0.00063 [ln(FET)]^2 ln(86.4 u2)
  const double ln_run = std::log(86.4 * u2);
  return 0.61 + 0.00341 * rh - 0.000162 * u2 * rh - 0.00000959 * u2 * fet + 0.00327 * u2 * ln_fet -
         0.00289 * u2 * ln_run - 0.0106 * ln_run * ln_fet + 0.00063 * ln_fet * ln_fet * ln_run;
}

double pan_coefficient(const PanCoefficientChoice& choice) {
  switch (choice.method) {
    case PanCoefficientChoice::Method::user_value:
      if (!(choice.user_value > 0 && choice.user_value <= 1.2))
        throw base::InputError(
            fmt::format("pan coefficient {:g}: expected a value above 0 and at most 1.2", choice.user_value));
      return choice.user_value;
    case PanCoefficientChoice::Method::table: return class_a_pan_coefficient_from_table(choice.site);
    case PanCoefficientChoice::Method::regression: return class_a_pan_coefficient_from_regression(choice.site);
  }
  throw base::InputError("pan coefficient: unknown method");
}

std::string_view to_string(PanSurroundings s) {
  return s == PanSurroundings::green_fetch ? "green fetch (case A)" : "dry fetch (case B)";
}
std::string_view to_string(WindClass c) {
  constexpr std::array<std::string_view, 4> names{"light", "moderate", "strong", "very strong"};
  return names[static_cast<std::size_t>(c)];
}
std::string_view to_string(HumidityClass c) {
  constexpr std::array<std::string_view, 3> names{"low", "medium", "high"};
  return names[static_cast<std::size_t>(c)];
}
std::string_view to_string(FetchClass c) {
  constexpr std::array<std::string_view, 4> names{"1 m", "10 m", "100 m", "1000 m"};
  return names[static_cast<std::size_t>(c)];
}

}  // namespace wetfront::forcing
