// Combines water input and evaporative demand on common breakpoints:
//   ETo = Kp Epan                      (FAO-56 eq. 55)
//   ETc = Kc ETo   or   ETc = f Epan   (FAO-56 eq. 56; pan-to-crop factors)
//   Ep, Tp from ETc by leaf area (Beer's law) or by soil cover.
#include "wetfront/forcing/surface_demand.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <type_traits>
#include <variant>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

namespace {

constexpr double time_tolerance_days = 1e-8;

void check_series(const CoveredSeries& c, const std::string& name) {
  const auto& s = c.series;
  if (s.start_days.empty() || s.start_days.size() != s.values.size())
    throw base::InputError(fmt::format("{}: expected as many step values as start days, and at least one", name));
  if (s.start_days.front() > time_tolerance_days)
    throw base::InputError(
        fmt::format("{}: starts at day {:g}; expected it to cover the run from day 0", name, s.start_days.front()));
  for (std::size_t i = 0; i < s.values.size(); ++i) {
    if (i > 0 && !(s.start_days[i] > s.start_days[i - 1]))
      throw base::InputError(fmt::format("{}: step {} does not start after the previous one", name, i + 1));
    if (!(s.values[i] >= 0 && std::isfinite(s.values[i])))
      throw base::InputError(fmt::format("{}: step {} has rate {:g} cm/d; expected >= 0", name, i + 1, s.values[i]));
  }
}

double crop_et_rate(const SurfaceDemandInputs& in, double pan_rate, double mid_day) {
  if (const auto* ref = std::get_if<CropFromReference>(&in.crop))
    return crop_coefficient_at(ref->curve, mid_day) * ref->pan_coefficient * pan_rate;
  return pan_to_crop_factor_at(std::get<PanToCropFactors>(in.crop), mid_day) * pan_rate;
}

std::vector<double> breakpoints(const SurfaceDemandInputs& in, double end_day) {
  std::vector<double> cuts{0.0, end_day};
  auto take = [&](double t) {
    if (t > time_tolerance_days && t < end_day - time_tolerance_days) cuts.push_back(t);
  };
  for (const auto& w : in.water_inputs)
    for (double t : w.series.start_days) take(t);
  for (double t : in.pan_evaporation.series.start_days) take(t);
  const auto boundaries = std::visit(
      [](const auto& crop) {
        if constexpr (std::is_same_v<std::decay_t<decltype(crop)>, CropFromReference>)
          return growth_stage_boundaries(crop.curve.planting_day, crop.curve.stages);
        else
          return growth_stage_boundaries(crop.planting_day, crop.stages);
      },
      in.crop);
  for (double t : boundaries) take(t);
  for (double t : in.split.leaf_area_index.days) take(t);
  if (in.split.method == CanopySplit::Method::soil_cover)
    for (double t : in.split.soil_cover.days) take(t);
  for (double t : in.root_depth_cm.days) take(t);

  std::sort(cuts.begin(), cuts.end());
  std::vector<double> merged;
  for (double t : cuts)
    if (merged.empty() || t > merged.back() + time_tolerance_days) merged.push_back(t);
  merged.back() = end_day;

  // Split long steps evenly so that no step exceeds max_step_days.
  std::vector<double> fine;
  for (std::size_t i = 0; i + 1 < merged.size(); ++i) {
    const double a = merged[i];
    const double b = merged[i + 1];
    const double pieces = std::max(1.0, std::ceil((b - a) / in.max_step_days - 1e-9));
    for (double k = 0; k < pieces; k += 1.0) fine.push_back(a + (b - a) * (k / pieces));
  }
  fine.push_back(end_day);
  return fine;
}

}  // namespace

SurfaceDemand surface_demand(const SurfaceDemandInputs& in) {
  if (!(in.run_length_days > 0))
    throw base::InputError(fmt::format("surface demand: run length {:g} d; expected > 0", in.run_length_days));
  if (!(in.max_step_days > 0))
    throw base::InputError(fmt::format("surface demand: longest step {:g} d; expected > 0", in.max_step_days));
  double end_day = in.run_length_days;
  for (std::size_t i = 0; i < in.water_inputs.size(); ++i) {
    check_series(in.water_inputs[i], fmt::format("water input {}", i + 1));
    end_day = std::min(end_day, in.water_inputs[i].end_day);
  }
  check_series(in.pan_evaporation, "pan evaporation");
  end_day = std::min(end_day, in.pan_evaporation.end_day);
  if (!(end_day > 0))
    throw base::InputError("surface demand: an input series stops at day 0; there is no forcing for the run");

  if (const auto* ref = std::get_if<CropFromReference>(&in.crop)) {
    check_crop_curve(ref->curve);
    if (!(ref->pan_coefficient > 0 && ref->pan_coefficient <= 1.2))
      throw base::InputError(
          fmt::format("surface demand: pan coefficient {:g}; expected above 0 and at most 1.2", ref->pan_coefficient));
  } else {
    check_pan_to_crop_factors(std::get<PanToCropFactors>(in.crop));
  }
  check_dated_table(in.split.leaf_area_index, 0.0, 20.0);
  if (in.split.method == CanopySplit::Method::soil_cover) check_dated_table(in.split.soil_cover, 0.0, 1.0);
  if (in.split.method == CanopySplit::Method::leaf_area_index && !(in.split.extinction_coefficient > 0))
    throw base::InputError(
        fmt::format("surface demand: extinction coefficient {:g}; expected > 0", in.split.extinction_coefficient));
  check_dated_table(in.root_depth_cm, 0.0, 1e4);

  const std::vector<double> cuts = breakpoints(in, end_day);
  SurfaceDemand out;
  out.end_day = end_day;
  for (std::size_t i = 0; i + 1 < cuts.size(); ++i) {
    const double a = cuts[i];
    const double b = cuts[i + 1];
    const double mid = 0.5 * (a + b);
    double water = 0;
    for (const auto& w : in.water_inputs) water += w.series.integral(a, b) / (b - a);
    const double pan_rate = in.pan_evaporation.series.integral(a, b) / (b - a);
    const double crop_et = crop_et_rate(in, pan_rate, mid);
    const double lai = in.split.leaf_area_index.at(mid);
    const EvapotranspirationSplit split = in.split.method == CanopySplit::Method::leaf_area_index
                                              ? split_by_leaf_area(crop_et, lai, in.split.extinction_coefficient)
                                              : split_by_soil_cover(crop_et, in.split.soil_cover.at(mid));
    for (base::StepSeries* s : {&out.water_input_cm_per_day, &out.potential_evaporation_cm_per_day,
                                &out.potential_transpiration_cm_per_day, &out.root_depth_cm, &out.leaf_area_index})
      s->start_days.push_back(a);
    out.water_input_cm_per_day.values.push_back(water);
    out.potential_evaporation_cm_per_day.values.push_back(split.soil_evaporation);
    out.potential_transpiration_cm_per_day.values.push_back(split.transpiration);
    out.root_depth_cm.values.push_back(in.root_depth_cm.at(mid));
    out.leaf_area_index.values.push_back(lai);
  }
  return out;
}

}  // namespace wetfront::forcing
