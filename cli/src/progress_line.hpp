// The progress line of commands that run many model runs, on stderr.
#pragma once

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <mutex>

#include <fmt/format.h>

namespace wetfront::cli {

// "12 of 50 runs, 8 s, about 25 s left" on stderr, at most twice a second.
class ProgressLine {
 public:
  explicit ProgressLine(bool quiet) : quiet_(quiet), started_(std::chrono::steady_clock::now()) {}
  ~ProgressLine() { finish(); }
  // Ends the line, so that what follows starts on a fresh one.
  void finish() {
    const std::lock_guard guard(lock_);
    if (printed_) std::fputc('\n', stderr);
    printed_ = false;
  }
  void operator()(std::size_t done, std::size_t planned, bool at_most) {
    if (quiet_) return;
    const std::lock_guard guard(lock_);
    const auto now = std::chrono::steady_clock::now();
    if (done < planned && now - last_ < std::chrono::milliseconds(500)) return;
    last_ = now;
    const double seconds = std::chrono::duration<double>(now - started_).count();
    const double left =
        done > 0 ? seconds / static_cast<double>(done) * static_cast<double>(planned - std::min(done, planned)) : 0.0;
    try {
      fmt::print(stderr, "\rwetfront: {} of {}{} runs, {:.0f} s, {} {:.0f} s left   ", done, at_most ? "at most " : "",
                 planned, seconds, at_most ? "at most about" : "about", left);
      std::fflush(stderr);
      printed_ = true;
    } catch (const std::exception&) {
      quiet_ = true;  // stderr is closed or full: the runs matter more than the progress line
    }
  }
  double seconds() const { return std::chrono::duration<double>(std::chrono::steady_clock::now() - started_).count(); }

 private:
  bool quiet_;
  bool printed_ = false;
  std::chrono::steady_clock::time_point started_;
  std::chrono::steady_clock::time_point last_{};
  std::mutex lock_;
};

}  // namespace wetfront::cli
