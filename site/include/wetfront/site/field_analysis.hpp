// Field conductivity analyses run from CSV files: shared by `wetfront soil permeameter`,
// `wetfront soil infiltrometer` and `wetfront soil layer`.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/report_table.hpp"
#include "wetfront/soils/steady_rate.hpp"

namespace wetfront::site {

struct PermeameterInputs {
  std::string file;
  std::string well_radius = "";     // text with unit, e.g. "3 cm"
  std::string reservoir_area = "";  // text with unit, e.g. "35.3 cm2"
  std::string soil_category = "structured";
  bool single_head_only = false;
  soils::SteadinessTolerances tolerances;
};

struct InfiltrometerInputs {
  std::string file;
  std::string disc_radius = "";  // e.g. "10 cm"
  std::string tower_area = "";   // e.g. "20 cm2"
  soils::SteadinessTolerances tolerances;
};

// What a field analysis found: tables for the report, the conductivity to use, a one-line
// statement of where it came from, and warnings for the user.
struct FieldReport {
  std::vector<ReportTable> tables;  // the last one is the results table written by --csv
  double saturated_conductivity_cm_per_d = 0.0;
  std::string provenance;
  std::vector<std::string> warnings;
};

FieldReport analyse_permeameter(const PermeameterInputs& inputs);
FieldReport analyse_infiltrometer(const InfiltrometerInputs& inputs);

}  // namespace wetfront::site
