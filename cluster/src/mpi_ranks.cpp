// The MPI side of ranks.hpp. Messages (all in MPI_COMM_WORLD):
//   broadcast from the leader: one status byte (1 inputs follow, 0 cancelled), the length of the
//     input files' message, then the message (input_bytes.hpp);
//   kTask   leader -> worker: task number (8 bytes), request bytes;
//   kResult worker -> leader: task number (8 bytes), 1 = result or 0 = error text, the bytes;
//   kRelease leader -> worker: empty; the worker returns from serve().
// Waiting ranks poll with short sleeps instead of blocking in MPI, whose blocking receive keeps
// a core busy: a worker waiting between calibration steps, or the leader's dispatcher beside
// its own worker thread, then leaves the core to the runs.
#include <mpi.h>

#include <algorithm>
#include <chrono>
#include <climits>
#include <cstdint>
#include <cstdlib>
#include <cstring>
#include <exception>
#include <mutex>
#include <stdexcept>
#include <thread>

#include <fmt/format.h>

#include "input_bytes.hpp"
#include "wetfront/cluster/ranks.hpp"

namespace wetfront::cluster {
namespace {

constexpr int kLeader = 0;
constexpr int kTask = 1;
constexpr int kResult = 2;
constexpr int kRelease = 3;

// Whether an MPI launcher started this process (Open MPI, PMIx and PMI launchers set these).
bool started_by_launcher() {
  for (const char* name : {"OMPI_COMM_WORLD_SIZE", "PMIX_RANK", "PMI_SIZE"}) {
    if (std::getenv(name) != nullptr) return true;
  }
  return false;
}

int checked_count(std::size_t bytes) {
  if (bytes > static_cast<std::size_t>(INT_MAX))
    throw std::runtime_error(fmt::format("a message of {} bytes is beyond what one MPI message carries", bytes));
  return static_cast<int>(bytes);
}

void send(int to, int tag, const std::string& bytes) {
  MPI_Send(bytes.data(), checked_count(bytes.size()), MPI_BYTE, to, tag, MPI_COMM_WORLD);
}

// Waits for a message from `from` (or any rank) with any tag, sleeping between looks.
MPI_Status wait_for(int from) {
  auto pause = std::chrono::microseconds(20);
  for (;;) {
    int arrived = 0;
    MPI_Status status;
    MPI_Iprobe(from, MPI_ANY_TAG, MPI_COMM_WORLD, &arrived, &status);
    if (arrived) return status;
    std::this_thread::sleep_for(pause);
    pause = std::min(pause * 2, std::chrono::microseconds(500));
  }
}

std::string receive(const MPI_Status& status) {
  int count = 0;
  MPI_Get_count(&status, MPI_BYTE, &count);
  std::string bytes(static_cast<std::size_t>(count), '\0');
  MPI_Recv(bytes.data(), count, MPI_BYTE, status.MPI_SOURCE, status.MPI_TAG, MPI_COMM_WORLD, MPI_STATUS_IGNORE);
  return bytes;
}

std::string numbered(std::uint64_t task, std::string_view bytes) {
  std::string message(sizeof task, '\0');
  std::memcpy(message.data(), &task, sizeof task);
  message.append(bytes);
  return message;
}

std::uint64_t task_of(std::string_view message) {
  std::uint64_t task = 0;
  if (message.size() < sizeof task) throw std::runtime_error("a task message ends early");
  std::memcpy(&task, message.data(), sizeof task);
  return task;
}

void broadcast_inputs(std::uint8_t status, const std::string& message) {
  std::uint64_t length = message.size();
  MPI_Bcast(&status, 1, MPI_UINT8_T, kLeader, MPI_COMM_WORLD);
  MPI_Bcast(&length, 1, MPI_UINT64_T, kLeader, MPI_COMM_WORLD);
  if (status != 0) MPI_Bcast(const_cast<char*>(message.data()), checked_count(length), MPI_BYTE, kLeader, MPI_COMM_WORLD);
}

}  // namespace

Session::Session(int& argc, char**& argv) {
  if (!started_by_launcher()) return;
  int provided = 0;
  // Only the main thread calls MPI; the leader's worker thread runs tasks without it.
  MPI_Init_thread(&argc, &argv, MPI_THREAD_FUNNELED, &provided);
  started_mpi_ = true;
  MPI_Comm_rank(MPI_COMM_WORLD, &rank_);
  MPI_Comm_size(MPI_COMM_WORLD, &size_);
}

Session::~Session() {
  if (started_mpi_) MPI_Finalize();
}

void cancel_inputs(const Session&) { broadcast_inputs(0, {}); }

std::optional<base::InputFileBytes> receive_inputs(const Session&) {
  std::uint8_t status = 0;
  std::uint64_t length = 0;
  MPI_Bcast(&status, 1, MPI_UINT8_T, kLeader, MPI_COMM_WORLD);
  MPI_Bcast(&length, 1, MPI_UINT64_T, kLeader, MPI_COMM_WORLD);
  if (status == 0) return std::nullopt;
  std::string message(length, '\0');
  MPI_Bcast(message.data(), checked_count(length), MPI_BYTE, kLeader, MPI_COMM_WORLD);
  return decode_inputs(message);
}

void serve(const Session&, const studies::TaskHandler& handler) {
  for (;;) {
    const MPI_Status status = wait_for(kLeader);
    const std::string message = receive(status);
    if (status.MPI_TAG == kRelease) return;
    const std::uint64_t task = task_of(message);
    std::string body(1, '\1');  // then the result, or '\0' then the error
    try {
      body += handler(std::string_view(message).substr(sizeof task));
    } catch (const std::exception& error) {
      body.assign(1, '\0');
      body += error.what();
    }
    send(kLeader, kResult, numbered(task, body));
  }
}

LeaderRunner::LeaderRunner(const Session& session, const base::InputFileBytes& inputs,
                           studies::TaskHandler local_handler)
    : session_(session), local_handler_(std::move(local_handler)) {
  broadcast_inputs(1, encode_inputs(inputs));
}

LeaderRunner::~LeaderRunner() {
  for (int worker = 1; worker < session_.size(); ++worker) {
    MPI_Send(nullptr, 0, MPI_BYTE, worker, kRelease, MPI_COMM_WORLD);
  }
}

std::vector<std::string> LeaderRunner::run(const std::vector<std::string>& requests,
                                           const studies::TaskFinished& finished) {
  const std::size_t count = requests.size();
  std::vector<std::string> results(count);
  std::vector<std::exception_ptr> errors(count);
  std::mutex lock;
  std::size_t next = 0;
  std::size_t done = 0;
  const auto take = [&]() -> std::optional<std::size_t> {
    const std::lock_guard guard(lock);
    if (next == count) return std::nullopt;
    return next++;
  };
  const auto finish = [&](std::size_t task) {
    const std::lock_guard guard(lock);
    ++done;
    try {
      if (finished) finished(done, task, results[task]);
    } catch (...) {  // a failing callback counts against its task, as on threads
      if (!errors[task]) errors[task] = std::current_exception();
    }
  };
  {
    std::jthread own_worker([&] {
      while (const auto task = take()) {
        try {
          results[*task] = local_handler_(requests[*task]);
        } catch (...) {
          errors[*task] = std::current_exception();
        }
        finish(*task);
      }
    });
    std::size_t busy = 0;
    const auto hand_out = [&](int worker) {
      if (const auto task = take()) {
        send(worker, kTask, numbered(*task, requests[*task]));
        ++busy;
      }
    };
    for (int worker = 1; worker < session_.size(); ++worker) hand_out(worker);
    while (busy > 0) {
      const MPI_Status status = wait_for(MPI_ANY_SOURCE);
      const std::string message = receive(status);
      --busy;
      const std::uint64_t task = task_of(message);
      const std::string_view body = std::string_view(message).substr(sizeof task);
      if (!body.empty() && body.front() == '\1') {
        results[task] = std::string(body.substr(1));
      } else {
        errors[task] = std::make_exception_ptr(std::runtime_error(
            fmt::format("rank {}: {}", status.MPI_SOURCE, body.empty() ? "no reply" : body.substr(1))));
      }
      finish(task);
      hand_out(status.MPI_SOURCE);
    }
  }
  for (const auto& error : errors) {
    if (error) std::rethrow_exception(error);
  }
  return results;
}

}  // namespace wetfront::cluster
