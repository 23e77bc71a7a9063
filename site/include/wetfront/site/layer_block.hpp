// One layer's laboratory and field results combined into the TOML block of a site file
// (`wetfront soil layer`), each number with a comment saying where it came from:
//   retention (theta_r, theta_s, alpha, n): a van Genuchten fit of retention points or
//     weighed cores, or the class averages of a texture class;
//   saturated conductivity: the field method the user picks (well permeameter, tension
//     disc) or a value given directly;
//   pore connectivity l: 0.5 (Mualem 1976) unless given.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/field_analysis.hpp"
#include "wetfront/site/lab_analysis.hpp"
#include "wetfront/site/report_table.hpp"

namespace wetfront::site {

// What the layer is made of; the messages of base::InputError name the options of `wetfront soil
// layer` that carry each field.
struct LayerInputs {
  std::string name;
  std::string top;                // depth with unit, "0 cm"
  std::string bottom;             // depth with unit, "30 cm"
  RetentionInputs retention;      // laboratory retention data, or
  std::string texture;            // a texture class
  PermeameterInputs permeameter;  // exactly one of these three gives the conductivity
  InfiltrometerInputs infiltrometer;
  std::string saturated_conductivity;  // value with unit, "25 cm/d"
  double pore_connectivity = 0.5;
  bool pore_connectivity_given = false;
};

struct LayerBlock {
  std::vector<ReportTable> tables;    // the analyses' tables, then the layer's parameters
  std::vector<std::string> warnings;  // of the analyses
  std::string text;                   // the TOML block, first line kLayerBlockMark
};

// The layer's parameters and block. Throws base::InputError for missing, conflicting or invalid
// inputs; the block is checked to read back as TOML.
LayerBlock layer_block(const LayerInputs& inputs);

}  // namespace wetfront::site
