// A scratch copy of the demo site that a test may edit, and a way to run the program on it.
#pragma once

#include <filesystem>
#include <string>
#include <vector>

#include "wetfront/profiles/run_record.hpp"
#include "wetfront/site/season_setup.hpp"

namespace wetfront::site::testing {

std::filesystem::path demo_folder();

// A fresh folder under the system temp dir holding a copy of examples/demo (no outputs).
// Removed when the object goes away.
class ScratchSite {
 public:
  explicit ScratchSite(const std::string& label);
  ~ScratchSite();
  ScratchSite(const ScratchSite&) = delete;
  ScratchSite& operator=(const ScratchSite&) = delete;

  const std::filesystem::path& folder() const { return folder_; }
  std::filesystem::path site_file() const { return folder_ / "site.toml"; }
  std::string read(const std::string& name) const;
  void write(const std::string& name, const std::string& text) const;
  // Replaces the single occurrence of `from` in file `name` by `to` and returns the 1-based
  // line where the replacement starts. Fails the test (throws) when `from` is not found once.
  std::size_t replace(const std::string& name, const std::string& from, const std::string& to) const;

 private:
  std::filesystem::path folder_;
};

// Removes the demo's core samples and observation well (the [[sensors]] tables after the last
// probe) from the scratch site file, leaving tensiometers and probes only.
void keep_tensiometers_and_probes(const ScratchSite& site);

// The scratch site's season from its start to `to` (YYYY-MM-DD), simulated and recorded (the
// record's run may be incomplete; tests that need it whole say so).
struct SimulatedSeason {
  Season season;
  profiles::RunRecord record;
};
SimulatedSeason simulate_until(const ScratchSite& site, const std::string& to);

struct ProgramResult {
  int exit_code = -1;
  std::string out;
  std::string err;
};

// A profile value at `depth`, linear between the cell centres around it (the interpolation the
// sensor comparison uses, written out independently); a test failure outside the centres.
double at_depth(const std::vector<double>& centres, const std::vector<double>& values, double depth);

// Runs the wetfront program with `arguments` (already quoted as needed).
ProgramResult run_program(const std::string& arguments, const std::filesystem::path& scratch);

// `wetfront run` on the scratch site's site file, writing `out`, with further `options` (e.g.
// "--to 2025-04-20").
ProgramResult run_site(const ScratchSite& site, const std::filesystem::path& out, const std::string& options = "");

}  // namespace wetfront::site::testing
