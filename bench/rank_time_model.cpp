// Timed runs for the time model of a study spread over MPI ranks (bench/README.md, "Sweeps over
// MPI ranks"), on the demo site's own sweep (examples/demo: the loam subsoil's Ks and n, full
// 200-day seasons scored against the sensor readings), on one thread:
//   - loading the inputs on rank 0 and the bytes it shares with the other ranks;
//   - the cost of single runs over a Latin hypercube sample (mean, spread, extremes) and the
//     bytes of one request and one result, as the ranks exchange them;
//   - writing the sweep file and table for large ensembles (runs repeated from the sample).
// Usage: rank_time_model [runs in the sample, default 24]
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <numeric>

#include <unistd.h>

#include <fmt/format.h>

#include "wetfront/base/input_files.hpp"
#include "wetfront/site/parameter_study.hpp"
#include "wetfront/site/site_file.hpp"
#include "wetfront/site/study_output.hpp"
#include "wetfront/studies/parameter_sampling.hpp"
#include "wetfront/studies/task_bytes.hpp"

namespace {

using namespace wetfront;
using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point start) { return std::chrono::duration<double>(Clock::now() - start).count(); }

site::SeasonModel load_demo() {
  site::SiteSetup demo = site::load_site_file(WETFRONT_SOURCE_DIR "/examples/demo/site.toml");
  site::ParameterStudy study = site::load_parameter_study(demo);
  return site::SeasonModel(std::move(demo), std::move(study));
}

}  // namespace

int main(int argc, char** argv) {
  const std::size_t sample = argc > 1 ? std::strtoul(argv[1], nullptr, 10) : 24;

  auto start = Clock::now();
  std::size_t input_bytes = 0;
  std::size_t input_files = 0;
  std::optional<site::SeasonModel> model;
  {
    const base::InputFileRecording recording;
    model.emplace(load_demo());
    for (const auto& [path, bytes] : recording.files()) {
      ++input_files;
      input_bytes += path.size() + (bytes ? bytes->size() : 0);
    }
  }
  fmt::print("load on rank 0: {:.3f} s; {} input files, {} bytes shared\n", seconds_since(start), input_files,
             input_bytes);

  const auto sets = studies::latin_hypercube(model->study().ranges(), sample, 1);
  const studies::TaskHandler handler = model->handler();
  std::vector<double> cost;
  std::size_t request_bytes = 0;
  std::size_t result_bytes = 0;
  site::SweepResult sweep;
  for (const auto& set : sets) {
    studies::ByteWriter request;
    request.numbers(set);
    const std::string bytes = request.take();
    start = Clock::now();
    const std::string result = handler(bytes);
    cost.push_back(seconds_since(start));
    request_bytes = std::max(request_bytes, bytes.size());
    result_bytes = std::max(result_bytes, result.size());
  }
  const double mean = std::accumulate(cost.begin(), cost.end(), 0.0) / static_cast<double>(cost.size());
  double square_sum = 0;
  for (const double c : cost) square_sum += (c - mean) * (c - mean);
  const auto [low, high] = std::minmax_element(cost.begin(), cost.end());
  fmt::print("run cost over {} sets: mean {:.3f} s, sd {:.3f} s, min {:.3f} s, max {:.3f} s\n", cost.size(), mean,
             std::sqrt(square_sum / static_cast<double>(cost.size() - 1)), *low, *high);
  fmt::print("bytes per run: request {}, result {} (largest)\n", request_bytes, result_bytes);

  const auto sample_runs = model->run_all(sets, 1);
  const auto folder = std::filesystem::temp_directory_path() / fmt::format("wetfront-rank-model-{}", ::getpid());
  std::filesystem::create_directories(folder);
  for (const std::size_t ensemble : {1000u, 10000u, 100000u}) {
    sweep.runs.clear();
    for (std::size_t i = 0; i < ensemble; ++i) sweep.runs.push_back(sample_runs[i % sample_runs.size()]);
    sweep.ranking.resize(ensemble);
    std::iota(sweep.ranking.begin(), sweep.ranking.end(), std::size_t{0});
    sweep.method = "repeated sample";
    const auto path = folder / fmt::format("sweep-{}.h5", ensemble);
    start = Clock::now();
    site::write_sweep_file(path, *model, sweep, 0, 1, "bench");
    fmt::print("sweep file of {} runs: {:.3f} s, {} bytes\n", ensemble, seconds_since(start),
               std::filesystem::file_size(path));
  }
  std::filesystem::remove_all(folder);
  return 0;
}
