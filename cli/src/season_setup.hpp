// From a loaded site to a runnable season: reads the field records (rain, irrigation, pan),
// builds the surface demand and the column problem, and packs a finished run into the
// record written to HDF5.
#pragma once

#include <string>
#include <vector>

#include "sensor_readings.hpp"
#include "site_file.hpp"
#include "wetfront/forcing/surface_demand.hpp"
#include "wetfront/profiles/run_record.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::cli {

// Depth totals of the field records over the run, cm.
struct ForcingTotals {
  double rain_cm = 0;
  double irrigation_cm = 0;
  double pan_evaporation_cm = 0;
  double potential_transpiration_cm = 0;
};

struct Season {
  SiteSetup site;
  double pan_coefficient = 0;
  forcing::SurfaceDemand demand;
  solver::ColumnProblem problem;
  ForcingTotals totals;
  bool roots_simulated = false;       // root water uptake taken from the soil
  std::vector<std::string> notes;     // gaps filled, run shortened, ...
  std::string input_hash;             // hex digest of the site file and every file it names
  std::vector<SensorRecord> sensor_readings;  // converted; their times are among the output times
};

// Reads the field records named by the site and builds the problem. Throws InputError naming
// the CSV file and line (or the site file and key) for bad or missing records.
Season prepare_season(SiteSetup site);

// The record of a run of this season, with the per-visit balance.
profiles::RunRecord make_record(const Season& season, solver::ColumnRun run, const std::string& program_version);

}  // namespace wetfront::cli
