// Constant-head well permeameter analyses; equations in well_permeameter.hpp.
#include "wetfront/soils/well_permeameter.hpp"

#include <array>
#include <cmath>
#include <numbers>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {
namespace {

constexpr double pi = std::numbers::pi;

// Everything a soil category sets (alpha* and the shape-factor fit: Elrick, Reynolds & Tan 1989,
// see well_permeameter.hpp), with its name and description, one row per category.
struct CategoryRow {
  WellSoilCategory category;
  std::string_view name;
  std::string_view description;
  double sorptive_number_per_cm;  // alpha*
  ShapeFactorSoil shape_factor_soil;
};

constexpr std::array<CategoryRow, 5> kCategoryRows = {{
    {WellSoilCategory::compacted_clay, "compacted-clay", "compacted, structureless clay (liners, fills)", 0.01,
     ShapeFactorSoil::unstructured_clay},
    {WellSoilCategory::fine_unstructured, "fine-unstructured", "fine-textured soil without structure", 0.04,
     ShapeFactorSoil::unstructured_clay},
    {WellSoilCategory::structured, "structured", "most structured soils, clays to loams", 0.12,
     ShapeFactorSoil::structured_loam_or_clay},
    {WellSoilCategory::coarse_sand, "coarse-sand", "coarse and gravelly sands", 0.36, ShapeFactorSoil::sand},
    {WellSoilCategory::highly_structured, "highly-structured", "highly structured soil with large cracks or macropores",
     0.36, ShapeFactorSoil::structured_loam_or_clay},
}};

constexpr std::array<WellSoilCategory, kCategoryRows.size()> categories = [] {
  std::array<WellSoilCategory, kCategoryRows.size()> list{};
  for (std::size_t i = 0; i < kCategoryRows.size(); ++i) list[i] = kCategoryRows[i].category;
  return list;
}();

const CategoryRow& row_of(WellSoilCategory category) {
  for (const auto& row : kCategoryRows)
    if (row.category == category) return row;
  throw std::logic_error("unknown well soil category");
}

void require_positive(double value, const char* what) {
  if (!(value > 0.0) || !std::isfinite(value)) {
    throw base::InputError(fmt::format("{} must be a positive number, got {}", what, value));
  }
}

void check_flow(const WellFlow& flow, double well_radius_cm) {
  require_positive(flow.water_depth_cm, "depth of water in the well");
  require_positive(well_radius_cm, "well radius");
  require_positive(flow.steady_outflow_cm3_per_d, "steady outflow");
}

// Coefficients of eq. (1): Q = kfs_coefficient Kfs + phi_coefficient phi_m, both in cm2.
struct FlowCoefficients {
  double kfs_coefficient_cm2;
  double phi_coefficient_cm;
};

FlowCoefficients flow_coefficients(double water_depth_cm, double well_radius_cm, ShapeFactorSoil soil) {
  const double c = well_shape_factor(water_depth_cm, well_radius_cm, soil);
  return {2.0 * pi * water_depth_cm * water_depth_cm / c + pi * well_radius_cm * well_radius_cm,
          2.0 * pi * water_depth_cm / c};
}

}  // namespace

double sorptive_number_per_cm(WellSoilCategory category) { return row_of(category).sorptive_number_per_cm; }

ShapeFactorSoil shape_factor_soil(WellSoilCategory category) { return row_of(category).shape_factor_soil; }

std::string_view category_name(WellSoilCategory category) { return row_of(category).name; }

std::string_view category_description(WellSoilCategory category) { return row_of(category).description; }

std::span<const WellSoilCategory> all_categories() { return categories; }

WellSoilCategory parse_category(std::string_view name) {
  std::string accepted;
  for (const auto category : categories) {
    if (category_name(category) == name) return category;
    if (!accepted.empty()) accepted += ", ";
    accepted += category_name(category);
  }
  throw base::InputError(fmt::format("unknown soil category '{}'; expected one of {}", name, accepted));
}

double well_shape_factor(double water_depth_cm, double well_radius_cm, ShapeFactorSoil soil) {
  require_positive(water_depth_cm, "depth of water in the well");
  require_positive(well_radius_cm, "well radius");
  const double ratio = water_depth_cm / well_radius_cm;
  // Zhang, Groenevelt & Parkin (1998): C = (ratio / (p + q ratio))^s (coefficients from memory).
  switch (soil) {
    case ShapeFactorSoil::sand: return std::pow(ratio / (2.102 + 0.118 * ratio), 0.655);
    case ShapeFactorSoil::structured_loam_or_clay: return std::pow(ratio / (1.992 + 0.091 * ratio), 0.683);
    case ShapeFactorSoil::unstructured_clay: return std::pow(ratio / (2.074 + 0.093 * ratio), 0.754);
  }
  throw std::logic_error("unknown shape factor soil");
}

