// The batch interface of a study: many independent tasks, each a request in bytes answered by
// one handler with a result in bytes. Because requests and results are bytes, a runner may
// answer them on this machine's threads (ThreadTaskRunner) or in other processes (the MPI
// runner of cluster/), and a study's code does not know which.
#pragma once

#include <cstddef>
#include <functional>
#include <string>
#include <string_view>
#include <vector>

namespace wetfront::studies {

// Answers one request. Must give the same bytes for the same request wherever it runs; a task
// that fails says so in its result rather than throwing.
using TaskHandler = std::function<std::string(std::string_view request)>;

// Called after each task, one call at a time, with the number of tasks done so far, the task's
// number and its result (empty when the handler threw).
using TaskFinished = std::function<void(std::size_t done, std::size_t task, std::string_view result)>;

class TaskRunner {
 public:
  virtual ~TaskRunner() = default;
  // The results of every request, in the order of the requests. A handler (or a finished
  // callback) that throws stops nothing: the other tasks still run, and then the error of the
  // lowest-numbered failing task is thrown.
  virtual std::vector<std::string> run(const std::vector<std::string>& requests, const TaskFinished& finished) = 0;
  // How many tasks run at once, for reports.
  virtual unsigned workers() const = 0;
};

// The tasks on threads of this process (parallel_batch.hpp).
class ThreadTaskRunner final : public TaskRunner {
 public:
  // threads: 0 for all cores.
  ThreadTaskRunner(TaskHandler handler, unsigned threads);
  std::vector<std::string> run(const std::vector<std::string>& requests, const TaskFinished& finished) override;
  unsigned workers() const override;

 private:
  TaskHandler handler_;
  unsigned threads_;
};

}  // namespace wetfront::studies
