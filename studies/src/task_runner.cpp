#include "wetfront/studies/task_runner.hpp"

#include <exception>
#include <mutex>

#include "wetfront/studies/parallel_batch.hpp"

namespace wetfront::studies {

ThreadTaskRunner::ThreadTaskRunner(TaskHandler handler, unsigned threads)
    : handler_(std::move(handler)), threads_(threads) {}

std::vector<std::string> ThreadTaskRunner::run(const std::vector<std::string>& requests,
                                               const TaskFinished& finished) {
  std::vector<std::string> results(requests.size());
  std::mutex lock;
  std::size_t done = 0;
  run_batch(requests.size(), threads_, [&](std::size_t i) {
    std::exception_ptr error;
    try {
      results[i] = handler_(requests[i]);
    } catch (...) {
      error = std::current_exception();
    }
    {
      const std::lock_guard guard(lock);
      ++done;
      if (finished) finished(done, i, results[i]);
    }
    if (error) std::rethrow_exception(error);
  });
  return results;
}

unsigned ThreadTaskRunner::workers() const { return thread_count(threads_); }

}  // namespace wetfront::studies
