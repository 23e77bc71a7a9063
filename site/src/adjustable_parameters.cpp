#include "wetfront/site/adjustable_parameters.hpp"

#include <array>
#include <cmath>
#include <stdexcept>
#include <variant>

#include <fmt/format.h>
#include <toml++/toml.h>

#include "wetfront/base/did_you_mean.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/site/site_keys.hpp"
#include "wetfront/forcing/crop_coefficient.hpp"
#include "wetfront/forcing/pan_coefficient.hpp"
#include "wetfront/soils/model_parameters.hpp"
#include "wetfront/soils/parameter_checks.hpp"

namespace wetfront::site {
namespace {

using Kind = ParameterTarget::Kind;

// The field of a hydraulic model that a layer key names; nullptr when the model has none.
double* soil_field(soils::HydraulicModel& model, std::string_view key) { return soils::parameter_value(model, key); }

const std::vector<std::string_view> kSoilKeys = soils::all_parameter_keys();
constexpr std::array<std::string_view, 5> kSiteKeys = {"kc_initial", "kc_mid", "kc_end", "pan_coefficient",
                                                       "water_table_depth"};

// Dimension of a parameter's range, from the unit of its soil-model parameter; empty for a
// plain number.
std::optional<base::Dimension> dimension_of(std::string_view key) {
  if (key == "water_table_depth") return base::Dimension::length;
  for (const soils::HydraulicModel& model : soils::all_models()) {
    for (const auto& p : soils::model_parameters(model)) {
      if (p.key == key) return soils::parameter_dimension(p);
    }
  }
  return std::nullopt;
}

std::vector<std::string_view> keys_of(soils::HydraulicModel model) {
  std::vector<std::string_view> keys;
  for (const auto key : kSoilKeys)
    if (soil_field(model, key)) keys.push_back(key);
  return keys;
}

// The column depth and the water table that a water-table bottom holds, if it is one.
std::optional<double> bottom_water_table_depth(const SiteSetup& site) {
  const auto* fixed = std::get_if<solver::FixedHead>(&site.bottom);
  if (!fixed) return std::nullopt;
  return site.layers.back().bottom_depth_cm - fixed->head_cm;
}

double site_value(const SiteSetup& site, const ParameterTarget& target) {
  switch (target.kind) {
    case Kind::soil: {
      soils::HydraulicModel model = site.layers[target.layer].model;
      return *soil_field(model, target.soil_key);
    }
    case Kind::kc_initial: return site.crop.kc_curve.kc_initial;
    case Kind::kc_mid: return site.crop.kc_curve.kc_mid;
    case Kind::kc_end: return site.crop.kc_curve.kc_end;
    case Kind::pan_coefficient: return forcing::pan_coefficient(site.pan.coefficient);
    case Kind::water_table_depth: return *bottom_water_table_depth(site);
  }
  return 0;
}

StudyParameter read_adjustable(const SiteTable& entry, const SiteSetup& site) {
  static constexpr std::array<std::string_view, 5> keys = {"parameter", "layer", "range", "scale", "grid_points"};
  entry.only_keys(keys);
  StudyParameter result;
  result.line = entry.line_of("parameter");
  const std::string key = base::trim(entry.text("parameter"));
  const bool soil = std::find(kSoilKeys.begin(), kSoilKeys.end(), key) != kSoilKeys.end();
  const bool other = std::find(kSiteKeys.begin(), kSiteKeys.end(), key) != kSiteKeys.end();
  if (!soil && !other) {
    std::vector<std::string_view> all(kSoilKeys.begin(), kSoilKeys.end());
    all.insert(all.end(), kSiteKeys.begin(), kSiteKeys.end());
    const auto near = base::did_you_mean(key, all);
    entry.fail("parameter",
               fmt::format("'{}' cannot be adjusted{}; adjustable are the soil parameters {} (with 'layer') and {}",
                           key, near ? fmt::format(" (did you mean '{}'?)", *near) : std::string(),
                           fmt::join(kSoilKeys, ", "), fmt::join(kSiteKeys, ", ")));
  }
  if (soil) {
    if (!entry.has("layer"))
      entry.fail("parameter", fmt::format("'{}' is a soil parameter: say which layer with 'layer = \"<name>\"'", key));
    const std::string layer_name = base::trim(entry.text("layer"));
    std::vector<std::string> names;
    for (std::size_t i = 0; i < site.layers.size(); ++i) {
      names.push_back(site.layers[i].name);
      if (site.layers[i].name == layer_name) result.target.layer = i;
    }
    if (std::find(names.begin(), names.end(), layer_name) == names.end())
      entry.fail("layer",
                 fmt::format("no layer is named '{}'; the layers are '{}'", layer_name, fmt::join(names, "', '")));
    soils::HydraulicModel model = site.layers[result.target.layer].model;
    if (!soil_field(model, key))
      entry.fail("parameter", fmt::format("layer '{}' has no parameter '{}'; its model has {}", layer_name, key,
                                          fmt::join(keys_of(model), ", ")));
    result.target.kind = Kind::soil;
    result.target.soil_key = key;
    result.range.name = layer_name + ": " + key;
  } else {
    if (entry.has("layer"))
      entry.fail("layer", fmt::format("'{}' belongs to the whole site, not to a layer: remove 'layer'", key));
    result.target.kind = key == "kc_initial"        ? Kind::kc_initial
                         : key == "kc_mid"          ? Kind::kc_mid
                         : key == "kc_end"          ? Kind::kc_end
                         : key == "pan_coefficient" ? Kind::pan_coefficient
                                                    : Kind::water_table_depth;
    if (result.target.kind == Kind::water_table_depth && !bottom_water_table_depth(site))
      entry.fail("parameter", "water_table_depth can be adjusted only with a [bottom] of kind \"water table\"");
    result.range.name = key;
  }
  const auto dimension = dimension_of(key);
  const std::vector<double> ends = dimension ? entry.quantity_list("range", *dimension) : entry.number_list("range");
  if (ends.size() != 2)
    entry.fail("range", fmt::format("needs two values, the lower and the upper end{}",
                                    dimension ? fmt::format(", each with a unit ({})", base::accepted_units(*dimension))
                                              : std::string()));
  result.range.lower = ends[0];
  result.range.upper = ends[1];
  result.range.unit = dimension ? std::string(base::internal_unit(*dimension)) : "";
  static constexpr std::array<std::string_view, 2> scales = {"linear", "log"};
  result.range.scale = entry.optional_choice("scale", scales).value_or("linear") == "log"
                           ? studies::ParameterScale::log
                           : studies::ParameterScale::linear;
  if (const auto points = entry.optional_number("grid_points")) {
    if (*points != std::floor(*points) || *points < 2 || *points > 1000)
      entry.fail("grid_points", "must be a whole number from 2 to 1000");
    result.range.grid_points = static_cast<int>(*points);
  }
  result.range.start = site_value(site, result.target);
  try {
    studies::check_parameter(result.range);
  } catch (const base::InputError& error) {
    entry.fail("range", error.what());
  }
  // Both ends must be values the site accepts, so that no run of a study fails for its range.
  ParameterStudy alone;
  alone.parameters.push_back(result);
  for (const double end : {result.range.lower, result.range.upper}) {
    try {
      (void)with_parameters(site, alone, {end});
    } catch (const base::InputError& error) {
      entry.fail("range", fmt::format("the {} end {} is not a value the site can take: {}",
                                      end == result.range.lower ? "lower" : "upper",
                                      parameter_value_text(result.range, end), error.what()));
    }
  }
  return result;
}

}  // namespace

std::vector<studies::AdjustableParameter> ParameterStudy::ranges() const {
  std::vector<studies::AdjustableParameter> out;
  for (const auto& p : parameters) out.push_back(p.range);
  return out;
}

ParameterStudy load_parameter_study(const SiteSetup& site) {
  const std::string file = site.site_file.string();
  const toml::table document = read_site_document(site.site_file);
  const SiteTable root(document, "", file);
  ParameterStudy study;
  if (const auto fit = root.subtable("fit")) {
    static constexpr std::array<std::string_view, 2> keys = {"head_uncertainty", "water_content_uncertainty"};
    fit->only_keys(keys);
    if (const auto sigma = fit->optional_quantity("head_uncertainty", base::Dimension::length)) {
      if (!(*sigma > 0)) fit->fail("head_uncertainty", "must be positive");
      study.weights.head_uncertainty_cm = *sigma;
    }
    if (const auto sigma = fit->optional_quantity("water_content_uncertainty", base::Dimension::water_content)) {
      if (!(*sigma > 0)) fit->fail("water_content_uncertainty", "must be positive");
      study.weights.water_content_uncertainty = *sigma;
    }
  }
  if (root.has("adjustable")) {
    for (const SiteTable& entry : root.table_array("adjustable")) {
      StudyParameter parameter = read_adjustable(entry, site);
      for (const auto& earlier : study.parameters) {
        if (earlier.range.name == parameter.range.name)
          entry.fail("parameter",
                     fmt::format("'{}' is already adjustable (line {})", parameter.range.name, earlier.line));
      }
      study.parameters.push_back(std::move(parameter));
    }
  }
  return study;
}

SiteSetup with_parameters(const SiteSetup& site, const ParameterStudy& study, const studies::ParameterSet& values) {
  if (values.size() != study.parameters.size())
    throw std::invalid_argument(
        fmt::format("{} values given for {} adjustable parameters", values.size(), study.parameters.size()));
  SiteSetup changed = site;
  for (std::size_t k = 0; k < values.size(); ++k) {
    const ParameterTarget& target = study.parameters[k].target;
    const double value = values[k];
    switch (target.kind) {
      case Kind::soil: *soil_field(changed.layers[target.layer].model, target.soil_key) = value; break;
      case Kind::kc_initial: changed.crop.kc_curve.kc_initial = value; break;
      case Kind::kc_mid: changed.crop.kc_curve.kc_mid = value; break;
      case Kind::kc_end: changed.crop.kc_curve.kc_end = value; break;
      case Kind::pan_coefficient:
        changed.pan.coefficient.method = forcing::PanCoefficientChoice::Method::user_value;
        changed.pan.coefficient.user_value = value;
        break;
      case Kind::water_table_depth: {
        // An initial state at rest over the same water table moves with it.
        const double old_depth = *bottom_water_table_depth(site);
        if (auto* rest = std::get_if<solver::Hydrostatic>(&changed.initial);
            rest && std::abs(rest->water_table_depth_cm - old_depth) < 1e-9) {
          rest->water_table_depth_cm = value;
        }
        changed.bottom = solver::FixedHead{changed.layers.back().bottom_depth_cm - value};
        break;
      }
    }
  }
  for (const auto& layer : changed.layers) soils::check_hydraulic_model(layer.model, "layer '" + layer.name + "'");
  forcing::check_crop_curve(changed.crop.kc_curve);
  (void)forcing::pan_coefficient(changed.pan.coefficient);  // throws for a value outside (0, 1.2]
  if (const auto depth = bottom_water_table_depth(changed); depth && *depth < 0)
    throw base::InputError(fmt::format("water table depth {} cm: it must be at or below the surface", *depth));
  return changed;
}

std::string parameter_value_text(const studies::AdjustableParameter& parameter, double value) {
  return parameter.unit.empty() ? fmt::format("{:.4g}", value) : fmt::format("{:.4g} {}", value, parameter.unit);
}

}  // namespace wetfront::site
