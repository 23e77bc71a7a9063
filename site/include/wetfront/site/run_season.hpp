// A season at a site, run and checked: what a script, a benchmark or the command line calls
// to "run a season and check it". Reads no command-line options and prints nothing.
#pragma once

#include <filesystem>
#include <functional>
#include <string>

#include "wetfront/profiles/run_file_stream.hpp"
#include "wetfront/profiles/run_record.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/sensor_check.hpp"
#include "wetfront/site/simulated_profiles.hpp"
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

// The same when the profiles go to an observer as the run reaches them: solver::simulate(problem,
// observe), or a caller's wrapper around it.
using SimulateStreamed = std::function<solver::ColumnRun(const solver::ColumnProblem&, const solver::OutputObserver&)>;

// The record and field checks of a finished run of `season`.
SeasonResult finish_season(Season season, solver::ColumnRun run, const std::string& program_version);
// The same for a run that kept no profiles: the field checks read `simulated`, gathered as the
// run went.
SeasonResult finish_season(Season season, solver::ColumnRun run, const std::string& program_version,
                           const SensorProfiles& simulated);

// Runs `season` with every profile appended to `stream` as it is reached. The record keeps no
// profiles, so memory does not grow with cells times output times; the field checks read the
// few cells around the readings' depths, gathered on the way (SensorProfileGatherer). The caller
// then finishes and commits the stream with the result's record. Throws profiles::RunFileError
// when the stream cannot be written.
SeasonResult run_season_streamed(Season season, profiles::RunFileStream& stream, const std::string& program_version,
                                 const SimulateStreamed& simulate = {});

// Reads the site's field records, runs the season and checks it against the readings.
// Throws base::InputError for a site or record the program cannot use.
SeasonResult run_season(const SiteSetup& site, const std::string& program_version, const Simulate& simulate = {});

}  // namespace wetfront::site
