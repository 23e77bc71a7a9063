// A study started the same way on one process or on the ranks of an MPI job: on one process it
// runs on threads; under mpirun the leader loads the inputs (keeping their bytes), shares them
// and runs the study with a runner that hands its tasks to every rank, while each other rank
// loads the same study from the shared bytes and answers tasks.
#pragma once

#include <optional>
#include <stdexcept>
#include <string>

#include "wetfront/base/input_files.hpp"
#include "wetfront/cluster/ranks.hpp"

namespace wetfront::cluster {

// load() -> Loaded (reads the inputs; throws base::InputError); handler_of(loaded) -> the task
// handler; study(loaded, runner) runs the study, runner null meaning "on threads".
template <class Load, class HandlerOf, class Study>
void run_study(const Session& session, Load load, HandlerOf handler_of, Study study) {
  using Loaded = decltype(load());
  if (!session.distributed()) {
    Loaded loaded = load();
    study(loaded, nullptr);
    return;
  }
  if (!session.leader()) {
    std::optional<base::InputFileBytes> inputs = receive_inputs(session);
    if (!inputs) return;  // the leader could not read them and says why
    const base::InputFilesFromMemory memory(std::move(*inputs));
    std::optional<Loaded> loaded;
    std::string failure;
    try {
      loaded.emplace(load());
    } catch (const std::exception& error) {  // not expected: the leader loaded the same bytes
      failure = error.what();
    }
    if (loaded) {
      serve(session, handler_of(*loaded));
    } else {
      serve(session, [&failure](std::string_view) -> std::string { throw std::runtime_error(failure); });
    }
    return;
  }
  std::optional<Loaded> loaded;
  base::InputFileBytes inputs;
  try {
    const base::InputFileRecording recording;
    loaded.emplace(load());
    inputs = recording.files();
  } catch (...) {
    cancel_inputs(session);
    throw;
  }
  LeaderRunner runner(session, inputs, handler_of(*loaded));
  study(*loaded, &runner);
}

}  // namespace wetfront::cluster
