#include "sample_record.hpp"

#include <cmath>
#include <limits>

#include "wetfront/profiles/layer_table.hpp"
#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/soils/layers.hpp"

namespace wetfront::profiles::testing {

namespace {

// Invented parameters in the range of a loam over a sandy loam (not fitted to any data).
soils::LayeredProfile sample_soil() {
  soils::VanGenuchtenMualem loam{0.078, 0.43, 0.036, 1.56, 24.96, 0.5};
  soils::VanGenuchtenMualem sandy_loam{0.065, 0.41, 0.075, 1.89, 106.1, 0.5};
  return soils::LayeredProfile({{"loam topsoil", 0.0, 40.0, loam}, {"sandy loam subsoil", 40.0, 100.0, sandy_loam}});
}

// A smooth front: -150 cm far below, -20 cm behind a front at 3 cm/d.
double head_at(double depth_cm, double day) {
  const double front_cm = 3.0 * day;
  return -150.0 + 130.0 / (1.0 + std::exp((depth_cm - front_cm) / 6.0));
}

}  // namespace

RunRecord sample_record() {
  const soils::LayeredProfile soil = sample_soil();
  RunRecord record;
  record.site_name = "Example plot 3 (invented)";
  record.run_start_date = "2025-04-01";
  record.program_version = "0.1.0-test";
  record.input_hash = "sha256:0123456789abcdef";
  record.layers = describe_layers(soil);
  record.sensors = {{"tensiometer 15 cm", 15.0}, {"tensiometer 45 cm", 45.0}, {"probe 70 cm", 70.0}};
  record.flux_plane_depths_cm = {50.0};

  solver::ColumnRun& run = record.run;
  const std::size_t cells = 20;
  const double thickness_cm = 5.0;
  for (std::size_t f = 0; f <= cells; ++f) run.face_depths_cm.push_back(thickness_cm * static_cast<double>(f));
  for (std::size_t c = 0; c < cells; ++c) run.cell_depths_cm.push_back(thickness_cm * (static_cast<double>(c) + 0.5));

  double initial_storage_cm = 0;
  for (int day = 0; day <= 30; ++day) {
    solver::ProfileSnapshot snapshot;
    snapshot.time_days = day;
    double storage_cm = 0;
    for (double depth : run.cell_depths_cm) {
      const soils::HydraulicModel& model = soil.model_at(depth);
      const double head = head_at(depth, day);
      snapshot.head_cm.push_back(head);
      snapshot.water_content.push_back(soils::water_content(model, head));
      snapshot.conductivity_cm_per_d.push_back(soils::conductivity(model, head));
      snapshot.sink_rate_per_day.push_back(depth < 30.0 ? 0.002 : 0.0);
      storage_cm += snapshot.water_content.back() * thickness_cm;
    }
    for (double depth : run.face_depths_cm)
      snapshot.face_flux_cm_per_d.push_back(0.8 / (1.0 + std::exp((depth - 3.0 * day) / 6.0)) - 0.05);
    snapshot.ponded_depth_cm = day == 10 ? 0.25 : 0.0;
    if (day == 0) initial_storage_cm = storage_cm;

    solver::CumulativeBalance balance;
    balance.time_days = day;
    // Amounts chosen so the column balance closes: infiltration = storage change +
    // transpiration + bottom flux, and water input = infiltration + evaporation + runoff.
    balance.transpiration_cm = 0.06 * day;
    balance.bottom_flux_cm = 0.01 * day * day / 30.0;
    balance.infiltration_cm = (storage_cm - initial_storage_cm) + balance.transpiration_cm + balance.bottom_flux_cm;
    balance.potential_evaporation_cm = 0.3 * day;
    balance.actual_evaporation_cm = 0.2 * day;
    balance.runoff_cm = day > 10 ? 0.1 : 0.0;
    balance.water_input_cm = balance.infiltration_cm + balance.actual_evaporation_cm + balance.runoff_cm;
    balance.plane_flux_cm = {0.05 * day};
    balance.ponded_depth_cm = snapshot.ponded_depth_cm;
    balance.soil_storage_cm = storage_cm;
    balance.balance_error_cm = (storage_cm - initial_storage_cm) -
                               (balance.infiltration_cm - balance.transpiration_cm - balance.bottom_flux_cm);  // ~1e-15
    run.profiles.push_back(std::move(snapshot));
    run.balances.push_back(std::move(balance));
  }
  run.statistics = {412, 1650, 37, 1203, 2, 15, 3, 0};
  run.complete = true;

  for (int day = 0; day < 30; ++day) {
    const double rain = day % 6 == 2 ? 2.5 : 0.0;
    record.forcing.push_back({static_cast<double>(day), day + 1.0, rain, 0.3 + 0.01 * day, 0.06 + 0.002 * day});
  }
  record.visit_days = {7.0, 14.0, 21.0};
  record.visit_balance = balance_between_visits(run.balances, record.visit_days);

  // Invented sensor comparison: two tensiometer readings (one beyond the run, simulated NaN)
  // and one probe reading, with a metrics row per sensor and a pooled row (depth NaN).
  const double nan = std::numeric_limits<double>::quiet_NaN();
  SensorComparisonRecord comparison;
  comparison.pressure_head = {{"tensiometer 15 cm", 7.375, 15.0, -120.5, -118.25, true},
                              {"tensiometer 15 cm", 31.0, 15.0, -130.0, nan, false}};
  comparison.water_content = {{"probe 70 cm", 7.375, 70.0, 0.305, 0.2975, true}};
  comparison.metrics = {{"tensiometer 15 cm", "pressure head", "cm", 15.0, 1, 0, 1, 2.25, 2.25, nan, nan},
                        {"probe 70 cm", "water content", "cm3/cm3", 70.0, 1, 0, 0, -0.0075, 0.0075, nan, nan},
                        {"all tensiometers", "pressure head", "cm", nan, 1, 0, 1, 2.25, 2.25, nan, nan}};
  record.sensor_comparison = comparison;

  // Invented field checks over the four visit intervals (0-7, 7-14, 14-21, 21-29 d): a Darcy
  // estimate missing for the first interval, a water table read at every visit, stored water
  // missing at the run start. The Darcy amounts, the stored water and every agreement text are
  // arbitrary numbers and words for the round trip. The water-table amounts follow the record's
  // own specific yield (0.15) and recession rate (0.2 cm/d), R = Sy (start + rate x days - end)
  // (Healy & Cook 2002): 0.15 x (310 + 1.4 - 305.5) = 0.885, 0.15 x (305.5 + 1.4 - 306) = 0.135,
  // 0.15 x (306 + 1.4 - 307) = 0.06, 0.15 x (307 + 1.6 - 304) = 0.69 cm.
  record.darcy_estimate = DarcyEstimateRecord{"tensiometer 15 cm",
                                              "tensiometer 70 cm",
                                              15.0,
                                              70.0,
                                              "K from the hydraulic model of layer 'sandy loam subsoil'",
                                              {nan, 0.12, 0.0, -0.03},
                                              {"no estimate", "agree", "agree", "differ"},
                                              {"no reliable reading of both within 1 d of a visit", "", "", ""}};
  record.water_table_estimate = WaterTableEstimateRecord{"well A",
                                                         0.15,
                                                         0.2,
                                                         "invented value for the sample",
                                                         {310.0, 305.5, 306.0, 307.0},
                                                         {305.5, 306.0, 307.0, 304.0},
                                                         {0.885, 0.135, 0.06, 0.69},
                                                         {"agree", "agree", "differ", "differ"},
                                                         {"", "", "", ""}};
  record.stored_water = StoredWaterRecord{{15.0, 40.0, 70.0},
                                          {"probe 15 cm", "probe 40 cm", "probe 70 cm", "cores"},
                                          {0.0, 7.0, 14.0, 21.0, 29.0},
                                          {nan, 18.5, 18.25, 17.75, 18.0},
                                          {nan, 18.0, 18.125, 17.5, 17.5},
                                          {nan, -0.25, -0.5, 0.25},
                                          {nan, 0.125, -0.625, 0.0}};
  return record;
}

RunRecord sample_failed_record() {
  RunRecord record = sample_record();
  solver::ColumnRun& run = record.run;
  run.profiles.resize(13);  // days 0..12 reached
  run.balances.resize(13);
  run.complete = false;
  run.failure = solver::RunFailure{12.5, 37.5, "nonlinear solver did not converge after 10 step reductions"};
  record.visit_balance = balance_between_visits(run.balances, record.visit_days);
  // The field checks follow the intervals reached; this sample keeps none.
  record.darcy_estimate.reset();
  record.water_table_estimate.reset();
  record.stored_water.reset();
  return record;
}

}  // namespace wetfront::profiles::testing
