// Independent tasks on several threads. Task i writes only its own result, so what a batch
// computes does not depend on the number of threads or on the order the tasks finish in.
#pragma once

#include <cstddef>
#include <functional>

namespace wetfront::studies {

// The number of threads to use for `requested` (0: all the machine's cores, at least 1).
unsigned thread_count(unsigned requested);

// Runs task(i) for every i in [0, count) on thread_count(threads) threads (never more threads
// than tasks). After each task, finished(done) is called with the number of tasks done so far,
// under a lock (one call at a time). If tasks (or that callback) throw, every task still runs and
// the exception of the lowest-numbered failing task is rethrown after all threads have joined.
void run_batch(std::size_t count, unsigned threads, const std::function<void(std::size_t)>& task,
               const std::function<void(std::size_t done)>& finished = {});

}  // namespace wetfront::studies
