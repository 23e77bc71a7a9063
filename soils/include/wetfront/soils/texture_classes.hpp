// Class-average van Genuchten-Mualem parameters for the twelve USDA soil texture classes,
// from Carsel & Parrish (1988, Water Resources Research 24(5):755-769), for sites where only
// the texture class is known. Units as in hydraulic_models.hpp: alpha in 1/cm, Ks in cm/d.
#pragma once

#include <optional>
#include <span>
#include <string>
#include <string_view>

#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

struct TextureClass {
  std::string_view name;          // plain lower-case class name, e.g. "silty clay loam"
  VanGenuchtenMualem parameters;  // pore_connectivity l = 0.5 (Mualem 1976)
};

// The twelve classes, from coarse to fine, in the order of the source table.
std::span<const TextureClass> texture_classes();

// Case-insensitive lookup; underscores, hyphens and repeated spaces count as one space,
// so "Sandy_Loam" and "sandy  loam" both find "sandy loam". Empty when the name is unknown.
std::optional<VanGenuchtenMualem> find_texture_class(std::string_view name);

// As find_texture_class, but an unknown name throws base::InputError whose message
// lists the valid names and, when one is close, suggests it ("did you mean 'loam'?").
VanGenuchtenMualem texture_class_parameters(std::string_view name);

// Closest valid class name by edit distance, if within a small distance; empty otherwise.
std::optional<std::string_view> closest_texture_class_name(std::string_view name);

}  // namespace wetfront::soils