double well_outflow(double water_depth_cm, double well_radius_cm, ShapeFactorSoil soil,
                    double field_saturated_conductivity_cm_per_d, double matric_flux_potential_cm2_per_d) {
  const auto k = flow_coefficients(water_depth_cm, well_radius_cm, soil);
  return k.kfs_coefficient_cm2 * field_saturated_conductivity_cm_per_d +
         k.phi_coefficient_cm * matric_flux_potential_cm2_per_d;
}

WellResult single_head_analysis(const WellFlow& flow, double well_radius_cm, WellSoilCategory category) {
  check_flow(flow, well_radius_cm);
  const double alpha_star = sorptive_number_per_cm(category);
  const auto k = flow_coefficients(flow.water_depth_cm, well_radius_cm, shape_factor_soil(category));
  // Eq. (1) with phi_m = Kfs / alpha*.
  const double kfs = flow.steady_outflow_cm3_per_d / (k.kfs_coefficient_cm2 + k.phi_coefficient_cm / alpha_star);
  WellResult result;
  result.field_saturated_conductivity_cm_per_d = kfs;
  result.matric_flux_potential_cm2_per_d = kfs / alpha_star;
  result.sorptive_number_per_cm = alpha_star;
  result.method = fmt::format("single head, H = {:.4g} cm, alpha* = {} /cm ({})", flow.water_depth_cm, alpha_star,
                              category_name(category));
  return result;
}

WellResult two_head_analysis(const WellFlow& shallower, const WellFlow& deeper, double well_radius_cm,
                             WellSoilCategory category) {
  check_flow(shallower, well_radius_cm);
  check_flow(deeper, well_radius_cm);
  if (std::abs(shallower.water_depth_cm - deeper.water_depth_cm) < 1e-9 * deeper.water_depth_cm) {
    throw base::InputError(
        fmt::format("the two-head analysis needs two different water depths, got {} cm twice", deeper.water_depth_cm));
  }
  const ShapeFactorSoil soil = shape_factor_soil(category);
  const auto k1 = flow_coefficients(shallower.water_depth_cm, well_radius_cm, soil);
  const auto k2 = flow_coefficients(deeper.water_depth_cm, well_radius_cm, soil);
  // Cramer's rule on  [k1.K k1.P; k2.K k2.P] [Kfs; phi_m] = [Q1; Q2].
  const double det = k1.kfs_coefficient_cm2 * k2.phi_coefficient_cm - k2.kfs_coefficient_cm2 * k1.phi_coefficient_cm;
  const double q1 = shallower.steady_outflow_cm3_per_d;
  const double q2 = deeper.steady_outflow_cm3_per_d;
  const double kfs = (q1 * k2.phi_coefficient_cm - q2 * k1.phi_coefficient_cm) / det;
  const double phi = (k1.kfs_coefficient_cm2 * q2 - k2.kfs_coefficient_cm2 * q1) / det;

  const std::string heads = fmt::format("H = {:.4g} and {:.4g} cm", shallower.water_depth_cm, deeper.water_depth_cm);
  if (std::isfinite(kfs) && std::isfinite(phi) && kfs > 0.0 && phi > 0.0) {
    WellResult result;
    result.field_saturated_conductivity_cm_per_d = kfs;
    result.matric_flux_potential_cm2_per_d = phi;
    result.sorptive_number_per_cm = kfs / phi;
    result.method = "two heads, " + heads;
    return result;
  }

  const WellResult a = single_head_analysis(shallower, well_radius_cm, category);
  const WellResult b = single_head_analysis(deeper, well_radius_cm, category);
  WellResult result;
  result.field_saturated_conductivity_cm_per_d =
      0.5 * (a.field_saturated_conductivity_cm_per_d + b.field_saturated_conductivity_cm_per_d);
  result.sorptive_number_per_cm = a.sorptive_number_per_cm;
  result.matric_flux_potential_cm2_per_d = result.field_saturated_conductivity_cm_per_d / result.sorptive_number_per_cm;
  result.method = fmt::format("mean of single-head results at {}, alpha* = {} /cm ({})", heads,
                              result.sorptive_number_per_cm, category_name(category));
  result.warnings.push_back(fmt::format(
      "the two-head solution at {} gives Kfs = {:.4g} cm/d and phi_m = {:.4g} cm2/d; a negative value has no "
      "physical meaning (common in layered or heterogeneous soil, or when flow was not steady), so the "
      "single-head results are used instead",
      heads, kfs, phi));
  return result;
}

}  // namespace wetfront::soils
