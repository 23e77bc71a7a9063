// Water balance of a sand / loam / clay column under alternating heavy rain and dry spells
// above a water table. The stored water of each cell is a differential state and the boundary
// fluxes are integrated by the same BDF formula, so storage change and cumulative net inflow
// agree to the accuracy of the nonlinear solve (common practice: a linear multistep method
// preserves linear invariants).
#include <fmt/format.h>
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <variant>

#include "solver_test_soils.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::solver_tests {
namespace {

// Rain (cm/d) in bursts; potential evaporation (cm/d) between them. Invented forcing.
solver::StepSeries rain() {
  return {{0.0, 2.0, 10.0, 11.0, 25.0, 28.0, 45.0, 46.0}, {8.0, 0.0, 12.0, 0.0, 5.0, 0.0, 15.0, 0.0}};
}
solver::StepSeries potential_evaporation() {
  return {{0.0, 2.0, 10.0, 11.0, 25.0, 28.0, 45.0, 46.0}, {0.0, 0.6, 0.0, 0.8, 0.0, 0.7, 0.0, 0.9}};
}

solver::ColumnProblem rain_and_dry_spells(solver::FaceConductivity face, soils::HydraulicModel clay_model = clay()) {
  solver::GridRequest request;
  request.depth_cm = 150.0;
  request.required_face_depths_cm = {30.0, 70.0};
  solver::ColumnProblem problem = make_column(sand_loam_clay(std::move(clay_model)), solver::graded_grid(request));
  problem.top = solver::LimitedFlux{rain(), potential_evaporation(), -15000.0, 0.0};
  // Water table 50 cm below the column (bottom head -50 cm). With the table at the column
  // bottom the clay (n = 1.09) would sit within a fraction of a centimetre of saturation,
  // where its Mualem conductivity changes by half within 1e-4 cm of head (see
  // HardCases.FineClayWithAirEntryWettedNearSaturation for that regime).
  problem.bottom = solver::FixedHead{-50.0};
  problem.initial = solver::Hydrostatic{200.0};
  problem.face_conductivity = face;
  problem.end_day = 60.0;
  for (int day = 0; day <= 60; ++day) problem.output_days.push_back(day);
  // A day of this forcing needs a few hundred steps (a few thousand while water perches on the
  // clay); a run that needs 20000 a day has stalled and should say so.
  problem.settings.max_steps_per_day = 20000;
  return problem;
}

void expect_balanced(const solver::ColumnRun& run, const solver::ColumnProblem& problem, bool water_enters = true) {
  ASSERT_TRUE(run.complete) << (run.failure ? run.failure->reason : "");
  ASSERT_EQ(run.balances.size(), problem.output_days.size());
  const double initial_storage = run.balances.front().soil_storage_cm;
  double worst_relative = 0.0;
  double worst_day = 0.0;
  for (const auto& b : run.balances) {
    const double storage_change = b.soil_storage_cm - initial_storage;
    const double net_inflow = b.infiltration_cm - b.transpiration_cm - b.bottom_flux_cm;
    const double turnover = b.water_input_cm + b.actual_evaporation_cm + std::abs(b.bottom_flux_cm) + b.transpiration_cm;
    if (turnover == 0.0) continue;
    const double relative = std::abs(storage_change - net_inflow) / turnover;
    if (relative > worst_relative) {
      worst_relative = relative;
      worst_day = b.time_days;
    }
    // The surface account: what reached the soil is rain less evaporation, runoff and ponding.
    EXPECT_NEAR(b.infiltration_cm, b.water_input_cm - b.actual_evaporation_cm - b.runoff_cm - b.ponded_depth_cm,
                1e-6 * turnover)
        << "day " << b.time_days;
    EXPECT_NEAR(b.balance_error_cm, storage_change - net_inflow + b.ponded_depth_cm -
                                        (b.infiltration_cm - (b.water_input_cm - b.actual_evaporation_cm -
                                                              b.runoff_cm)),
                1e-9 * (1.0 + turnover))
        << "reported balance error, day " << b.time_days;
    // Rain is delivered as given.
    EXPECT_NEAR(b.water_input_cm, rain().integral(0.0, b.time_days), 1e-9 * (1.0 + b.water_input_cm));
  }
  // The stored water is the water content plus the specific-storage term relative to the head
  // h_s at which each soil saturates (0, or the air-entry head), in full above h_s and fading as
  // exp((h - h_s)/w), w = 1 cm, below it (solver/src/column_model.cpp):
  // S = sum dz (theta + Ss e(h - h_s)), e(u) = u + w for u >= 0, w exp(u/w) for u < 0.
  for (std::size_t k = 0; k < run.profiles.size(); ++k) {
    double from_profile = 0.0;
    for (std::size_t i = 0; i < run.cell_depths_cm.size(); ++i) {
      const auto& model = problem.soil.model_at(run.cell_depths_cm[i]);
      const auto* air_entry = std::get_if<soils::VanGenuchtenAirEntry>(&model);
      const double saturation_head = air_entry ? air_entry->air_entry_head_cm : 0.0;
      const double u = run.profiles[k].head_cm[i] - saturation_head;
      const double excess = u >= 0 ? u + 1.0 : std::exp(u);
      from_profile += (run.profiles[k].water_content[i] + problem.specific_storage_per_cm * excess) *
                      (run.face_depths_cm[i + 1] - run.face_depths_cm[i]);
    }
    EXPECT_NEAR(run.balances[k].soil_storage_cm, from_profile, 1e-6) << "day " << run.balances[k].time_days;
  }
  EXPECT_LT(worst_relative, 1e-6) << "|storage change - net inflow| / turnover, worst on day " << worst_day;
  const auto& last = run.balances.back();
  SCOPED_TRACE(
      fmt::format("60 days: rain {:.3f}, evaporation {:.3f} (potential {:.3f}), runoff {:.3f}, bottom {:.3f}, storage "
                  "change {:.4f} cm; "
                  "worst |dS - net in| / turnover = {:.2e}; {} steps, {} surface switches",
                  last.water_input_cm, last.actual_evaporation_cm, last.potential_evaporation_cm, last.runoff_cm,
                  last.bottom_flux_cm, last.soil_storage_cm - initial_storage, worst_relative, run.statistics.steps,
                  run.statistics.surface_switches));
  // Something happened: the column took in water and lost some of it again.
  if (water_enters) {
    EXPECT_GT(last.infiltration_cm, 10.0);
  }
  EXPECT_GT(last.actual_evaporation_cm, 1.0);
}

TEST(LayeredWaterBalance, RainAndDrySpellsOverAWaterTableConserveWater) {
  // The clay carries an air-entry head (Ippisch, Vogel & Bastian 2006): water perches on it
  // at saturation, where the plain model's K slope is unbounded for n = 1.09 (the documented
  // limit in hard_cases_test.cpp and DEVELOPERS.md).
  const solver::ColumnProblem problem = rain_and_dry_spells(solver::FaceConductivity::arithmetic, clay_with_air_entry());
  expect_balanced(solver::simulate(problem), problem);
}

TEST(LayeredWaterBalance, ConservesWaterWithTheHarmonicMeanToo) {
  // The harmonic mean at the dry sand/loam interface lets almost nothing through, so the sand
  // fills and the rain runs off (the front hold-back Belfort & Lehmann 2005 describe; see
  // face_conductivity_interface_test.cpp): the balance must close all the same.
  const solver::ColumnProblem problem = rain_and_dry_spells(solver::FaceConductivity::harmonic, clay_with_air_entry());
  expect_balanced(solver::simulate(problem), problem, /*water_enters=*/false);
}


}  // namespace
}  // namespace wetfront::solver_tests
