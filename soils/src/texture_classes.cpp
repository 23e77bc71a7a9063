// Carsel & Parrish (1988), class means of the van Genuchten parameters for the USDA texture
// classes. The source gives Ks in cm/h; the values here are those times 24, rounded to four
// significant figures as they are usually tabulated in cm/d (e.g. sandy loam 4.42 cm/h ->
// 106.1 cm/d).
#include "wetfront/soils/texture_classes.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <stdexcept>
#include <vector>

#include <fmt/format.h>
#include <fmt/ranges.h>
#include "wetfront/base/did_you_mean.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {
namespace {

constexpr double kPoreConnectivity = 0.5;  // Mualem (1976)

constexpr TextureClass make(std::string_view name, double theta_r, double theta_s, double alpha_per_cm, double n,
                            double ks_cm_per_d) {
  return {name, VanGenuchtenMualem{theta_r, theta_s, alpha_per_cm, n, ks_cm_per_d, kPoreConnectivity}};
}

//                                              theta_r theta_s alpha   n     Ks (cm/d)
constexpr std::array<TextureClass, 12> kClasses{{
    make("sand", 0.045, 0.43, 0.145, 2.68, 712.8),
    make("loamy sand", 0.057, 0.41, 0.124, 2.28, 350.2),
    make("sandy loam", 0.065, 0.41, 0.075, 1.89, 106.1),
    make("loam", 0.078, 0.43, 0.036, 1.56, 24.96),
    make("silt", 0.034, 0.46, 0.016, 1.37, 6.00),
    make("silt loam", 0.067, 0.45, 0.020, 1.41, 10.80),
    make("sandy clay loam", 0.100, 0.39, 0.059, 1.48, 31.44),
    make("clay loam", 0.095, 0.41, 0.019, 1.31, 6.24),
    make("silty clay loam", 0.089, 0.43, 0.010, 1.23, 1.68),
    make("sandy clay", 0.100, 0.38, 0.027, 1.23, 2.88),
    make("silty clay", 0.070, 0.36, 0.005, 1.09, 0.48),
    make("clay", 0.068, 0.38, 0.008, 1.09, 4.80),
}};

// Lower case; '_' and '-' become spaces; runs of spaces collapse; ends trimmed.
std::string normalise(std::string_view name) {
  std::string out;
  for (const char raw : name) {
    char c = static_cast<char>(std::tolower(static_cast<unsigned char>(raw)));
    if (c == '_' || c == '-' || std::isspace(static_cast<unsigned char>(c))) c = ' ';
    if (c == ' ' && (out.empty() || out.back() == ' ')) continue;
    out.push_back(c);
  }
  if (!out.empty() && out.back() == ' ') out.pop_back();
  return out;
}

}  // namespace

std::span<const TextureClass> texture_classes() { return kClasses; }

std::optional<VanGenuchtenMualem> find_texture_class(std::string_view name) {
  const std::string key = normalise(name);
  for (const auto& c : kClasses)
    if (c.name == key) return c.parameters;
  return std::nullopt;
}

std::optional<std::string_view> closest_texture_class_name(std::string_view name) {
  const std::string key = normalise(name);
  std::optional<std::string_view> best;
  std::size_t best_distance = 0;
  for (const auto& c : kClasses) {
    const std::size_t d = base::edit_distance(key, c.name);
    if (!best || d < best_distance) {
      best = c.name;
      best_distance = d;
    }
  }
  // Accept roughly one typo per four letters, at least two.
  const std::size_t allowed = std::max<std::size_t>(2, key.size() / 4);
  if (best && best_distance <= allowed) return best;
  return std::nullopt;
}

VanGenuchtenMualem texture_class_parameters(std::string_view name) {
  if (auto found = find_texture_class(name)) return *found;
  std::vector<std::string_view> names;
  for (const auto& c : kClasses) names.push_back(c.name);
  const auto suggestion = closest_texture_class_name(name);
  throw base::InputError(fmt::format("unknown soil texture class '{}'{}; valid names are: {}", name,
                                     suggestion ? fmt::format(" (did you mean '{}'?)", *suggestion) : "",
                                     fmt::join(names, ", ")));
}

}  // namespace wetfront::soils
