// A study spread over the ranks of an MPI job (`mpirun -n 64 wetfront sweep ...`): the only
// place that calls MPI. Rank 0, the leader, reads the inputs, shares their bytes with the other
// ranks, hands out tasks one at a time as ranks ask for them (runs differ in cost), gathers the
// results and writes the files. The other ranks, the workers, build the same study from the
// shared bytes and answer tasks until the leader releases them.
//
// Built without MPI (WETFRONT_MPI=OFF), or started without mpirun, a Session has one rank and
// the study runs on threads; nothing here is called then.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "wetfront/base/input_files.hpp"
#include "wetfront/studies/task_runner.hpp"

namespace wetfront::cluster {

// The processes of one start of the program. Starts MPI only when the program was started by
// an MPI launcher (mpirun, or a scheduler's launcher that sets the MPI environment); ends it
// when destroyed. One per process, made first thing in main.
class Session {
 public:
  Session(int& argc, char**& argv);
  ~Session();
  Session(const Session&) = delete;
  Session& operator=(const Session&) = delete;

  int rank() const { return rank_; }
  int size() const { return size_; }
  bool leader() const { return rank_ == 0; }
  bool distributed() const { return size_ > 1; }

 private:
  [[maybe_unused]] bool started_mpi_ = false;  // read only by the MPI back end
  int rank_ = 0;
  int size_ = 1;
};

// Leader only: the inputs could not be read (the leader reports why); the workers stop waiting.
void cancel_inputs(const Session& session);

// Worker only: the input files the leader read, or nullopt when it cancelled.
std::optional<base::InputFileBytes> receive_inputs(const Session& session);

// Worker only: answers the leader's tasks with `handler` until released. A handler that throws
// sends its message back as the task's error.
void serve(const Session& session, const studies::TaskHandler& handler);

// Leader only: shares the input files, then runs tasks on every rank: the workers and one
// thread of the leader itself (so that -n 2 gives two workers). Releases the workers when
// destroyed.
class LeaderRunner final : public studies::TaskRunner {
 public:
  LeaderRunner(const Session& session, const base::InputFileBytes& inputs, studies::TaskHandler local_handler);
  ~LeaderRunner() override;
  LeaderRunner(const LeaderRunner&) = delete;
  LeaderRunner& operator=(const LeaderRunner&) = delete;

  std::vector<std::string> run(const std::vector<std::string>& requests,
                               const studies::TaskFinished& finished) override;
  unsigned workers() const override { return static_cast<unsigned>(session_.size()); }

 private:
  const Session& session_;
  studies::TaskHandler local_handler_;
};

}  // namespace wetfront::cluster
