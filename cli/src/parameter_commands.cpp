#include "parameter_commands.hpp"

#include <memory>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/cluster/run_study.hpp"
#include "parameter_report.hpp"
#include "progress_line.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/site/parameter_study.hpp"
#include "wetfront/site/parameter_study_tables.hpp"
#include "wetfront/site/study_output.hpp"
#include "wetfront/studies/parallel_batch.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

struct CommonOptions {
  std::string site;
  std::string out;
  std::string from;
  std::string to;
  unsigned threads = 0;
  std::uint64_t seed = 1;
  bool quiet = false;
  bool force = false;
};

void add_common(CLI::App* cmd, CommonOptions& o, const std::string& default_out) {
  cmd->add_option("SITE", o.site, "site file (TOML) with [[adjustable]] parameters; see docs/parameter-studies.md")
      ->required();
  cmd->add_option("--out", o.out, "HDF5 file to write (default: the site file's name with " + default_out + ")");
  cmd->add_option("--from", o.from, "start the runs on this date instead (YYYY-MM-DD)");
  cmd->add_option("--to", o.to, "end the runs on this date instead (YYYY-MM-DD)");
  cmd->add_option("--threads", o.threads, "threads to run on (default: all cores); results do not depend on it");
  cmd->add_option("--seed", o.seed, "seed of the random draws (default 1); the same seed gives the same sets");
  cmd->add_flag("--quiet", o.quiet, "print only errors");
  cmd->add_flag("--force", o.force,
                "replace output files that wetfront did not write (files the runs read are never replaced)");
}

SeasonModel load_model(const CommonOptions& o) {
  SiteSetup site = load_site_file(o.site, {o.from, o.to});
  ParameterStudy study = load_parameter_study(site);
  if (study.parameters.empty())
    throw base::InputError(
        o.site, 0, "",
        "no [[adjustable]] entries: mark the parameters to vary (docs/site-file.md, \"Parameter studies\")");
  return SeasonModel(std::move(site), std::move(study));
}

// A study command: the HDF5 file (--out, or the site file's name with `suffix`) and its CSV table
// beside it guarded before any run (the output folder, the files read, files of other programs,
// another writer); the progress line while the runs go, their bad input reported against the site
// file; then the table and the file written together under one run id, and the report.
// run(progress) -> result; table(result); write(out, result, run_id); report(result, seconds).
template <class Run, class Table, class Write, class Report>
void run_study_command(const CommonOptions& o, const SeasonModel& model, const std::string& suffix, bool at_most,
                       Run run, Table table_of, Write write, Report report) {
  const std::filesystem::path out = o.out.empty() ? beside(o.site, suffix) : std::filesystem::path(o.out);
  const std::filesystem::path csv = beside(out, ".csv");
  const OutputGuard guard({.outputs = {out, csv}, .inputs = site_input_files(model.site()), .force = o.force});
  ProgressLine progress(o.quiet);
  decltype(run(StudyProgress())) result;
  try {
    result = run([&](std::size_t done, std::size_t planned) { progress(done, planned, at_most); });
  } catch (const base::InputError& error) {
    throw base::InputError(o.site, 0, "", error.what());
  }
  const double seconds = progress.seconds();
  progress.finish();
  ReportTable table = table_of(result);
  table.run_id = new_run_id();
  write_files_together({{csv, table}}, [&] { write(out, result, table.run_id); });
  if (!o.quiet) {
    fmt::print("{}", report(result, seconds));
    fmt::print("\nWrote {} and {}\n", out.string(), csv.string());
  }
}

// The footer (what the command writes, the exit codes, an example) and the callback of a study
// command: the model loaded on every rank, `study` run by the leader (cluster::run_study).
template <class Options>
void finish_study_command(CLI::App* cmd, const cluster::Session& session, std::shared_ptr<Options> o,
                          void (*study)(const Options&, const SeasonModel&, studies::TaskRunner*),
                          const std::string& writes, const std::string& example) {
  cmd->footer(writes +
              "Exit codes: 0 done, 1 bad input or unwritable output (nothing written), 3 internal failure.\n"
              "Example:\n  " +
              example);
  cmd->callback([o, &session, study] {
    cluster::run_study(
        session, [&] { return load_model(*o); }, [](const SeasonModel& model) { return model.handler(); },
        [&](const SeasonModel& model, studies::TaskRunner* ranks) { study(*o, model, ranks); });
  });
}

struct SweepOptions : CommonOptions {
  bool grid = false;
  std::size_t sample = 50;
  std::size_t shown = 10;
  std::size_t kept = 3;
};

