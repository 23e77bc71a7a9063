// Crop coefficients in time, FAO-56 single-coefficient method (Allen et al. 1998, FAO
// Irrigation and Drainage Paper 56, chapter 6).
//
// The season from the planting date is divided into four stages (initial, crop development,
// mid-season, late season). Kc is Kc_ini through the initial stage, rises linearly to Kc_mid
// over development, stays at Kc_mid through mid-season and moves linearly to Kc_end over the
// late season (FAO-56 Fig. 25; eq. 66 for the linear parts). Crop ET: ETc = Kc * ETo.
//
// Before planting and after harvest (planting + the four stage lengths) the caller gives a
// bare-soil coefficient, which multiplies ETo in the same way.
#pragma once

#include <array>
#include <vector>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

struct GrowthStageLengths {
  double initial_days = 0;
  double development_days = 0;
  double mid_season_days = 0;
  double late_season_days = 0;

  double season_days() const { return initial_days + development_days + mid_season_days + late_season_days; }
};

enum class GrowthStage { before_planting, initial, development, mid_season, late_season, after_harvest };

GrowthStage growth_stage_at(double planting_day, const GrowthStageLengths& stages, double day);

// Planting day, the ends of the four stages: the times where the curves change form.
std::array<double, 5> growth_stage_boundaries(double planting_day, const GrowthStageLengths& stages);

// The crop's calendar, shared by both ways of giving its water use: the planting day and the
// lengths of the four stages that follow it.
struct CropCalendar {
  double planting_day = 0;  // days since run start
  GrowthStageLengths stages;
};

struct CropCoefficientCurve : CropCalendar {
  double kc_initial = 0;
  double kc_mid = 0;
  double kc_end = 0;
  double kc_bare_soil = 0;  // before planting and after harvest
};

// Throws base::InputError naming the field when a stage length is negative, the season
// is empty, or a coefficient is negative or above 2.
void check_crop_curve(const CropCoefficientCurve& curve);
double crop_coefficient_at(const CropCoefficientCurve& curve, double day);

// Pan-to-crop factors: ETc = factor(stage) * Epan, the factor constant through each stage.
struct PanToCropFactors : CropCalendar {
  double initial = 0;
  double development = 0;
  double mid_season = 0;
  double late_season = 0;
  double bare_soil = 0;  // before planting and after harvest
};

void check_pan_to_crop_factors(const PanToCropFactors& factors);
double pan_to_crop_factor_at(const PanToCropFactors& factors, double day);

}  // namespace wetfront::forcing
