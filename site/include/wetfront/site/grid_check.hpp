// Is the site's grid fine enough? The season runs again on cells of half the size, and the
// change of season recharge and of each sensor's simulated values says whether the answer
// still depends on the grid (a refinement check, as in any convergence study: halve the cells
// and compare).
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/run_season.hpp"
#include "wetfront/solver/grid.hpp"

namespace wetfront::site {

// Limits of this check, our own choice: the recharge changes by less than 1 %, the heads at
// each tensiometer by less than 5 cm RMS (about the reading noise of a field tensiometer,
// common practice), the water contents at each probe by less than 0.01 cm3/cm3 RMS (the
// accuracy usually quoted for a calibrated probe, common practice).
inline constexpr double kGridRechargeLimit = 0.01;
inline constexpr double kGridHeadLimitCm = 5.0;
inline constexpr double kGridWaterContentLimit = 0.01;

struct SensorGridChange {
  std::string name;
  std::string quantity;  // "pressure head" or "water content"
  std::string unit;      // "cm" or "cm3/cm3"
  int readings = 0;      // readings the fit uses that both runs simulate
  double rms_change = 0;
  double largest_change = 0;
  bool too_coarse = false;
};

struct GridCheck {
  std::size_t cells = 0, finer_cells = 0;
  bool finer_complete = true;
  std::string finer_failure;  // why the finer run stopped, when it did
  double recharge_cm = 0;     // at the recharge plane over the run, positive down
  double finer_recharge_cm = 0;
  double recharge_change = 0;  // relative: (finer - this) / |finer|
  bool recharge_too_coarse = false;
  std::vector<SensorGridChange> sensors;
  bool too_coarse() const;
};

// The same request with every cell of the grid it builds cut in two: exactly half the cell
// size everywhere, the same kept faces and the same grading.
solver::GridRequest halved(const solver::GridRequest& request);

// Runs `site` on the halved grid and compares it with `result`, a run of the same site.
GridCheck check_grid(const SiteSetup& site, const SeasonResult& result, const std::string& program_version,
                     const Simulate& simulate = {});

}  // namespace wetfront::site