// The sweep of a loaded model; `ranks` runs the sets (null: this machine's threads).
void sweep(const SweepOptions& o, const SeasonModel& model, studies::TaskRunner* ranks) {
  const SweepSettings settings{
      .full_grid = o.grid, .sample_size = o.sample, .seed = o.seed, .threads = o.threads, .runner = ranks};
  const unsigned workers = ranks ? ranks->workers() : studies::thread_count(o.threads);
  run_study_command(
      o, model, "-sweep.h5", false, [&](const StudyProgress& progress) { return run_sweep(model, settings, progress); },
      [&](const SweepResult& sweep) { return sweep_table(model, sweep); },
      [&](const std::filesystem::path& out, const SweepResult& sweep, const std::string& run_id) {
        write_sweep_file(out, model, sweep, o.kept, o.threads, WETFRONT_VERSION, run_id);
      },
      [&](const SweepResult& sweep, double seconds) {
        return sweep_report(model, sweep, o.shown, seconds,
                            std::min<unsigned>(workers, static_cast<unsigned>(sweep.runs.size())));
      });
}

void add_sweep_command(CLI::App& app, const cluster::Session& session) {
  auto o = std::make_shared<SweepOptions>();
  CLI::App* cmd =
      app.add_subcommand("sweep", "Run a site under many parameter sets and rank them against the sensor readings");
  add_common(cmd, *o, "-sweep.h5");
  cmd->add_flag("--grid", o->grid,
                "every combination of each parameter's grid_points values (default: a Latin hypercube sample)");
  cmd->add_option("--sample", o->sample, "number of sets in the Latin hypercube sample (default 50)")
      ->check(CLI::Range(1, 100000));
  cmd->add_option("--show", o->shown, "rows of the ranked table to print (default 10; the CSV has all)");
  cmd->add_option("--keep", o->kept, "profiles of this many best runs go into the HDF5 file (default 3)");
  finish_study_command(cmd, session, o, sweep,
                       "Writes the HDF5 file and, next to it, NAME-sweep.csv with every set ranked.\n"
                       "Under mpirun the runs are spread over the ranks (docs/many-machines.md).\n",
                       "wetfront sweep examples/demo/site.toml --grid");
}

struct CalibrateOptions : CommonOptions {
  int max_runs = 150;
  std::size_t band_runs = 40;
};

// The calibration of a loaded model; `ranks` runs each batch of sets (null: threads).
void calibrate(const CalibrateOptions& o, const SeasonModel& model, studies::TaskRunner* ranks) {
  CalibrationSettings settings;
  settings.options.max_runs = o.max_runs;
  settings.threads = o.threads;
  settings.band_runs = o.band_runs;
  settings.seed = o.seed;
  settings.runner = ranks;
  const unsigned workers = ranks ? ranks->workers() : studies::thread_count(o.threads);
  const auto run = [&](const StudyProgress& progress) {
    try {
      return run_calibration(model, settings, progress);
    } catch (const base::InputError&) {
      throw;
    } catch (const std::runtime_error& error) {
      throw base::InputError(fmt::format("the calibration stopped: {}", error.what()));
    }
  };
  run_study_command(
      o, model, "-calibration.h5", true, run,
      [&](const CalibrationStudy& study) { return calibration_recharge_table(model, study); },
      [&](const std::filesystem::path& out, const CalibrationStudy& study, const std::string& run_id) {
        write_calibration_file(out, model, study, WETFRONT_VERSION, run_id);
      },
      [&](const CalibrationStudy& study, double seconds) {
        return calibration_report(model, study, seconds, workers);
      });
}

void add_calibrate_command(CLI::App& app, const cluster::Session& session) {
  auto o = std::make_shared<CalibrateOptions>();
  CLI::App* cmd = app.add_subcommand(
      "calibrate", "Fit the adjustable parameters to the sensor readings and give recharge with an uncertainty band");
  add_common(cmd, *o, "-calibration.h5");
  cmd->add_option("--max-runs", o->max_runs, "limit on model runs for the fit (default 150)")
      ->check(CLI::Range(4, 100000));
  cmd->add_option("--band-runs", o->band_runs,
                  "parameter sets drawn for the sampled recharge band (default 40; 0: none)");
  finish_study_command(cmd, session, o, calibrate,
                       "Writes the HDF5 file and, next to it, NAME-calibration.csv with recharge per visit interval.\n"
                       "Under mpirun each batch of runs is spread over the ranks (docs/many-machines.md).\n",
                       "wetfront calibrate examples/demo/site.toml");
}

}  // namespace

void add_parameter_commands(CLI::App& app, const cluster::Session& session) {
  add_sweep_command(app, session);
  add_calibrate_command(app, session);
}

}  // namespace wetfront::cli
