// A season at a site, run and checked: what a script, a benchmark or the command line calls
// to "run a season and check it". Reads no command-line options and prints nothing.
#pragma once

#include <filesystem>
#include <functional>
#include <string>

#include "wetfront/profiles/run_record.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/sensor_check.hpp"
#include "wetfront/site/site_file.hpp"
#include "wetfront/solver/column_problem.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site {

struct SeasonResult {
  Season season;               // the season as run (site values, forcing, problem, notes)
  profiles::RunRecord record;  // the run with its per-visit balance and field checks stored
  SensorCheck sensors;         // simulated against observed, per sensor and pooled
  bool complete = false;       // false when the solver stopped early (record marked incomplete)
};

// How the column problem is solved: solver::simulate, or a caller's wrapper around it (a
// progress line, a worker thread).
using Simulate = std::function<solver::ColumnRun(const solver::ColumnProblem&)>;

// The record and field checks of a finished run of `season`.
SeasonResult finish_season(Season season, solver::ColumnRun run, const std::string& program_version);

// Reads the site's field records, runs the season and checks it against the readings.
// Throws base::InputError for a site or record the program cannot use.
SeasonResult run_season(const SiteSetup& site, const std::string& program_version, const Simulate& simulate = {});

}  // namespace wetfront::site
