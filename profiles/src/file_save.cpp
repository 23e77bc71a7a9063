#include "wetfront/profiles/file_save.hpp"

#include <fcntl.h>
#include <fmt/format.h>
#include <unistd.h>

#include <atomic>
#include <cstdio>
#include <cstdlib>
#include <cerrno>
#include <system_error>

namespace wetfront::profiles {
namespace {

std::filesystem::path temporary_path_for(const std::filesystem::path& path) {
  static std::atomic<unsigned> counter{0};
  const std::string name = fmt::format("{}{}-{}.partial", temporary_prefix(path), getpid(), counter++);
  return path.parent_path() / name;
}

int stop_step() {
  const char* text = std::getenv("WETFRONT_STOP_AT_WRITE_STEP");
  return text ? std::atoi(text) : 0;
}

// Writes all bytes to a new file and forces them to the disk before it takes its final name.
void write_new_file(const std::filesystem::path& path, std::string_view bytes) {
  const int descriptor = open(path.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, 0644);
  if (descriptor < 0)
    throw std::system_error(errno, std::generic_category(), fmt::format("creating '{}'", path.string()));
  std::size_t written = 0;
  int error = 0;
  while (written < bytes.size() && error == 0) {
    const ssize_t count = write(descriptor, bytes.data() + written, bytes.size() - written);
    if (count > 0)
      written += static_cast<std::size_t>(count);
    else if (count < 0 && errno != EINTR)
      error = errno;
  }
  if (error == 0 && fsync(descriptor) != 0) error = errno;
  if (close(descriptor) != 0 && error == 0) error = errno;
  if (error != 0)
    throw std::system_error(error, std::generic_category(),
                            fmt::format("writing '{}' ({} of {} bytes written)", path.string(), written, bytes.size()));
}

}  // namespace

std::string temporary_prefix(const std::filesystem::path& path) {
  return fmt::format(".{}.", path.filename().string());
}

void write_step(const char* what) {
  static const int stop_at = stop_step();
  static std::atomic<int> steps{0};
  const int step = ++steps;
  if (stop_at > 0 && step == stop_at) {
    fmt::print(stderr, "wetfront: stopped at write step {} ({}) by WETFRONT_STOP_AT_WRITE_STEP\n", step, what);
    std::fflush(stderr);
    std::_Exit(86);
  }
}

StagedFile::StagedFile(std::filesystem::path path, std::string_view bytes)
    : path_(std::move(path)), temporary_(temporary_path_for(path_)) {
  try {
    write_new_file(temporary_, bytes);
  } catch (...) {
    std::error_code ignored;
    std::filesystem::remove(temporary_, ignored);
    throw;
  }
  write_step("temporary file written");
}

StagedFile::StagedFile(std::filesystem::path path) : path_(std::move(path)), temporary_(temporary_path_for(path_)) {}

void StagedFile::written() {
  const int descriptor = open(temporary_.c_str(), O_RDONLY | O_CLOEXEC);
  int error = descriptor < 0 ? errno : 0;
  if (error == 0 && fsync(descriptor) != 0) error = errno;
  if (descriptor >= 0 && close(descriptor) != 0 && error == 0) error = errno;
  if (error != 0)
    throw std::system_error(error, std::generic_category(), fmt::format("writing '{}'", temporary_.string()));
  write_step("temporary file written");
}

StagedFile::~StagedFile() {
  if (committed_) return;
  std::error_code ignored;
  std::filesystem::remove(temporary_, ignored);
}

void StagedFile::commit() {
  std::filesystem::rename(temporary_, path_);
  committed_ = true;
  write_step("file renamed");
}

void save_file_image(const std::filesystem::path& path, const std::vector<char>& bytes) {
  StagedFile(path, std::string_view(bytes.data(), bytes.size())).commit();
}

}  // namespace wetfront::profiles
