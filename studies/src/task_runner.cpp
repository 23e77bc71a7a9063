#include "wetfront/studies/task_runner.hpp"

#include "wetfront/studies/parallel_batch.hpp"

namespace wetfront::studies {

ThreadTaskRunner::ThreadTaskRunner(TaskHandler handler, unsigned threads)
    : handler_(std::move(handler)), threads_(threads) {}

std::vector<std::string> ThreadTaskRunner::run(const std::vector<std::string>& requests,
                                               const std::function<void(std::size_t)>& finished) {
  std::vector<std::string> results(requests.size());
  run_batch(
      requests.size(), threads_, [&](std::size_t i) { results[i] = handler_(requests[i]); }, finished);
  return results;
}

unsigned ThreadTaskRunner::workers() const { return thread_count(threads_); }

}  // namespace wetfront::studies
