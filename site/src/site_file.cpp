#include "wetfront/site/site_file.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <cmath>
#include <optional>
#include <sstream>

#include <fmt/format.h>
#include <fmt/ranges.h>
#include <toml++/toml.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/base/input_files.hpp"
#include "wetfront/site/site_keys.hpp"
#include "wetfront/forcing/dry_limit.hpp"
#include "wetfront/soils/model_parameters.hpp"
#include "wetfront/soils/parameter_checks.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace wetfront::site {
namespace {

// "4 GB" -> 4e9: a positive size with a decimal unit (kB, MB, GB, TB).
std::optional<double> data_size_bytes(const std::string& text) {
  std::istringstream in(text);
  double value = 0;
  std::string unit, rest;
  if (!(in >> value >> unit) || (in >> rest) || !(value > 0) || !std::isfinite(value)) return std::nullopt;
  for (const auto& [name, factor] : {std::pair{"kB", 1e3}, {"MB", 1e6}, {"GB", 1e9}, {"TB", 1e12}}) {
    if (unit == name) return value * factor;
  }
  return std::nullopt;
}

using Keys = std::span<const std::string_view>;

constexpr std::array<std::string_view, 11> top_keys = {"site",    "run",     "layers", "grid", "initial", "bottom",
                                                       "surface", "weather", "pan",    "crop", "sensors"};
// [fit] and [[adjustable]] describe a parameter study; adjustable_parameters.cpp reads them.
constexpr std::array<std::string_view, 4> tail_keys = {"recharge", "solver", "fit", "adjustable"};

std::vector<std::string_view> all_top_keys() {
  std::vector<std::string_view> keys(top_keys.begin(), top_keys.end());
  keys.insert(keys.end(), tail_keys.begin(), tail_keys.end());
  return keys;
}

base::TimePoint date_value(const SiteTable& table, std::string_view key, const std::string& text) {
  const auto time = base::parse_timestamp(base::trim(text));
  if (!time) {
    table.fail(key, fmt::format("'{}' is not a date; write YYYY-MM-DD or YYYY-MM-DDThh:mm[:ss]", text));
  }
  return *time;
}

base::TimePoint date_of(const SiteTable& table, std::string_view key) {
  return date_value(table, key, table.text(key));
}

std::vector<double> day_list(const SiteTable& table, std::string_view key, base::TimePoint start) {
  std::vector<double> days;
  const auto texts = table.text_list(key);
  for (std::size_t i = 0; i < texts.size(); ++i) {
    const auto time = base::parse_timestamp(base::trim(texts[i]));
    if (!time) table.fail_entry(key, i, fmt::format("entry {} '{}' is not a date; write YYYY-MM-DD", i + 1, texts[i]));
    days.push_back(base::days_since(start, *time));
    if (i > 0 && !(days[i] > days[i - 1])) {
      table.fail_entry(key, i, fmt::format("entry {} is not later than entry {}; dates must increase", i + 1, i));
    }
  }
  return days;
}

std::filesystem::path existing_file(const SiteTable& table, std::string_view key, const std::filesystem::path& folder) {
  const std::string text = table.text(key);
  const std::filesystem::path path = folder / text;
  std::error_code error;
  if (std::filesystem::is_directory(path, error))
    table.fail(key, fmt::format("'{}' is a folder; give the name of a file in it", path.string()));
  if (!base::is_input_file(path)) {
    table.fail(key, fmt::format("file '{}' not found (paths are relative to the site file's folder)", path.string()));
  }
  return path;
}

forcing::GapPolicy gap_policy(const SiteTable& table, std::string_view key, forcing::GapPolicy fallback) {
  static constexpr std::array<std::string_view, 3> choices = {"error", "no water", "end run"};
  const auto choice = table.optional_choice(key, choices);
  if (!choice) return fallback;
  if (*choice == "no water") return forcing::GapPolicy::fill_with_zero;
  if (*choice == "end run") return forcing::GapPolicy::stop_run_at_gap;
  return forcing::GapPolicy::error;
}

ForcingFile forcing_file(const SiteTable& table, std::string_view key, std::string_view gaps_key,
                         const std::filesystem::path& folder, forcing::GapPolicy fallback) {
  ForcingFile file;
  file.path = existing_file(table, key, folder);
  file.gaps = gap_policy(table, gaps_key, fallback);
  file.line = table.line_of(key);
  file.key = table.key_name(key);
  return file;
}

// --- [[layers]] --------------------------------------------------------------------------

// A water content is a volume fraction: a bare number in [0, 1], or a value with a unit
// (cm3/cm3, m3/m3 or %).
double water_content(const SiteTable& layer, std::string_view key) {
  if (layer.has(key)) {
    if (const auto bare = layer.optional_number_if_plain(key)) {
      if (*bare < 0)
        layer.fail(key, fmt::format("{} is negative; a water content is a volume fraction in [0, 1]", *bare));
      if (*bare > 1 && *bare <= 100)
        layer.fail(key,
                   fmt::format("{} is not a volume fraction in [0, 1]; for a percentage write \"{} %\"", *bare, *bare));
      if (*bare > 1) layer.fail(key, fmt::format("{} is not a volume fraction in [0, 1]", *bare));
      return *bare;
    }
  }
  return layer.quantity(key, base::Dimension::water_content);
}

// A parameter's value as model_parameters.hpp describes it: a value with a unit of its
// dimension, a water content, or a plain number.
double parameter_from(const SiteTable& layer, const soils::ModelParameter& parameter) {
  const auto dimension = soils::parameter_dimension(parameter);
  if (!dimension) return layer.number(parameter.key);
  if (*dimension == base::Dimension::water_content) return water_content(layer, parameter.key);
  return layer.quantity(parameter.key, *dimension);
}

soils::HydraulicModel layer_model(const SiteTable& layer) {
  const std::vector<soils::HydraulicModel> defaults = soils::all_models();
  std::vector<std::string_view> names;
  for (const auto& model : defaults) names.push_back(soils::model_key(model));
  if (layer.has("texture")) {
    if (layer.has("model"))
      layer.fail("model", "give either 'texture' (class defaults) or 'model' with parameters, not both");
    // Class averages come as a set; parameters beside them would be silently overridden or ignored.
    static constexpr std::array<std::string_view, 5> texture_keys = {"name", "top", "bottom", "note", "texture"};
    layer.only_keys(texture_keys);
    const std::string name = layer.text("texture");
    try {
      return soils::texture_class_parameters(name);
    } catch (const base::InputError& error) {
      layer.fail("texture", error.what());
    }
  }
  if (!layer.has("model")) {
    layer.fail("", fmt::format("a layer needs either 'texture' (a USDA texture class) or 'model' ({} or {}) with its "
                               "parameters",
                               fmt::join(names.begin(), names.end() - 1, ", "), names.back()));
  }
  // "van genuchten-mualem" is the published name of the plain van Genuchten model.
  std::vector<std::string_view> choices = names;
  choices.insert(choices.begin() + 1, "van genuchten-mualem");
  const std::string name = layer.choice("model", choices);
  soils::HydraulicModel model = defaults.front();  // the plain van Genuchten model, also for its alias
  for (const auto& candidate : defaults)
    if (soils::model_key(candidate) == name) model = candidate;
  // Each model takes its own parameters; a parameter of another model is an error, not ignored.
  std::vector<std::string_view> keys = {"name", "top", "bottom", "note", "model"};
  for (const auto& parameter : soils::model_parameters(model)) keys.push_back(parameter.key);
  layer.only_keys(keys);
  for (const auto& parameter : soils::model_parameters(model)) {
    if (parameter.optional && !layer.has(parameter.key)) continue;
    *soils::parameter_value(model, parameter.key) = parameter_from(layer, parameter);
  }
  return model;
}

std::vector<soils::SoilLayer> read_layers(const SiteTable& root) {
  std::vector<std::string_view> keys = {"name", "top", "bottom", "texture", "model"};
  const auto parameter_keys = soils::all_parameter_keys();
  keys.insert(keys.end(), parameter_keys.begin(), parameter_keys.end());
  keys.push_back("note");
  const auto tables = root.table_array("layers");
  if (tables.empty())
    root.fail("layers", "the site needs at least one [[layers]] table (soil layers from the surface down)");
  std::vector<soils::SoilLayer> layers;
  for (const auto& table : tables) {
    table.only_keys(keys);
    soils::SoilLayer layer;
    layer.name = table.optional_text("name").value_or(table.key_name(""));
    layer.top_depth_cm = table.quantity("top", base::Dimension::length);
    layer.bottom_depth_cm = table.quantity("bottom", base::Dimension::length);
    if (layers.empty() && std::abs(layer.top_depth_cm) > 1e-9) {
      table.fail("top",
                 fmt::format("the first layer must start at the surface (0 cm), not at {} cm", layer.top_depth_cm));
    }
    if (!layers.empty()) {
      const double above = layers.back().bottom_depth_cm;
      if (layer.top_depth_cm < above - 1e-9) {
        table.fail("top",
                   fmt::format("layer overlaps the one above: it starts at {} cm but the layer above ends at {} cm",
                               layer.top_depth_cm, above));
      }
      if (layer.top_depth_cm > above + 1e-9) {
        table.fail("top", fmt::format("gap between layers: the layer above ends at {} cm but this one starts at {} cm",
                                      above, layer.top_depth_cm));
      }
    }
    if (!(layer.bottom_depth_cm > layer.top_depth_cm)) {
      table.fail("bottom", fmt::format("bottom ({} cm) must be deeper than top ({} cm)", layer.bottom_depth_cm,
                                       layer.top_depth_cm));
    }
    layer.model = layer_model(table);
    try {
      soils::check_hydraulic_model(layer.model, layer.name);
    } catch (const base::InputError& error) {
      table.fail(table.has(error.column()) ? error.column() : "", error.problem());
    }
    layers.push_back(std::move(layer));
  }
  return layers;
}

// --- [initial] and [bottom] --------------------------------------------------------------

void read_initial(const SiteTable& root, double column_depth_cm, SiteSetup& site) {
  static constexpr std::array<std::string_view, 3> kinds = {"water table", "uniform head", "head table"};
  static constexpr std::array<std::string_view, 5> keys = {"kind", "water_table_depth", "head", "depths", "heads"};
  const auto table = root.subtable("initial");
  if (!table) root.fail("initial", "missing table [initial] (the water in the column at the run start)");
  table->only_keys(keys);
  const std::string kind = table->choice("kind", kinds);
  if (kind == "water table") {
    const double depth = table->quantity("water_table_depth", base::Dimension::length);
    site.initial = solver::Hydrostatic{depth};
    site.initial_text = fmt::format("at rest over a water table at {} cm", depth);
  } else if (kind == "uniform head") {
    const double head = table->quantity("head", base::Dimension::pressure_head);
    site.initial = solver::UniformHead{head};
    site.initial_text = fmt::format("uniform pressure head {} cm", head);
  } else {
    solver::HeadTable head_table{table->quantity_list("depths", base::Dimension::length),
                                 table->quantity_list("heads", base::Dimension::pressure_head)};
    if (head_table.depth_cm.size() != head_table.head_cm.size() || head_table.depth_cm.empty()) {
      table->fail("heads", fmt::format("needs one head per depth ({} depths, {} heads)", head_table.depth_cm.size(),
                                       head_table.head_cm.size()));
    }
    for (std::size_t i = 0; i < head_table.depth_cm.size(); ++i) {
      if (head_table.depth_cm[i] < 0 || head_table.depth_cm[i] > column_depth_cm + 1e-9) {
        table->fail("depths", fmt::format("entry {} ({} cm) is outside the column (0 to {} cm)", i + 1,
                                          head_table.depth_cm[i], column_depth_cm));
      }
      if (i > 0 && !(head_table.depth_cm[i] > head_table.depth_cm[i - 1])) {
        table->fail("depths", fmt::format("entry {} is not deeper than entry {}; depths must increase", i + 1, i));
      }
    }
    site.initial_text = fmt::format("pressure heads at {} depths, interpolated", head_table.depth_cm.size());
    site.initial = std::move(head_table);
  }
}

void read_bottom(const SiteTable& root, double column_depth_cm, SiteSetup& site) {
  static constexpr std::array<std::string_view, 4> kinds = {"water table", "free drainage", "no flow", "seepage face"};
  static constexpr std::array<std::string_view, 3> keys = {"kind", "water_table_depth", "head"};
  const auto table = root.subtable("bottom");
  if (!table) root.fail("bottom", "missing table [bottom] (the boundary at the column bottom)");
  table->only_keys(keys);
  const std::string kind = table->choice("kind", kinds);
  if (kind == "water table") {
    if (table->has("water_table_depth") == table->has("head")) {
      table->fail("kind",
                  "a water table bottom needs exactly one of 'water_table_depth' or 'head' (pressure head at the "
                  "column bottom)");
    }
    double head = 0;
    if (table->has("head")) {
      head = table->quantity("head", base::Dimension::pressure_head);
    } else {
      const double depth = table->quantity("water_table_depth", base::Dimension::length);
      head = column_depth_cm - depth;
      if (depth < 0) table->fail("water_table_depth", "must be at or below the surface (positive)");
    }
    site.bottom = solver::FixedHead{head};
    site.bottom_text = fmt::format("fixed pressure head {} cm at {} cm (water table at {} cm)", head, column_depth_cm,
                                   column_depth_cm - head);
  } else if (kind == "free drainage") {
    site.bottom = solver::FreeDrainage{};
    site.bottom_text = "free drainage (unit gradient)";
  } else if (kind == "no flow") {
    site.bottom = solver::ZeroFlux{};
    site.bottom_text = "no flow";
  } else {
    site.bottom = solver::SeepageFace{};
    site.bottom_text = "seepage face (outflow only when the bottom saturates)";
  }
}

// --- [crop] ------------------------------------------------------------------------------

forcing::DatedTable dated_table(const SiteTable& table, std::string quantity, std::string_view values_key,
                                std::optional<base::Dimension> dimension, base::TimePoint start, double lowest,
                                double highest) {
  static constexpr std::array<std::string_view, 4> keys = {"dates", "values", "depths", "note"};
  table.only_keys(keys);
  forcing::DatedTable out;
  out.quantity = std::move(quantity);
  out.days = day_list(table, "dates", start);
  out.values = dimension ? table.quantity_list(values_key, *dimension) : table.number_list(values_key);
  if (out.days.size() != out.values.size() || out.days.empty()) {
    table.fail(values_key,
               fmt::format("needs one value per date ({} dates, {} values)", out.days.size(), out.values.size()));
  }
  for (std::size_t i = 0; i < out.values.size(); ++i) {
    if (out.values[i] < lowest || out.values[i] > highest) {
      table.fail(values_key, fmt::format("entry {} ({}) is outside {} to {}", i + 1, out.values[i], lowest, highest));
    }
  }
  return out;
}

void read_crop(const SiteTable& root, SiteSetup& site) {
  static constexpr std::array<std::string_view, 19> keys = {"name",
                                                            "uptake_response",
                                                            "root_shape",
                                                            "root_length_scale",
                                                            "planting",
                                                            "initial_stage",
                                                            "development_stage",
                                                            "mid_season_stage",
                                                            "late_season_stage",
                                                            "kc_initial",
                                                            "kc_mid",
                                                            "kc_end",
                                                            "kc_bare_soil",
                                                            "evaporation_split",
                                                            "extinction_coefficient",
                                                            "leaf_area_index",
                                                            "soil_cover",
                                                            "root_depth",
                                                            "note"};
  const auto table = root.subtable("crop");
  if (!table)
    root.fail("crop",
              "missing table [crop] (crop stages and coefficients; describe bare soil as a crop with kc values)");
  table->only_keys(keys);
  CropSetup& crop = site.crop;
  crop.name = table->optional_text("name").value_or("crop");
  auto& curve = crop.kc_curve;
  curve.planting_day = base::days_since(site.run_start, date_of(*table, "planting"));
  curve.stages.initial_days = table->quantity("initial_stage", base::Dimension::time);
  curve.stages.development_days = table->quantity("development_stage", base::Dimension::time);
  curve.stages.mid_season_days = table->quantity("mid_season_stage", base::Dimension::time);
  curve.stages.late_season_days = table->quantity("late_season_stage", base::Dimension::time);
  curve.kc_initial = table->number("kc_initial");
  curve.kc_mid = table->number("kc_mid");
  curve.kc_end = table->number("kc_end");
  curve.kc_bare_soil = table->number("kc_bare_soil");
  try {
    forcing::check_crop_curve(curve);
  } catch (const base::InputError& error) {
    table->fail("", error.what());
  }
  static constexpr std::array<std::string_view, 2> splits = {"leaf area index", "soil cover"};
  const std::string split = table->optional_choice("evaporation_split", splits).value_or("leaf area index");
  crop.split.method =
      split == "soil cover" ? forcing::CanopySplit::Method::soil_cover : forcing::CanopySplit::Method::leaf_area_index;
  crop.split.extinction_coefficient =
      table->optional_number("extinction_coefficient").value_or(forcing::default_extinction_coefficient);
  if (!(crop.split.extinction_coefficient > 0 && crop.split.extinction_coefficient <= 2)) {
    table->fail("extinction_coefficient", "must lie in (0, 2]");
  }
  if (const auto lai = table->subtable("leaf_area_index")) {
    crop.split.leaf_area_index = dated_table(*lai, "leaf area index", "values", std::nullopt, site.run_start, 0, 15);
  } else if (crop.split.method == forcing::CanopySplit::Method::leaf_area_index) {
    table->fail(
        "leaf_area_index",
        "missing table [crop.leaf_area_index] with 'dates' and 'values' (m2/m2), needed by the leaf area index split");
  }
  if (const auto cover = table->subtable("soil_cover")) {
    crop.split.soil_cover = dated_table(*cover, "soil cover fraction", "values", std::nullopt, site.run_start, 0, 1);
  } else if (crop.split.method == forcing::CanopySplit::Method::soil_cover) {
    table->fail("soil_cover", "missing table [crop.soil_cover] with 'dates' and 'values' (fraction 0 to 1)");
  }
  const auto roots = table->subtable("root_depth");
  if (!roots)
    table->fail("root_depth", "missing table [crop.root_depth] with 'dates' and 'depths' (give 0 cm for bare soil)");
  const double column = site.layers.back().bottom_depth_cm;
  crop.root_depth_cm = dated_table(*roots, "root depth", "depths", base::Dimension::length, site.run_start, 0, column);

  // Water-stress response of root uptake (Feddes et al. 1978), parameter sets by crop.
  static constexpr std::array<std::string_view, 5> responses = {"maize", "wheat", "grass", "potatoes", "sugar beet"};
  if (table->has("uptake_response")) {
    crop.uptake_response_name = table->choice("uptake_response", responses);
  } else {
    std::string name = base::trim(crop.name);
    for (char& ch : name) ch = static_cast<char>(std::tolower(static_cast<unsigned char>(ch)));
    if (std::find(responses.begin(), responses.end(), name) == responses.end()) {
      table->fail("uptake_response",
                  fmt::format("missing; crop '{}' has no built-in root water-stress response, choose one of "
                              "maize, wheat, grass, potatoes, sugar beet",
                              crop.name));
    }
    crop.uptake_response_name = name;
  }
  const std::string& r = crop.uptake_response_name;
  crop.uptake_response = r == "maize"      ? solver::feddes_maize()
                         : r == "wheat"    ? solver::feddes_wheat()
                         : r == "grass"    ? solver::feddes_grass()
                         : r == "potatoes" ? solver::feddes_potatoes()
                                           : solver::feddes_sugar_beet();
  static constexpr std::array<std::string_view, 3> shapes = {"uniform", "linear", "exponential"};
  const std::string shape = table->optional_choice("root_shape", shapes).value_or("linear");
  if (shape == "uniform") {
    crop.root_shape = solver::UniformRoots{};
  } else if (shape == "linear") {
    crop.root_shape = solver::LinearRoots{};
  } else {
    const double length = table->quantity("root_length_scale", base::Dimension::length);
    if (!(length > 0)) table->fail("root_length_scale", "must be positive");
    crop.root_shape = solver::ExponentialRoots{length};
  }
  if (shape != "exponential" && table->has("root_length_scale")) {
    table->fail("root_length_scale", "only used with root_shape = \"exponential\"");
  }
}

// --- [pan] -------------------------------------------------------------------------------

void read_pan(const SiteTable& root, const std::filesystem::path& folder, SiteSetup& site) {
  static constexpr std::array<std::string_view, 9> keys = {"readings",    "daily_evaporation",  "gaps",
                                                           "coefficient", "coefficient_method", "surroundings",
                                                           "wind_speed",  "relative_humidity",  "fetch"};
  const auto table = root.subtable("pan");
  if (!table) root.fail("pan", "missing table [pan] (Class A pan records and pan coefficient)");
  table->only_keys(keys);
  if (table->has("readings") == table->has("daily_evaporation")) {
    table->fail(
        "readings",
        "give exactly one of 'readings' (hook-gauge readings CSV) or 'daily_evaporation' (pan evaporation CSV)");
  }
  if (table->has("readings")) {
    site.pan.readings = forcing_file(*table, "readings", "gaps", folder, forcing::GapPolicy::error);
  } else {
    site.pan.daily_evaporation = forcing_file(*table, "daily_evaporation", "gaps", folder, forcing::GapPolicy::error);
  }
  static constexpr std::array<std::string_view, 3> methods = {"value", "table", "regression"};
  const std::string method = table->optional_choice("coefficient_method", methods).value_or("value");
  auto& choice = site.pan.coefficient;
  if (method == "value") {
    choice.method = forcing::PanCoefficientChoice::Method::user_value;
    choice.user_value = table->number("coefficient");
    if (!(choice.user_value > 0 && choice.user_value <= 1.2)) table->fail("coefficient", "must lie in (0, 1.2]");
    return;
  }
  if (table->has("coefficient"))
    table->fail("coefficient", fmt::format("not used with coefficient_method = \"{}\"; remove it", method));
  choice.method = method == "table" ? forcing::PanCoefficientChoice::Method::table
                                    : forcing::PanCoefficientChoice::Method::regression;
  static constexpr std::array<std::string_view, 2> surroundings = {"green crop", "dry fallow"};
  choice.site.surroundings = table->choice("surroundings", surroundings) == "green crop"
                                 ? forcing::PanSurroundings::green_fetch
                                 : forcing::PanSurroundings::dry_fetch;
  choice.site.wind_speed_2m_m_per_s = table->quantity("wind_speed", base::Dimension::wind_speed);
  choice.site.mean_relative_humidity_pct = table->quantity("relative_humidity", base::Dimension::percentage);
  choice.site.fetch_m = table->quantity("fetch", base::Dimension::length) / 100.0;
  try {
    (void)forcing::pan_coefficient(choice);
  } catch (const base::InputError& error) {
    table->fail("coefficient_method", error.what());
  }
}

// --- [[sensor]] --------------------------------------------------------------------------

void read_sensors(const SiteTable& root, const std::filesystem::path& folder, double column_depth_cm, SiteSetup& site) {
  static constexpr std::array<std::string_view, 10> keys = {
      "name",           "kind",          "depth",          "readings",
      "gauge_height",   "working_limit", "specific_yield", "specific_yield_source",
      "recession_rate", "note"};
  static constexpr std::array<std::string_view, 4> kinds = {"tensiometer", "water content probe", "observation well",
                                                            "core samples"};
  for (const auto& table : root.table_array("sensors")) {
    table.only_keys(keys);
    SensorSetup sensor;
    sensor.name = table.text("name");
    sensor.kind = table.choice("kind", kinds);
    const bool tensiometer = sensor.kind == "tensiometer";
    const bool well = sensor.kind == "observation well";
    const bool cores = sensor.kind == "core samples";
    if (well || cores) {
      // Their readings give the depth of every value: the water table, or each core.
      if (table.has("depth")) {
        table.fail("depth", fmt::format("a{} takes no depth: {}", well ? "n observation well" : " core-samples entry",
                                        well ? "its readings give the depth to water"
                                             : "each row of its file gives the core's depth"));
      }
    } else {
      sensor.depth_cm = table.quantity("depth", base::Dimension::length);
      if (!(sensor.depth_cm > 0 && sensor.depth_cm < column_depth_cm)) {
        table.fail("depth", fmt::format("{} cm is not inside the column (0 to {} cm, the bottom of the last layer)",
                                        sensor.depth_cm, column_depth_cm));
      }
    }
    sensor.readings = existing_file(table, "readings", folder);
    for (const std::string_view key : {std::string_view("gauge_height"), std::string_view("working_limit")}) {
      if (!tensiometer && table.has(key)) table.fail(key, "only a tensiometer takes this key");
    }
    for (const std::string_view key : {std::string_view("specific_yield"), std::string_view("specific_yield_source"),
                                       std::string_view("recession_rate")}) {
      if (!well && table.has(key)) table.fail(key, "only an observation well takes this key");
    }
    if (tensiometer) {
      sensor.gauge_height_cm = table.optional_quantity("gauge_height", base::Dimension::length);
      if (sensor.gauge_height_cm && *sensor.gauge_height_cm < 0)
        table.fail("gauge_height", "the gauge height above ground cannot be negative");
      if (const auto limit = table.optional_quantity("working_limit", base::Dimension::pressure_head)) {
        if (!(*limit > 0))
          table.fail("working_limit", "the working limit is a tension, greater than zero (e.g. \"80 kPa\")");
        sensor.working_limit_kpa = *limit / base::kCentimetresOfWaterPerKilopascal;
      }
    }
    if (well) {
      if (!table.has("specific_yield")) {
        table.fail("kind",
                   "an observation well needs 'specific_yield' (a fraction between 0 and 1, e.g. 0.12) for the "
                   "water-table-fluctuation estimate");
      }
      sensor.specific_yield = table.number("specific_yield");
      if (!(sensor.specific_yield > 0 && sensor.specific_yield < 1)) {
        table.fail("specific_yield",
                   fmt::format("{} is not a fraction between 0 and 1 (e.g. 0.12)", sensor.specific_yield));
      }
      sensor.specific_yield_note = table.optional_text("specific_yield_source").value_or("");
      // A rate of fall: a length per time, written like a conductivity ("0.3 cm/d").
      sensor.recession_cm_per_d =
          table.optional_quantity("recession_rate", base::Dimension::conductivity).value_or(0.0);
      if (!(sensor.recession_cm_per_d >= 0)) {
        table.fail("recession_rate",
                   "the fall of the water table without recharge is a rate of zero or more (e.g. \"0.5 cm/d\")");
      }
    }
    for (const auto& other : site.sensors) {
      if (other.name == sensor.name) table.fail("name", fmt::format("sensor name '{}' is used twice", sensor.name));
    }
    site.sensors.push_back(std::move(sensor));
  }
}

// The tensiometer pair of the Darcy estimate: named in [recharge] tensiometer_pair, upper
// first, or by default the two deepest tensiometers.
void read_darcy_pair(const SiteTable& recharge, SiteSetup& site) {
  std::vector<const SensorSetup*> tensiometers;
  for (const auto& sensor : site.sensors) {
    if (sensor.kind == "tensiometer") tensiometers.push_back(&sensor);
  }
  if (!recharge.has("tensiometer_pair")) {
    if (tensiometers.size() < 2) return;
    std::sort(tensiometers.begin(), tensiometers.end(),
              [](const auto* a, const auto* b) { return a->depth_cm < b->depth_cm; });
    site.darcy_pair = {tensiometers[tensiometers.size() - 2]->name, tensiometers.back()->name};
    return;
  }
  const auto names = recharge.text_list("tensiometer_pair");
  if (names.size() != 2)
    recharge.fail("tensiometer_pair", "give two tensiometer names, the upper first, e.g. [\"T90\", \"T120\"]");
  double depths[2] = {0, 0};
  for (int i = 0; i < 2; ++i) {
    const auto found =
        std::find_if(tensiometers.begin(), tensiometers.end(), [&](const auto* t) { return t->name == names[i]; });
    if (found == tensiometers.end()) {
      std::string known;
      for (const auto* t : tensiometers) known += (known.empty() ? "" : ", ") + t->name;
      recharge.fail("tensiometer_pair", fmt::format("'{}' is not a tensiometer of [[sensors]]; tensiometers: {}",
                                                    names[i], known.empty() ? std::string("none") : known));
    }
    depths[i] = (*found)->depth_cm;
  }
  if (!(depths[0] < depths[1]))
    recharge.fail("tensiometer_pair", "the first tensiometer must be shallower than the second");
  site.darcy_pair = names;
}

// --- [solver], [grid], [surface] ---------------------------------------------------------

// The dry limit from the air: the Kelvin equation with the given humidity and temperature
// (forcing/dry_limit.hpp). Exclusive with an explicit dry_limit head.
void read_dry_limit_from_air(const SiteTable& surface, SiteSetup& site) {
  const bool humidity = surface.has("dry_limit_air_humidity");
  const bool temperature = surface.has("dry_limit_air_temperature");
  if (!humidity && !temperature) return;
  if (surface.has("dry_limit"))
    surface.fail("dry_limit_air_humidity", "give either dry_limit or the air humidity and temperature, not both");
  if (!humidity) surface.fail("dry_limit_air_temperature", "needs dry_limit_air_humidity beside it");
  if (!temperature) surface.fail("dry_limit_air_humidity", "needs dry_limit_air_temperature beside it");
  const double fraction = surface.quantity("dry_limit_air_humidity", base::Dimension::water_content);
  if (!(fraction > 0 && fraction < 1))
    surface.fail("dry_limit_air_humidity", "must lie strictly between 0 and 100 %, e.g. \"45 %\"");
  site.dry_limit_head_cm = forcing::dry_limit_head_from_humidity(
      fraction, surface.quantity("dry_limit_air_temperature", base::Dimension::temperature));
}

void read_numerics(const SiteTable& root, SiteSetup& site) {
  if (const auto grid = root.subtable("grid")) {
    static constexpr std::array<std::string_view, 3> keys = {"surface_cell", "growth_factor", "max_cell"};
    grid->only_keys(keys);
    site.grid.surface_cell_cm =
        grid->optional_quantity("surface_cell", base::Dimension::length).value_or(site.grid.surface_cell_cm);
    site.grid.growth_factor = grid->optional_number("growth_factor").value_or(site.grid.growth_factor);
    site.grid.max_cell_cm =
        grid->optional_quantity("max_cell", base::Dimension::length).value_or(site.grid.max_cell_cm);
    if (!(site.grid.surface_cell_cm > 0)) grid->fail("surface_cell", "must be positive");
    if (!(site.grid.growth_factor >= 1 && site.grid.growth_factor <= 2))
      grid->fail("growth_factor", "must lie in [1, 2]");
    if (!(site.grid.max_cell_cm >= site.grid.surface_cell_cm)) grid->fail("max_cell", "must be at least surface_cell");
  }
  if (const auto surface = root.subtable("surface")) {
    static constexpr std::array<std::string_view, 4> keys = {"dry_limit", "max_ponding", "dry_limit_air_humidity",
                                                             "dry_limit_air_temperature"};
    surface->only_keys(keys);
    site.dry_limit_head_cm =
        surface->optional_quantity("dry_limit", base::Dimension::pressure_head).value_or(site.dry_limit_head_cm);
    read_dry_limit_from_air(*surface, site);
    site.max_ponded_depth_cm = surface->optional_quantity("max_ponding", base::Dimension::length).value_or(0.0);
    if (!(site.dry_limit_head_cm < 0))
      surface->fail("dry_limit", "must be a negative pressure head, e.g. \"-1500 kPa\"");
    if (site.max_ponded_depth_cm < 0) surface->fail("max_ponding", "must not be negative");
  }
  if (const auto solver = root.subtable("solver")) {
    static constexpr std::array<std::string_view, 6> keys = {"relative_tolerance", "storage_tolerance",
                                                             "head_tolerance",     "max_step",
                                                             "face_conductivity",  "specific_storage"};
    solver->only_keys(keys);
    auto& s = site.settings;
    s.relative_tolerance = solver->optional_number("relative_tolerance").value_or(s.relative_tolerance);
    s.absolute_tolerance_storage_cm = solver->optional_quantity("storage_tolerance", base::Dimension::length)
                                          .value_or(s.absolute_tolerance_storage_cm);
    s.head_tolerance_cm =
        solver->optional_quantity("head_tolerance", base::Dimension::length).value_or(s.head_tolerance_cm);
    s.max_step_days = solver->optional_quantity("max_step", base::Dimension::time).value_or(s.max_step_days);
    if (!(s.relative_tolerance > 0 && s.relative_tolerance < 0.1))
      solver->fail("relative_tolerance", "must lie in (0, 0.1)");
    if (!(s.absolute_tolerance_storage_cm > 0)) solver->fail("storage_tolerance", "must be positive");
    if (!(s.head_tolerance_cm > 0)) solver->fail("head_tolerance", "must be positive");
    if (!(s.max_step_days > 0)) solver->fail("max_step", "must be positive");
    site.specific_storage_per_cm = solver->optional_quantity("specific_storage", base::Dimension::inverse_length)
                                       .value_or(site.specific_storage_per_cm);
    if (!(site.specific_storage_per_cm > 0 && site.specific_storage_per_cm < 0.01)) {
      solver->fail("specific_storage", "must lie in (0, 0.01) 1/cm");
    }
    static constexpr std::array<std::string_view, 4> means = {"arithmetic", "geometric", "harmonic", "integral"};
    if (const auto mean = solver->optional_choice("face_conductivity", means)) {
      site.face_conductivity = *mean == "integral"    ? solver::FaceConductivity::integral
                               : *mean == "harmonic"  ? solver::FaceConductivity::harmonic
                               : *mean == "geometric" ? solver::FaceConductivity::geometric
                                                      : solver::FaceConductivity::arithmetic;
    }
  }
}

}  // namespace

