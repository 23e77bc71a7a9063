#include "wetfront/site/run_file_probe.hpp"

#include <fcntl.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <thread>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/file_save.hpp"
#include "wetfront/profiles/run_file.hpp"

namespace wetfront::site {
namespace {
constexpr int kReadOk = 0;
constexpr int kRefused = 17;  // RunFileError: the real read gives the message
}  // namespace

void probe_run_file(const std::string& path, int seconds) {
  std::fflush(stdout);
  std::fflush(stderr);
  const pid_t child = fork();
  if (child < 0) return;
  if (child == 0) {
    const int quiet = open("/dev/null", O_WRONLY);
    if (quiet >= 0) {
      dup2(quiet, STDOUT_FILENO);
      dup2(quiet, STDERR_FILENO);
    }
    profiles::silence_hdf5_error_printing();
    int code = kReadOk;
    try {
      (void)profiles::read_run(path, profiles::ProfileReading::leave_out);  // what `show` reads
    } catch (const profiles::RunFileError&) {
      code = kRefused;
    } catch (...) {
      code = 18;  // out of memory or another fault: damaged
    }
    std::_Exit(code);
  }
  const auto deadline = std::chrono::steady_clock::now() + std::chrono::seconds(seconds);
  int status = 0;
  for (;;) {
    const pid_t done = waitpid(child, &status, WNOHANG);
    if (done == child) break;
    if (done < 0) return;
    if (std::chrono::steady_clock::now() > deadline) {
      kill(child, SIGKILL);
      waitpid(child, &status, 0);
      throw base::InputError(path, 0, "",
                             fmt::format("the run file is damaged: reading it did not finish in {} s; run the site "
                                         "again to write a new run file",
                                         seconds));
    }
    std::this_thread::sleep_for(std::chrono::milliseconds(10));
  }
  if (WIFEXITED(status) && (WEXITSTATUS(status) == kReadOk || WEXITSTATUS(status) == kRefused)) return;
  throw base::InputError(path, 0, "",
                         fmt::format("the run file is damaged: the HDF5 library failed while reading it ({}); run the "
                                     "site again to write a new run file",
                                     WIFSIGNALED(status) ? fmt::format("signal {}", WTERMSIG(status))
                                                         : fmt::format("exit {}", WEXITSTATUS(status))));
}

}  // namespace wetfront::site
