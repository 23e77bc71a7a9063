#include "anchor_report.hpp"

#include <numeric>

#include <fmt/format.h>

#include "wetfront/site/anchored_output.hpp"

namespace wetfront::cli {
namespace {

constexpr const char* kCautions =
    "\nCautions:\n"
    "  - The update assumes Gaussian errors, a linear update of a nonlinear model and independent\n"
    "    readings (docs/anchored-season.md). The members differ only in the adjustable parameters and\n"
    "    carry only their uncertainty; errors of the rain, the pan or the model structure are not in\n"
    "    the band.\n"
    "  - The water each update adds or removes is reported as its own term; it is not recharge.\n"
    "  - Every recharge number here is an estimate. Decisions on water use, recharge or abstraction rest\n"
    "    with local regulations and licensed professionals, not with this program.\n";

}  // namespace

std::string anchored_report(const site::SiteSetup& site, const site::ParameterStudy& study,
                            const site::AnchoredSeason& season, double seconds, unsigned threads) {
  const auto& s = season.settings;
  const auto complete =
      static_cast<std::size_t>(std::count(season.member_complete.begin(), season.member_complete.end(), true));
  std::size_t readings = 0;
  for (const auto& visit : season.visits) readings += visit.readings.size();
  std::string out =
      fmt::format("Anchored season of {} ({} to {})\n", site.name, site.run_start_text, site.run_end_text);
  out += s.calibration_file.empty()
             ? fmt::format("  {} members drawn from the [[adjustable]] ranges (seed {}), {} ran the whole season\n",
                           s.members, s.seed, complete)
             : fmt::format(
                   "  {} members drawn around the calibrated values of {} with their covariance, a draw outside "
                   "the [[adjustable]] ranges drawn again (seed {}), {} ran the whole season\n",
                   s.members, s.calibration_file.string(), s.seed, complete);
  out += fmt::format("  updated at {} visits from {} readings (reading uncertainty: heads {} cm{})\n",
                     season.visits.size(), readings, study.weights.head_uncertainty_cm,
                     study.weights.water_content_uncertainty
                         ? fmt::format(", water contents {} cm3/cm3", *study.weights.water_content_uncertainty)
                         : std::string(", water contents not used"));
  if (season.readings_not_at_a_visit > 0)
    out += fmt::format("  {} readings lay more than a day from any visit or outside the column and were not used\n",
                       season.readings_not_at_a_visit);
  out += s.update_parameters
             ? "  updated: the soil water of every cell and the adjustable parameters (state augmentation)\n"
             : "  updated: the soil water of every cell; the parameters keep their drawn values\n";
  out += s.reach_cm > 0 ? fmt::format(
                              "  a reading updates the soil water within {} cm of its depth, fading to none "
                              "at {} cm (localisation)\n",
                              site::number(s.reach_cm), site::number(2 * s.reach_cm))
                        : std::string("  every reading updates the soil water of every cell (no localisation)\n");
  out += fmt::format("  recharge plane {} cm below the surface; drainage positive downward\n",
                     site.recharge_plane_depth_cm);
  out += fmt::format("  {:.1f} s on {} threads\n", seconds, threads);
  for (std::size_t j = 0; j < season.member_failures.size(); ++j)
    if (!season.member_complete[j]) out += fmt::format("  member {} stopped: {}\n", j + 1, season.member_failures[j]);

  const site::ReportTable intervals = site::anchored_interval_table(season);
  out += fmt::format("\n{}", site::format_table(intervals));
  double free_total = 0, mean_total = 0, update_total = 0, soil_total = 0;
  for (std::size_t i = 0; i < season.interval_end_days.size(); ++i) {
    free_total += i < season.free_run_drainage_cm.size() ? season.free_run_drainage_cm[i] : 0.0;
    mean_total += site::drainage_band(season, i).mean;
    update_total += site::update_band(season, i).mean;
    soil_total += site::soil_change_band(season, i).mean;
  }
  out += fmt::format("Season: free run {} mm, anchored mean {} mm; the updates added {} mm on average{}\n",
                     site::number(10 * free_total), site::number(10 * mean_total), site::number(10 * update_total),
                     s.update_parameters ? fmt::format(" ({} mm of it the members' new soils holding other water "
                                                       "at the same heads)",
                                                       site::number(10 * soil_total))
                                         : std::string());
  if (!season.visits.empty()) {
    const site::ReportTable visits = site::anchored_visit_table(season);
    out += fmt::format("\n{}", site::format_table(visits));
  }
  if (!season.warnings.empty()) {
    out += "\nWarnings:\n";
    for (const auto& w : season.warnings) out += fmt::format("  - {}\n", w);
  }
  return out + kCautions;
}

}  // namespace wetfront::cli
