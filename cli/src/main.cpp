// The `wetfront` program: one registration function per command family.
#include <CLI/CLI.hpp>

#include "anchor_command.hpp"
#include "network_command.hpp"
#include "parameter_commands.hpp"
#include "run_app.hpp"
#include "season_commands.hpp"
#include "study_ranks.hpp"
#include "soil_commands.hpp"
#include "wetfront/cluster/ranks.hpp"
#include "wetfront/profiles/file_save.hpp"

int main(int argc, char** argv) {
  const wetfront::cluster::Session session(argc, argv);  // MPI, when started by mpirun
  if (!session.leader()) {
    if (!wetfront::cli::spreads_over_ranks(argc, argv)) return 0;  // rank 0 runs other commands alone
    wetfront::cli::quiet_worker_output();
  }
  CLI::App app{
      "wetfront: water movement in the unsaturated zone of a vertical soil column over a season.\n"
      "Depths in cm positive downward; fluxes positive downward.",
      "wetfront"};
  app.set_version_flag("--version", std::string("wetfront ") + WETFRONT_VERSION);
  app.require_subcommand(1);
  wetfront::profiles::silence_hdf5_error_printing();  // failures are reported in our own words
  wetfront::cli::add_soil_commands(app);
  wetfront::cli::add_season_commands(app);
  wetfront::cli::add_parameter_commands(app, session);
  wetfront::cli::add_network_command(app, session);
  wetfront::cli::add_anchor_command(app);
  return wetfront::cli::run_app(app, argc, argv);
}
