// The simulation record: a solver run together with what is needed to read it later
// (site, calendar origin, program version, inputs actually used, sensors, visits).
//
// Units: cm and days; times are days since run_start_date; depths positive downward;
// fluxes positive downward; evaporation and transpiration positive amounts leaving the soil.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "wetfront/profiles/field_checks.hpp"
#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::profiles {

// One hydraulic parameter of a layer as the run used it.
struct LayerParameter {
  std::string name;  // e.g. "saturated_conductivity"
  double value = 0;
  std::string unit;  // e.g. "cm/d"; "1" for dimensionless
};

struct LayerDescription {
  std::string name;
  double top_depth_cm = 0;
  double bottom_depth_cm = 0;
  std::string model_name;  // e.g. "van Genuchten-Mualem"
  std::vector<LayerParameter> parameters;
};

// An instrument whose readings are compared with the simulation.
struct Sensor {
  std::string name;
  double depth_cm = 0;  // below the soil surface
};

// Surface forcing applied over one interval, constant within it.
struct ForcingInterval {
  double start_day = 0;  // days since the run start
  double end_day = 0;
  double water_input_cm_per_d = 0;  // rain + irrigation reaching the surface
  double potential_evaporation_cm_per_d = 0;
  double potential_transpiration_cm_per_d = 0;
};

// Sensor readings beside the simulated values at their times and depths, and the fit
// metrics, as computed by `wetfront run` (group /sensor_comparison; absent in runs without
// sensor readings). Values are in the unit of their quantity: cm of water for pressure head,
// cm3/cm3 for water content.
struct ComparedReading {
  std::string sensor;
  double time_days = 0;
  double depth_cm = 0;
  double observed = 0;
  double simulated = 0;  // NaN where the run does not cover the reading
  bool used = false;     // false: beyond the working limit or outside the run
};

struct SensorMetrics {
  std::string name;      // a sensor, or "all tensiometers" / "all probes"
  std::string quantity;  // "pressure head" or "water content"
  std::string unit;      // "cm" or "cm3/cm3"
  double depth_cm = 0;   // NaN for a pooled row
  int readings_used = 0;
  int left_out_beyond_working_limit = 0;
  int left_out_outside_run = 0;
  double bias = 0, root_mean_square_error = 0, nash_sutcliffe = 0, kling_gupta = 0;
};

struct SensorComparisonRecord {
  std::vector<ComparedReading> pressure_head;  // cm of water
  std::vector<ComparedReading> water_content;  // cm3/cm3
  std::vector<SensorMetrics> metrics;          // per sensor, then pooled rows
};

struct RunRecord {
  solver::ColumnRun run;
  std::string site_name;
  std::string run_start_date;  // ISO 8601 date or date-time: the zero of every time axis
  std::string program_version;
  std::string input_hash;  // text identifying the inputs (e.g. a hex digest)
  std::string run_id;      // identity of the run, also written in every CSV file of its output set
  std::vector<LayerDescription> layers;
  std::vector<Sensor> sensors;
  std::vector<double> flux_plane_depths_cm;  // one per entry of CumulativeBalance::plane_flux_cm
  std::vector<ForcingInterval> forcing;
  std::vector<double> visit_days;              // field visits, days since the run start, increasing
  std::vector<IntervalBalance> visit_balance;  // balance_between_visits(run.balances, visit_days)
  std::optional<SensorComparisonRecord> sensor_comparison;
  std::optional<DarcyEstimateRecord> darcy_estimate;             // /recharge_estimates/darcy
  std::optional<WaterTableEstimateRecord> water_table_estimate;  // /recharge_estimates/water_table
  std::optional<StoredWaterRecord> stored_water;                 // /stored_water
};

}  // namespace wetfront::profiles
