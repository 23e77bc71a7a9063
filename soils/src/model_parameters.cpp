#include "wetfront/soils/model_parameters.hpp"

#include <algorithm>
#include <array>
#include <type_traits>
#include <utility>
#include <variant>

namespace wetfront::soils {
namespace {

// Each parameter once; the tables below list them per model.
constexpr ModelParameter kResidual{"residual_water_content", "cm3/cm3", "theta_r"};
constexpr ModelParameter kSaturated{"saturated_water_content", "cm3/cm3", "theta_s"};
constexpr ModelParameter kAlpha{"alpha", "1/cm", "alpha"};
constexpr ModelParameter kShape{"n", "1", "n"};
constexpr ModelParameter kConductivity{"saturated_conductivity", "cm/d", "Ks"};
constexpr ModelParameter kConnectivity{"pore_connectivity", "1", "l", true};
constexpr ModelParameter kAirEntryHead{"air_entry_head", "cm", "h_e"};
constexpr ModelParameter kBubblingHead{"bubbling_head", "cm", "h_b"};
constexpr ModelParameter kPoreSizeIndex{"pore_size_index", "1", "lambda"};
constexpr ModelParameter kSorptiveNumber{"sorptive_number", "1/cm", "a"};

constexpr std::array kVanGenuchten = {kResidual, kSaturated, kAlpha, kShape, kConductivity, kConnectivity};
constexpr std::array kAirEntry = {kResidual, kSaturated, kAlpha, kShape, kConductivity, kConnectivity, kAirEntryHead};
constexpr std::array kBrooksCorey = {kResidual, kSaturated, kBubblingHead, kPoreSizeIndex, kConductivity};
constexpr std::array kGardner = {kResidual, kSaturated, kSorptiveNumber, kConductivity};

// Per model, in the order of HydraulicModel: its parameters, published name and site-file name.
constexpr std::array<std::span<const ModelParameter>, 4> kParameters = {kVanGenuchten, kAirEntry, kBrooksCorey,
                                                                        kGardner};
constexpr std::array<std::string_view, 4> kNames = {"van Genuchten-Mualem", "van Genuchten-Mualem with air-entry head",
                                                    "Brooks-Corey-Burdine", "Gardner exponential"};
constexpr std::array<std::string_view, 4> kKeys = {"van genuchten", "van genuchten air entry", "brooks corey",
                                                   "gardner"};
static_assert(kParameters.size() == std::variant_size_v<HydraulicModel> &&
                  kNames.size() == std::variant_size_v<HydraulicModel> &&
                  kKeys.size() == std::variant_size_v<HydraulicModel>,
              "every model in HydraulicModel needs its parameters, name and key here");

template <std::size_t... I>
std::vector<HydraulicModel> default_models(std::index_sequence<I...>) {
  return {HydraulicModel(std::in_place_index<I>)...};
}

// Each model's values in the order of its parameter table above.
std::array<double*, 6> values_of(VanGenuchtenMualem& m) {
  return {&m.residual_water_content, &m.saturated_water_content,        &m.alpha_per_cm,
          &m.n,                      &m.saturated_conductivity_cm_per_d, &m.pore_connectivity};
}
std::array<double*, 7> values_of(VanGenuchtenAirEntry& m) {
  const auto base = values_of(m.base);
  return {base[0], base[1], base[2], base[3], base[4], base[5], &m.air_entry_head_cm};
}
std::array<double*, 5> values_of(BrooksCorey& m) {
  return {&m.residual_water_content, &m.saturated_water_content, &m.bubbling_head_cm, &m.pore_size_index,
          &m.saturated_conductivity_cm_per_d};
}
std::array<double*, 4> values_of(GardnerExponential& m) {
  return {&m.residual_water_content, &m.saturated_water_content, &m.sorptive_number_per_cm,
          &m.saturated_conductivity_cm_per_d};
}
static_assert(std::tuple_size_v<decltype(values_of(std::declval<VanGenuchtenMualem&>()))> == kVanGenuchten.size() &&
                  std::tuple_size_v<decltype(values_of(std::declval<VanGenuchtenAirEntry&>()))> == kAirEntry.size() &&
                  std::tuple_size_v<decltype(values_of(std::declval<BrooksCorey&>()))> == kBrooksCorey.size() &&
                  std::tuple_size_v<decltype(values_of(std::declval<GardnerExponential&>()))> == kGardner.size(),
              "values_of lists one value per parameter of the model's table");

}  // namespace

std::string_view model_name(const HydraulicModel& model) { return kNames[model.index()]; }

std::string_view model_key(const HydraulicModel& model) { return kKeys[model.index()]; }

std::vector<HydraulicModel> all_models() {
  return default_models(std::make_index_sequence<std::variant_size_v<HydraulicModel>>());
}

std::optional<base::Dimension> parameter_dimension(const ModelParameter& parameter) {
  for (const auto dimension : {base::Dimension::water_content, base::Dimension::inverse_length,
                               base::Dimension::conductivity, base::Dimension::pressure_head}) {
    if (parameter.unit == base::internal_unit(dimension)) return dimension;
  }
  return std::nullopt;
}

std::span<const ModelParameter> model_parameters(const HydraulicModel& model) { return kParameters[model.index()]; }

std::vector<std::string_view> all_parameter_keys() {
  std::vector<std::string_view> keys;
  for (const auto& model : all_models()) {
    for (const auto& p : model_parameters(model))
      if (std::find(keys.begin(), keys.end(), p.key) == keys.end()) keys.push_back(p.key);
  }
  return keys;
}

double* parameter_value(HydraulicModel& model, std::string_view key) {
  const auto parameters = kParameters[model.index()];
  return std::visit(
      [&](auto& m) -> double* {
        const auto values = values_of(m);
        for (std::size_t i = 0; i < parameters.size(); ++i)
          if (parameters[i].key == key) return values[i];
        return nullptr;
      },
      model);
}

const double* parameter_value(const HydraulicModel& model, std::string_view key) {
  return parameter_value(const_cast<HydraulicModel&>(model), key);
}

double full_saturation_head(const HydraulicModel& model) {
  if (const auto* air_entry = std::get_if<VanGenuchtenAirEntry>(&model)) return air_entry->air_entry_head_cm;
  if (const auto* brooks_corey = std::get_if<BrooksCorey>(&model)) return brooks_corey->bubbling_head_cm;
  return 0.0;
}

}  // namespace wetfront::soils
