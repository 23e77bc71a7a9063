// The fixed benchmark column of year200-column.md: 200 cm, 200 cells, sandy loam over loam,
// a year of daily surface fluxes with a dry limit of -15000 cm.
#pragma once

#include <array>
#include <cmath>
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
  // The arithmetic face mean of the Picard scheme, so that both schemes solve the same equations.
  problem.face_conductivity = solver::FaceConductivity::arithmetic;

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

// Daily heads at 10, 30, 60, 100 and 150 cm, linear between cell centres (on 1 cm cells the mean
// of the two cells beside the face at that depth), on any grid.
inline constexpr std::array<int, 5> year200_report_depths_cm = {10, 30, 60, 100, 150};
using DailyHeads = std::vector<std::array<double, 5>>;

inline DailyHeads daily_heads(const solver::ColumnRun& run) {
  DailyHeads rows;
  const auto& z = run.cell_depths_cm;
  for (const auto& p : run.profiles) {
    std::array<double, 5> row{};
    for (std::size_t k = 0; k < row.size(); ++k) {
      const double d = year200_report_depths_cm[k];
      std::size_t i = 1;
      while (i + 1 < z.size() && z[i] < d) ++i;
      const double f = (d - z[i - 1]) / (z[i] - z[i - 1]);
      row[k] = (1 - f) * p.head_cm[i - 1] + f * p.head_cm[i];
    }
    rows.push_back(row);
  }
  return rows;
}

// Root-mean-square difference over all days and depths (cm).
inline double rms_difference(const DailyHeads& a, const DailyHeads& b) {
  if (a.size() != b.size()) throw std::invalid_argument("daily head tables differ in length");
  double sum = 0;
  for (std::size_t i = 0; i < a.size(); ++i)
    for (std::size_t k = 0; k < a[i].size(); ++k) sum += (a[i][k] - b[i][k]) * (a[i][k] - b[i][k]);
  return std::sqrt(sum / static_cast<double>(a.size() * a.front().size()));
}

// Settings of the tight-tolerance reference run that time-stepping errors are measured against.
inline solver::SolverSettings tight_settings() {
  solver::SolverSettings s;
  s.relative_tolerance = 1e-8;
  s.absolute_tolerance_storage_cm = 1e-11;
  s.nonlinear_convergence_factor = 0.01;
  s.max_step_days = 0.05;
  s.max_steps_per_day = 1000000;
  return s;
}

}  // namespace wetfront::bench
