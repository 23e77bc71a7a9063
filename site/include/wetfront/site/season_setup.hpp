// From a loaded site to a runnable season: reads the field records (rain, irrigation, pan),
// builds the surface demand and the column problem, and packs a finished run into the
// record written to HDF5.
#pragma once

#include <string>
#include <vector>

#include "wetfront/site/sensor_readings.hpp"
#include "wetfront/site/site_file.hpp"
#include "wetfront/forcing/depth_series.hpp"
#include "wetfront/forcing/surface_demand.hpp"
#include "wetfront/profiles/run_record.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {

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
  bool roots_simulated = false;               // root water uptake taken from the soil
  std::vector<std::string> notes;             // gaps filled, run shortened, ...
  std::string input_hash;                     // hex digest of the site file and every file it names
  std::vector<SensorRecord> sensor_readings;  // converted; their times are among the output times
};

// The field records of a site, read and converted once: several seasons that differ only in
// soil, crop or boundary values (a parameter sweep) share them.
struct FieldRecords {
  std::vector<forcing::CoveredSeries> water_inputs_cm_per_day;  // rain, then irrigation
  forcing::CoveredSeries pan_evaporation_cm_per_day;
  ForcingTotals totals;            // rain, irrigation and pan totals (no transpiration yet)
  std::vector<std::string> notes;  // gaps filled, records that stop early
  std::string input_hash;
  std::vector<SensorRecord> sensor_readings;
};

// Reads the field records named by the site. Throws base::InputError naming the CSV file and line
// (or the site file and key) for bad or missing records.
FieldRecords read_field_records(const SiteSetup& site);

// Builds the season from the site's values and its records; reads no files. Throws base::InputError
// naming the site file for values the libraries reject.
Season build_season(SiteSetup site, const FieldRecords& records);

// read_field_records then build_season.
Season prepare_season(SiteSetup site);

// The record of a run of this season, with the per-visit balance.
profiles::RunRecord make_record(const Season& season, solver::ColumnRun run, const std::string& program_version);

}  // namespace wetfront::site