SiteSetup load_site_file(const std::filesystem::path& site_file, const PeriodOverride& period) {
  const std::string file = site_file.string();
  const toml::table document = read_site_document(site_file);
  const SiteTable root(document, "", file);
  const auto top = all_top_keys();
  root.only_keys(top);
  const std::filesystem::path folder = site_file.parent_path().empty() ? "." : site_file.parent_path();
  {
    // Every required table missing is named at once; one alone gets its own message below.
    static constexpr std::array<std::string_view, 9> required = {"site",    "run", "layers", "initial", "bottom",
                                                                 "weather", "pan", "crop",   "recharge"};
    std::vector<std::string> missing;
    for (const auto name : required) {
      if (!document.contains(name)) missing.push_back(name == "layers" ? "[[layers]]" : fmt::format("[{}]", name));
    }
    if (missing.size() > 1)
      throw base::InputError(file, 0, "",
                             fmt::format("missing tables {}: the site file needs each of them (docs/site-file.md)",
                                         fmt::join(missing, ", ")));
  }

  SiteSetup site;
  site.site_file = site_file;
  {
    const auto table = root.subtable("site");
    if (!table) root.fail("site", "missing table [site] with at least 'name'");
    static constexpr std::array<std::string_view, 3> keys = {"name", "location", "description"};
    table->only_keys(keys);
    site.name = table->text("name");
    site.location = table->optional_text("location").value_or("");
    site.description = table->optional_text("description").value_or("");
  }
  const auto run = root.subtable("run");
  if (!run) root.fail("run", "missing table [run] with 'start' and 'end' dates");
  static constexpr std::array<std::string_view, 5> run_keys = {"start", "end", "output_interval", "visits",
                                                               "output_size_limit"};
  run->only_keys(run_keys);
  std::string start_text = base::trim(run->text("start"));
  std::string end_text = base::trim(run->text("end"));
  base::TimePoint start = date_of(*run, "start");
  base::TimePoint end = date_of(*run, "end");
  const bool overridden = !period.from.empty() || !period.to.empty();
  if (!period.from.empty()) {
    const auto t = base::parse_timestamp(period.from);
    if (!t) throw base::InputError(fmt::format("option --from: '{}' is not a date; write YYYY-MM-DD", period.from));
    start = *t;
    start_text = base::trim(period.from);
  }
  if (!period.to.empty()) {
    const auto t = base::parse_timestamp(period.to);
    if (!t) throw base::InputError(fmt::format("option --to: '{}' is not a date; write YYYY-MM-DD", period.to));
    end = *t;
    end_text = base::trim(period.to);
  }
  site.run_start = start;
  site.run_start_text = start_text;
  site.run_end_text = end_text;
  site.run_length_days = base::days_since(start, end);
  if (!(site.run_length_days > 0)) {
    if (overridden)
      throw base::InputError(
          fmt::format("the run period {} to {} is empty; --to must be after --from", start_text, end_text));
    run->fail("end", fmt::format("the run must end after it starts ({} to {})", start_text, end_text));
  }
  site.output_interval_days = run->optional_quantity("output_interval", base::Dimension::time).value_or(1.0);
  if (!(site.output_interval_days > 0)) run->fail("output_interval", "must be positive");
  if (const auto limit = run->optional_text("output_size_limit")) {
    const auto bytes = data_size_bytes(*limit);
    if (!bytes)
      run->fail("output_size_limit", fmt::format("'{}' is not a size; write e.g. \"4 GB\" (kB, MB, GB or TB)", *limit));
    site.output_size_limit_bytes = *bytes;
  }
  if (run->has("visits")) {
    const auto texts = run->text_list("visits");
    std::optional<double> previous;
    for (std::size_t i = 0; i < texts.size(); ++i) {
      const auto time = base::parse_timestamp(base::trim(texts[i]));
      if (!time)
        run->fail_entry("visits", i, fmt::format("entry {} '{}' is not a date; write YYYY-MM-DD", i + 1, texts[i]));
      const double day = base::days_since(start, *time);
      if (previous && day <= *previous) {
        run->fail_entry("visits", i, fmt::format("entry {} ({}) is not later than the entry before", i + 1, texts[i]));
      }
      previous = day;
      if (day < 0 || day > site.run_length_days + 1e-9) {
        if (overridden) continue;  // a shorter period keeps the visits inside it
        run->fail_entry(
            "visits", i,
            fmt::format("entry {} ({}) is outside the run ({} to {})", i + 1, texts[i], start_text, end_text));
      }
      site.visit_days.push_back(day);
      site.visit_dates.push_back(base::trim(texts[i]));
    }
  }

  site.layers = read_layers(root);
  const double column_depth = site.layers.back().bottom_depth_cm;
  read_initial(root, column_depth, site);
  read_bottom(root, column_depth, site);

  {
    const auto weather = root.subtable("weather");
    if (!weather) root.fail("weather", "missing table [weather] with at least 'rain' (a CSV file of rain depths)");
    static constexpr std::array<std::string_view, 4> keys = {"rain", "rain_gaps", "irrigation", "irrigation_gaps"};
    weather->only_keys(keys);
    site.rain = forcing_file(*weather, "rain", "rain_gaps", folder, forcing::GapPolicy::error);
    if (weather->has("irrigation")) {
      site.irrigation =
          forcing_file(*weather, "irrigation", "irrigation_gaps", folder, forcing::GapPolicy::fill_with_zero);
    }
  }
  read_pan(root, folder, site);
  read_crop(root, site);
  read_sensors(root, folder, column_depth, site);

  {
    const auto recharge = root.subtable("recharge");
    if (!recharge) root.fail("recharge", "missing table [recharge] with 'plane_depth' (where recharge is counted)");
    static constexpr std::array<std::string_view, 2> keys = {"plane_depth", "tensiometer_pair"};
    recharge->only_keys(keys);
    read_darcy_pair(*recharge, site);
    site.recharge_plane_depth_cm = recharge->quantity("plane_depth", base::Dimension::length);
    if (!(site.recharge_plane_depth_cm > 0 && site.recharge_plane_depth_cm <= column_depth + 1e-9)) {
      recharge->fail("plane_depth", fmt::format("{} cm is not inside the column (0 to {} cm)",
                                                site.recharge_plane_depth_cm, column_depth));
    }
  }
  read_numerics(root, site);

  site.grid.depth_cm = column_depth;
  auto& faces = site.grid.required_face_depths_cm;
  for (const auto& layer : site.layers) faces.push_back(layer.bottom_depth_cm);
  for (const auto& sensor : site.sensors) {
    if (sensor.depth_cm > 0) faces.push_back(sensor.depth_cm);  // wells and core samples have none
  }
  faces.push_back(site.recharge_plane_depth_cm);
  std::sort(faces.begin(), faces.end());
  faces.erase(std::unique(faces.begin(), faces.end(), [](double a, double b) { return std::abs(a - b) < 1e-9; }),
              faces.end());
  return site;
}

}  // namespace wetfront::site
