// Everything the column needs from the surface, on common breakpoints: water input (rain +
// irrigation), potential soil evaporation, potential transpiration, root depth and leaf area
// index, each piecewise constant in time.
//
// Evaporative demand is built from pan evaporation in one of two ways:
//   reference ET route:  ETo = Kp Epan, ETc = Kc(t) ETo        (FAO-56 eqs. 55, 56 and 66)
//   pan-to-crop route:   ETc = f(stage) Epan
// and ETc is split into soil evaporation and transpiration by leaf area or soil cover.
//
// Breakpoints: every start of an input step, every growth-stage boundary, every date of the
// dated tables, and further splits so that no step is longer than max_step_days. Curves that
// vary within a step (Kc, LAI, cover, root depth) are evaluated at the middle of the step;
// since their corners are breakpoints this is their exact mean over the step when they are
// linear there. Rates from input series are exact step means.
#pragma once

#include <variant>
#include <vector>

#include "wetfront/forcing/canopy_split.hpp"
#include "wetfront/forcing/crop_coefficient.hpp"
#include "wetfront/forcing/dated_table.hpp"
#include "wetfront/forcing/step_series.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

struct CropFromReference {
  double pan_coefficient = 0.7;  // Kp
  CropCoefficientCurve curve;
};

struct SurfaceDemandInputs {
  double run_length_days = 0;
  std::vector<CoveredSeries> water_inputs;  // rain, irrigation: rates in cm/d
  CoveredSeries pan_evaporation;            // cm/d
  std::variant<CropFromReference, PanToCropFactors> crop;
  CanopySplit split;
  DatedTable root_depth_cm = DatedTable::constant("root depth", 0.0);
  double max_step_days = 1.0;
};

struct SurfaceDemand {
  // All five share the same start_days; each is defined on [0, end_day).
  base::StepSeries water_input_cm_per_day;
  base::StepSeries potential_evaporation_cm_per_day;  // from the soil surface
  base::StepSeries potential_transpiration_cm_per_day;
  base::StepSeries root_depth_cm;
  base::StepSeries leaf_area_index;
  double end_day = 0;  // the run length, or earlier when an input series stops sooner
};

// Throws base::InputError naming the input when a series does not start at day 0 or is
// malformed, a table or coefficient is out of range, or max_step_days is not positive.
SurfaceDemand surface_demand(const SurfaceDemandInputs& inputs);

}  // namespace wetfront::forcing
