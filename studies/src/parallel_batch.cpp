#include "wetfront/studies/parallel_batch.hpp"

#include <algorithm>
#include <atomic>
#include <exception>
#include <mutex>
#include <thread>
#include <vector>

namespace wetfront::studies {

unsigned thread_count(unsigned requested) {
  if (requested > 0) return requested;
  return std::max(1u, std::thread::hardware_concurrency());
}

void run_batch(std::size_t count, unsigned threads, const std::function<void(std::size_t)>& task,
               const std::function<void(std::size_t)>& finished) {
  std::vector<std::exception_ptr> errors(count);
  std::atomic<std::size_t> next{0};
  std::size_t done = 0;
  std::mutex lock;
  const auto work = [&] {
    for (std::size_t i = next++; i < count; i = next++) {
      try {
        task(i);
      } catch (...) {
        errors[i] = std::current_exception();
      }
      try {  // nothing may leave a worker thread: a failing callback counts against its task
        const std::lock_guard guard(lock);
        ++done;
        if (finished) finished(done);
      } catch (...) {
        if (!errors[i]) errors[i] = std::current_exception();
      }
    }
  };
  const std::size_t workers = std::min<std::size_t>(thread_count(threads), count);
  if (workers <= 1) {
    work();
  } else {
    std::vector<std::jthread> pool;
    for (std::size_t w = 0; w < workers; ++w) pool.emplace_back(work);
  }
  for (const auto& error : errors) {
    if (error) std::rethrow_exception(error);
  }
}

}  // namespace wetfront::studies
