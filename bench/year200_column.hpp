// The fixed benchmark column of year200-column.md: 200 cm, 200 cells, sandy loam over loam,
// a year of daily surface fluxes with a dry limit of -15000 cm.
#pragma once

#include <fstream>
#include <stdexcept>
#include <string>

#include "wetfront/solver/column_run.hpp"

namespace wetfront::bench {

inline solver::ColumnProblem year200_column(const std::string& flux_csv) {
  // Carsel & Parrish (1988) class averages, as listed in year200-column.md.
  const soils::VanGenuchtenMualem sandy_loam{0.065, 0.41, 0.075, 1.89, 106.1, 0.5};
  const soils::VanGenuchtenMualem loam{0.078, 0.43, 0.036, 1.56, 24.96, 0.5};
  soils::LayeredProfile soil({{"sandy loam", 0, 60, sandy_loam}, {"loam", 60, 200, loam}});
  solver::ColumnProblem problem{.soil = soil, .grid = solver::uniform_grid(200.0, 200)};

  std::ifstream in(flux_csv);
  if (!in) throw std::runtime_error("cannot open " + flux_csv);
  std::string line;
  std::getline(in, line);  // header: day,surface_flux_cm_per_d
  solver::StepSeries input, evaporation;
  while (std::getline(in, line)) {
    const auto comma = line.find(',');
    const double day = std::stod(line.substr(0, comma));
    const double flux = std::stod(line.substr(comma + 1));
    input.start_days.push_back(day);
    input.values.push_back(flux > 0 ? flux : 0.0);
    evaporation.start_days.push_back(day);
    evaporation.values.push_back(flux < 0 ? -flux : 0.0);
  }
  problem.top = solver::LimitedFlux{input, evaporation, -15000.0, 0.0};
  problem.bottom = solver::FixedHead{-50.0};
  problem.initial = solver::Hydrostatic{250.0};
  problem.start_day = 0.0;
  problem.end_day = 365.0;
  for (int day = 0; day <= 365; ++day) problem.output_days.push_back(day);
  return problem;
}

}  // namespace wetfront::bench
