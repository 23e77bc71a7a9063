// FAO-56 single crop coefficient curve (Allen et al. 1998, chapter 6, Fig. 25, eq. 66):
//   initial stage       Kc = Kc_ini
//   development stage   Kc = Kc_ini + (t - t_dev) / L_dev  (Kc_mid - Kc_ini)
//   mid-season          Kc = Kc_mid
//   late season         Kc = Kc_mid + (t - t_late) / L_late (Kc_end - Kc_mid)
#include "wetfront/forcing/crop_coefficient.hpp"

#include <cmath>
#include <initializer_list>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

namespace {

void check_calendar(const CropCalendar& calendar, const char* who) {
  const GrowthStageLengths& s = calendar.stages;
  auto length = [&](double v, const char* name) {
    if (!(v >= 0 && std::isfinite(v)))
      throw base::InputError(fmt::format("{}: {} stage length {:g} d; expected a length >= 0 days", who, name, v));
  };
  length(s.initial_days, "initial");
  length(s.development_days, "development");
  length(s.mid_season_days, "mid-season");
  length(s.late_season_days, "late season");
  if (!(s.season_days() > 0))
    throw base::InputError(fmt::format("{}: the four stages add up to zero days; expected a season", who));
  if (!std::isfinite(calendar.planting_day))
    throw base::InputError(fmt::format("{}: planting day must be finite", who));
}

struct NamedCoefficient {
  double value;
  const char* name;
};

// The growth stages, then each coefficient in [0, 2].
void check_curve(const CropCalendar& calendar, const char* who, std::initializer_list<NamedCoefficient> coefficients) {
  check_calendar(calendar, who);
  for (const auto& [v, name] : coefficients)
    if (!(v >= 0 && v <= 2))
      throw base::InputError(fmt::format("{}: {} = {:g}; expected a coefficient from 0 to 2", who, name, v));
}

// Fraction of the way through a stage of given length starting at `from`; 1 for a zero-length stage.
double fraction(double day, double from, double length) { return length > 0 ? (day - from) / length : 1.0; }

}  // namespace

std::array<double, 5> growth_stage_boundaries(double planting_day, const GrowthStageLengths& s) {
  const double dev = planting_day + s.initial_days;
  const double mid = dev + s.development_days;
  const double late = mid + s.mid_season_days;
  return {planting_day, dev, mid, late, late + s.late_season_days};
}

GrowthStage growth_stage_at(double planting_day, const GrowthStageLengths& s, double day) {
  const auto b = growth_stage_boundaries(planting_day, s);
  if (day < b[0]) return GrowthStage::before_planting;
  if (day < b[1]) return GrowthStage::initial;
  if (day < b[2]) return GrowthStage::development;
  if (day < b[3]) return GrowthStage::mid_season;
  if (day < b[4]) return GrowthStage::late_season;
  return GrowthStage::after_harvest;
}

void check_crop_curve(const CropCoefficientCurve& c) {
  check_curve(c, "crop coefficient curve",
              {{c.kc_initial, "Kc initial"},
               {c.kc_mid, "Kc mid-season"},
               {c.kc_end, "Kc end of season"},
               {c.kc_bare_soil, "bare-soil coefficient"}});
}

double crop_coefficient_at(const CropCoefficientCurve& c, double day) {
  const auto b = growth_stage_boundaries(c.planting_day, c.stages);
  switch (growth_stage_at(c.planting_day, c.stages, day)) {
    case GrowthStage::before_planting:
    case GrowthStage::after_harvest: return c.kc_bare_soil;
    case GrowthStage::initial: return c.kc_initial;
    case GrowthStage::development:
      return c.kc_initial + fraction(day, b[1], c.stages.development_days) * (c.kc_mid - c.kc_initial);
    case GrowthStage::mid_season: return c.kc_mid;
    case GrowthStage::late_season:
      return c.kc_mid + fraction(day, b[3], c.stages.late_season_days) * (c.kc_end - c.kc_mid);
  }
  return c.kc_bare_soil;
}

void check_pan_to_crop_factors(const PanToCropFactors& f) {
  check_curve(f, "pan-to-crop factors",
              {{f.initial, "initial stage factor"},
               {f.development, "development stage factor"},
               {f.mid_season, "mid-season factor"},
               {f.late_season, "late season factor"},
               {f.bare_soil, "bare-soil factor"}});
}

double pan_to_crop_factor_at(const PanToCropFactors& f, double day) {
  switch (growth_stage_at(f.planting_day, f.stages, day)) {
    case GrowthStage::before_planting:
    case GrowthStage::after_harvest: return f.bare_soil;
    case GrowthStage::initial: return f.initial;
    case GrowthStage::development: return f.development;
    case GrowthStage::mid_season: return f.mid_season;
    case GrowthStage::late_season: return f.late_season;
  }
  return f.bare_soil;
}

}  // namespace wetfront::forcing
