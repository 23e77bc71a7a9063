#include "study_ranks.hpp"

#include <array>
#include <cstdio>
#include <string_view>

namespace wetfront::cli {

bool spreads_over_ranks(int argc, char** argv) {
  static constexpr std::array<std::string_view, 3> kCommands{"sweep", "calibrate", "network"};
  for (int k = 1; k < argc; ++k) {
    const std::string_view word = argv[k];
    if (word.starts_with('-')) continue;
    for (const auto command : kCommands) {
      if (word == command) return true;
    }
    return false;  // the first word that is not an option names the command
  }
  return false;
}

void quiet_worker_output() {
  if (std::freopen("/dev/null", "w", stdout) == nullptr) std::fclose(stdout);
  if (std::freopen("/dev/null", "w", stderr) == nullptr) std::fclose(stderr);
}

}  // namespace wetfront::cli
