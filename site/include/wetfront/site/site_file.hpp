// The site file: one TOML file describing a plot, its soil, crop, field records and how to
// run the season. load_site_file() turns it into plain values for the libraries; every key,
// unit and default is documented in docs/site-file.md.
//
// Units inside: cm, days, cm of water; times are days since the run start.
#pragma once

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "wetfront/forcing/canopy_split.hpp"
#include "wetfront/forcing/crop_coefficient.hpp"
#include "wetfront/forcing/dated_table.hpp"
#include "wetfront/forcing/depth_series.hpp"
#include "wetfront/forcing/pan_coefficient.hpp"
#include "wetfront/base/time_point.hpp"
#include "wetfront/soils/layers.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/grid.hpp"
#include "wetfront/solver/root_uptake.hpp"

namespace wetfront::site {

// A forcing CSV named in the site file, resolved against the site file's folder.
struct ForcingFile {
  std::filesystem::path path;
  forcing::GapPolicy gaps = forcing::GapPolicy::error;
  std::size_t line = 0;  // line of the key in the site file, for messages
  std::string key;       // e.g. "weather.rain"
};

// Where potential evaporation comes from: Class A pan hook-gauge readings or daily pan
// evaporation depths, and the pan coefficient Kp (ETo = Kp Epan, FAO-56 eq. 55).
struct PanSetup {
  std::optional<ForcingFile> readings;           // hook-gauge readings
  std::optional<ForcingFile> daily_evaporation;  // pan evaporation depths
  forcing::PanCoefficientChoice coefficient;
};

struct CropSetup {
  std::string name;
  forcing::CropCoefficientCurve kc_curve;  // planting_day in days since run start
  forcing::CanopySplit split;
  forcing::DatedTable root_depth_cm = forcing::DatedTable::constant("root depth", 0.0);
  std::string uptake_response_name;  // Feddes parameter set, e.g. "maize"
  solver::FeddesResponse uptake_response;
  solver::RootDistribution root_shape = solver::UniformRoots{};
};

struct SensorSetup {
  std::string name;
  // "tensiometer", "water content probe", "observation well" (depths to the water table) or
  // "core samples" (oven-dried cores, each row with its own depth)
  std::string kind;
  double depth_cm = 0;             // 0 for a well and for core samples: their readings carry the depths
  std::filesystem::path readings;  // resolved against the site file's folder
  // Tensiometers only: height of the gauge above ground when read at a gauge (the water
  // column down to the cup adds to the head there); empty when read at the cup.
  std::optional<double> gauge_height_cm;
  double working_limit_kpa = 80.0;  // tensions beyond this are kept but not compared
  // Observation wells only: specific yield of the aquifer where the water table moves
  // (water-table fluctuation, Healy & Cook 2002), and the fall of the table without recharge.
  double specific_yield = 0;
  std::string specific_yield_note;
  double recession_cm_per_d = 0;
};

// A run period other than the site file's, from the command line (ISO dates).
struct PeriodOverride {
  std::string from;  // empty: the site file's start
  std::string to;    // empty: the site file's end
};

// Default of [run] output_size_limit: 1 GB (decimal).
inline constexpr double kDefaultOutputSizeLimitBytes = 1e9;

struct SiteSetup {
  std::filesystem::path site_file;
  std::string name;
  std::string location;
  std::string description;

  base::TimePoint run_start{};
  std::string run_start_text;  // ISO 8601, as the time axes' origin
  std::string run_end_text;
  double run_length_days = 0;
  double output_interval_days = 1;
  // [run] output_size_limit: build_season refuses a run whose profiles would take more (the run
  // record is held in memory before it is written).
  double output_size_limit_bytes = kDefaultOutputSizeLimitBytes;
  std::vector<double> visit_days;  // inside the run, increasing
  std::vector<std::string> visit_dates;

  std::vector<soils::SoilLayer> layers;
  solver::GridRequest grid;  // depth and required faces filled in
  solver::InitialCondition initial;
  solver::BottomBoundary bottom;
  std::string initial_text;  // resolved, for `check`
  std::string bottom_text;
  double dry_limit_head_cm = -15000;
  double max_ponded_depth_cm = 0;

  ForcingFile rain;
  std::optional<ForcingFile> irrigation;
  PanSetup pan;
  CropSetup crop;

  std::vector<SensorSetup> sensors;
  double recharge_plane_depth_cm = 0;
  // Names of the upper and lower tensiometer of the Darcy estimate ([recharge]
  // tensiometer_pair; default the two deepest tensiometers). Empty with fewer than two.
  std::vector<std::string> darcy_pair;

  solver::SolverSettings settings;
  double specific_storage_per_cm = 1e-5;  // Ss: keeps saturated cells well posed
  solver::FaceConductivity face_conductivity = solver::FaceConductivity::integral;
};

// Reads and checks the site file. Throws base::InputError naming the file, line and key for
// anything wrong: syntax, unknown keys (with the allowed ones), missing keys, values without
// units or with the wrong ones, layers that overlap or leave gaps, sensors below the column,
// parameters out of physical range, dates outside the run, missing CSV files.
SiteSetup load_site_file(const std::filesystem::path& site_file, const PeriodOverride& period = {});

}  // namespace wetfront::site
