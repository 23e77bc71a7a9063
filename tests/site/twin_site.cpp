#include "twin_site.hpp"

#include <algorithm>
#include <fstream>
#include <random>
#include <sstream>
#include <stdexcept>
#include <vector>

#include <fmt/format.h>

#include "wetfront/site/simulated_profiles.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::site::testing {

void add_study(const ScratchSite& site, const std::string& toml) {
  // The demo's own study ([fit] and [[adjustable]], at the end of its site file) gives way.
  std::string text = site.read("site.toml");
  const auto own = std::min(text.find("\n[fit]"), text.find("\n[[adjustable]]"));
  if (own != std::string::npos) text.erase(own + 1);
  site.write("site.toml", text + "\n" + toml);
}

SeasonModel load_model(const ScratchSite& site, const std::string& end_date) {
  SiteSetup setup = load_site_file(site.site_file(), {"", end_date});
  ParameterStudy study = load_parameter_study(setup);
  return SeasonModel(std::move(setup), std::move(study));
}

std::size_t write_twin_readings(const ScratchSite& site, const std::string& end_date,
                                const studies::ParameterSet& truth, double noise_cm, std::uint64_t seed) {
  const SeasonModel model = load_model(site, end_date);
  profiles::RunRecord record;
  const ScoredRun run = model.run(truth, &record);
  if (!run.complete) throw std::runtime_error("twin site: the model failed under the true values: " + run.failure);
  const observations::SimulatedProfiles heads = simulated_profiles(record.run, true);
  std::mt19937_64 generator(seed);
  std::normal_distribution<double> noise(0.0, noise_cm);
  std::size_t written = 0;
  for (const auto& sensor : model.records().sensor_readings) {
    if (sensor.kind != "tensiometer") continue;
    // The reading times as the file writes them, by line.
    std::vector<std::string> lines;
    {
      std::ifstream in(sensor.file);
      for (std::string line; std::getline(in, line);) lines.push_back(line);
    }
    std::string text =
        "# Twin-experiment readings: model heads under known parameter values plus noise.\ntime,tension_cm\n";
    for (std::size_t i = 0; i < sensor.series.observations.size(); ++i) {
      const auto& o = sensor.series.observations[i];
      const std::string time = lines.at(sensor.lines[i] - 1).substr(0, lines.at(sensor.lines[i] - 1).find(','));
      const auto head = observations::simulated_value_at(heads, o.day, sensor.depth_cm);
      if (!head) continue;  // after the end of the shortened run
      text += fmt::format("{},{:.3f}\n", time, -(*head + (noise_cm > 0 ? noise(generator) : 0.0)));
      ++written;
    }
    std::ofstream(sensor.file, std::ios::binary) << text;
  }
  return written;
}

}  // namespace wetfront::site::testing
