// The commands that spread their runs over MPI ranks (sweep, calibrate, network): which they are,
// and the worker ranks' quiet output. They start through cluster::run_study.
#pragma once

namespace wetfront::cli {

// Whether the command line names a command that spreads over ranks. Under mpirun the other
// ranks end at once for any other command, which rank 0 runs alone.
bool spreads_over_ranks(int argc, char** argv);

// Sends a worker rank's output to /dev/null: the leader alone prints (CLI errors, which every
// rank finds alike, included).
void quiet_worker_output();

}  // namespace wetfront::cli
