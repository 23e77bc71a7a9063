#include "site_test_helpers.hpp"

#include <sys/wait.h>
#include <unistd.h>

#include <algorithm>
#include <atomic>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <stdexcept>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include "wetfront/site/site_file.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::site::testing {

std::filesystem::path demo_folder() { return std::filesystem::path(WETFRONT_SOURCE_DIR) / "examples" / "demo"; }

ScratchSite::ScratchSite(const std::string& label) {
  static std::atomic<int> counter{0};
  folder_ = std::filesystem::temp_directory_path() /
            fmt::format("wetfront-site-{}-{}-{}", label, static_cast<long>(::getpid()), counter++);
  std::filesystem::remove_all(folder_);
  std::filesystem::create_directories(folder_);
  for (const auto& entry : std::filesystem::directory_iterator(demo_folder())) {
    const auto ext = entry.path().extension();
    if (ext == ".csv" && entry.path().filename().string().find("-visits") == std::string::npos) {
      std::filesystem::copy_file(entry.path(), folder_ / entry.path().filename());
    }
  }
  std::filesystem::copy_file(demo_folder() / "site.toml", folder_ / "site.toml");
}

ScratchSite::~ScratchSite() {
  std::error_code ignored;
  std::filesystem::remove_all(folder_, ignored);
}

std::string ScratchSite::read(const std::string& name) const {
  std::ifstream in(folder_ / name, std::ios::binary);
  std::stringstream buffer;
  buffer << in.rdbuf();
  return buffer.str();
}

void ScratchSite::write(const std::string& name, const std::string& text) const {
  std::ofstream(folder_ / name, std::ios::binary) << text;
}

std::size_t ScratchSite::replace(const std::string& name, const std::string& from, const std::string& to) const {
  std::string text = read(name);
  const auto at = text.find(from);
  if (at == std::string::npos || text.find(from, at + 1) != std::string::npos) {
    throw std::logic_error(fmt::format("test setup: '{}' is not found exactly once in {}", from, name));
  }
  text.replace(at, from.size(), to);
  write(name, text);
  return 1 + static_cast<std::size_t>(std::count(text.begin(), text.begin() + static_cast<long>(at), '\n'));
}

SimulatedSeason simulate_until(const ScratchSite& site, const std::string& to) {
  Season season = prepare_season(load_site_file(site.site_file(), {"", to}));
  profiles::RunRecord record = make_record(season, solver::simulate(season.problem), "test");
  return {std::move(season), std::move(record)};
}

ProgramResult run_program(const std::string& arguments, const std::filesystem::path& scratch) {
  const auto out_file = scratch / "program.stdout";
  const auto err_file = scratch / "program.stderr";
  const std::string command =
      fmt::format("'{}' {} > '{}' 2> '{}'", WETFRONT_PROGRAM, arguments, out_file.string(), err_file.string());
  const int status = std::system(command.c_str());
  ProgramResult result;
  result.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  auto slurp = [](const std::filesystem::path& path) {
    std::ifstream in(path);
    std::stringstream buffer;
    buffer << in.rdbuf();
    return buffer.str();
  };
  result.out = slurp(out_file);
  result.err = slurp(err_file);
  std::filesystem::remove(out_file);
  std::filesystem::remove(err_file);
  return result;
}

void keep_tensiometers_and_probes(const ScratchSite& site) {
  std::string text = site.read("site.toml");
  const auto from = text.find("# Oven-dried cores");
  const auto to = text.find("[recharge]");
  if (from == std::string::npos || to == std::string::npos || to < from) {
    throw std::runtime_error("test setup: the demo site file has no core-samples block before [recharge]");
  }
  site.write("site.toml", text.erase(from, to - from));
}

double at_depth(const std::vector<double>& centres, const std::vector<double>& values, double depth) {
  for (std::size_t i = 0; i + 1 < centres.size(); ++i) {
    if (centres[i] <= depth && depth <= centres[i + 1]) {
      const double w = (depth - centres[i]) / (centres[i + 1] - centres[i]);
      return values[i] + w * (values[i + 1] - values[i]);
    }
  }
  ADD_FAILURE() << "depth outside the cell centres";
  return 0;
}

ProgramResult run_site(const ScratchSite& site, const std::filesystem::path& out, const std::string& options) {
  return run_program(fmt::format("run '{}' --out '{}'{}{}", site.site_file().string(), out.string(),
                                 options.empty() ? "" : " ", options),
                     site.folder());
}

}  // namespace wetfront::site::testing
