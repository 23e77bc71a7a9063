#include "anchor_command.hpp"

#include <memory>

#include <fmt/format.h>

#include "anchor_report.hpp"
#include "command_output.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"
#include "progress_line.hpp"
#include "wetfront/site/anchored_output.hpp"
#include "wetfront/site/output_files.hpp"
#include "wetfront/studies/parallel_batch.hpp"

namespace wetfront::cli {
namespace {

std::filesystem::path with_suffix(const std::filesystem::path& path, const std::string& suffix) {
  return path.parent_path() / (path.stem().string() + suffix);
}

struct AnchorOptions {
  std::string site, out, from, to, calibration;
  std::string reach = "30 cm";
  std::size_t members = 64;
  std::uint64_t seed = 1;
  bool update_parameters = false;
  unsigned threads = 0;
  bool quiet = false;
  bool force = false;
};

constexpr const char* kFooter =
    "Writes the HDF5 file and, next to it, NAME-intervals.csv (drainage per visit interval) and\n"
    "NAME-visits.csv (the update at each visit).\n"
    "Exit codes: 0 done, 1 bad input or unwritable output (nothing written), 3 internal failure.\n"
    "Example:\n  wetfront anchor examples/demo/site.toml --members 64";

void run_anchor(const AnchorOptions& o) {
  const double reach_cm = base::parse_quantity(o.reach, base::Dimension::length, "option --reach");
  if (!(reach_cm >= 0)) throw base::InputError("option --reach: give a length of zero or more, e.g. \"30 cm\"");
  const site::SiteSetup site = site::load_site_file(o.site, {o.from, o.to});
  const site::ParameterStudy study = site::load_parameter_study(site);
  const std::filesystem::path out = o.out.empty() ? with_suffix(o.site, "-anchored.h5") : std::filesystem::path(o.out);
  const std::filesystem::path intervals_csv = with_suffix(out, "-intervals.csv");
  const std::filesystem::path visits_csv = with_suffix(out, "-visits.csv");
  std::vector<std::filesystem::path> inputs = site::site_input_files(site);
  if (!o.calibration.empty()) inputs.emplace_back(o.calibration);
  const site::OutputGuard guard({.outputs = {out, intervals_csv, visits_csv}, .inputs = inputs, .force = o.force});
  ProgressLine progress(o.quiet);
  const site::AnchorSettings settings{.members = o.members,
                                      .seed = o.seed,
                                      .update_parameters = o.update_parameters,
                                      .threads = o.threads,
                                      .reach_cm = reach_cm,
                                      .calibration_file = o.calibration};
  const site::AnchoredSeason season =
      site::run_anchored_season(site, study, settings, WETFRONT_VERSION,
                                [&](std::size_t done, std::size_t planned) { progress(done, planned, false); });
  const double seconds = progress.seconds();
  progress.finish();
  const std::string run_id = site::new_run_id();
  site::ReportTable intervals = site::anchored_interval_table(season);
  site::ReportTable visits = site::anchored_visit_table(season);
  intervals.run_id = visits.run_id = run_id;
  site::write_files_together({{intervals_csv, intervals}, {visits_csv, visits}},
                             [&] { site::write_anchored_file(out, site, study, season, WETFRONT_VERSION, run_id); });
  if (!o.quiet) {
    const unsigned threads = std::min<unsigned>(studies::thread_count(o.threads), static_cast<unsigned>(o.members));
    fmt::print("{}", anchored_report(site, study, season, seconds, threads));
    fmt::print("\nWrote {}, {} and {}\n", out.string(), intervals_csv.string(), visits_csv.string());
  }
}

}  // namespace

void add_anchor_command(CLI::App& app) {
  auto o = std::make_shared<AnchorOptions>();
  CLI::App* cmd = app.add_subcommand(
      "anchor", "Run an ensemble of the season and update it at each visit from the readings (ensemble Kalman filter)");
  cmd->add_option("SITE", o->site,
                  "site file (TOML) with [[adjustable]] parameters and [fit]; see docs/anchored-season.md")
      ->required();
  cmd->add_option("--members", o->members, "ensemble members (default 64)")->check(CLI::Range(2, 10000));
  cmd->add_option("--seed", o->seed, "seed of the random draws (default 1); the same seed gives the same ensemble");
  cmd->add_option("--calibration", o->calibration,
                  "draw the members around the calibrated values of this calibration file (as `wetfront calibrate` "
                  "writes it, SITE-calibration.h5) with their covariance, within the [[adjustable]] ranges "
                  "(default: from the ranges)");
  cmd->add_flag("--update-parameters", o->update_parameters,
                "update the adjustable parameters with the soil water (default: they keep their drawn values)");
  cmd->add_option("--reach", o->reach,
                  "how far in depth a reading updates the soil water: its weight falls to zero at twice this, "
                  "\"0 cm\" lets every reading update every cell (default \"30 cm\")");
  cmd->add_option("--threads", o->threads, "threads to run on (default: all cores); results do not depend on it");
  cmd->add_option("--out", o->out, "HDF5 file to write (default: the site file's name with -anchored.h5)");
  cmd->add_option("--from", o->from, "start the season on this date instead (YYYY-MM-DD)");
  cmd->add_option("--to", o->to, "end the season on this date instead (YYYY-MM-DD)");
  cmd->add_flag("--quiet", o->quiet, "print only errors");
  add_force_flag(cmd, o->force);
  cmd->footer(kFooter);
  cmd->callback([o] { run_anchor(*o); });
}

}  // namespace wetfront::cli
