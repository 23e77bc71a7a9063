#include "wetfront/site/output_files.hpp"

#include <fcntl.h>
#include <sys/file.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <chrono>
#include <cstring>
#include <fstream>
#include <random>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/profiles/file_save.hpp"

namespace wetfront::site {
namespace fs = std::filesystem;
namespace {

fs::path folder_of(const fs::path& file) { return file.parent_path().empty() ? fs::path(".") : file.parent_path(); }

void check_folder(const fs::path& output) {
  const fs::path folder = folder_of(output);
  std::error_code error;
  const fs::file_status status = fs::status(folder, error);
  if (!fs::exists(status))
    throw base::InputError(output.string(), 0, "",
                           fmt::format("the output folder '{}' does not exist; create it first", folder.string()));
  if (!fs::is_directory(status))
    throw base::InputError(output.string(), 0, "",
                           fmt::format("the output folder '{}' is not a folder", folder.string()));
  if (access(folder.c_str(), W_OK | X_OK) != 0)
    throw base::InputError(
        output.string(), 0, "",
        fmt::format("cannot write in the output folder '{}' ({})", folder.string(), std::strerror(errno)));
}

bool same_file(const fs::path& a, const fs::path& b) {
  std::error_code error;
  const bool same = fs::equivalent(a, b, error);
  return !error && same;
}

// The first line that is neither blank nor a '#' comment, without a byte-order mark.
std::string header_line(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  std::string line;
  bool first = true;
  while (std::getline(in, line)) {
    if (first && line.rfind("\xEF\xBB\xBF", 0) == 0) line.erase(0, 3);
    first = false;
    if (!line.empty() && line.back() == '\r') line.pop_back();
    if (line.empty() || line[0] == '#') continue;
    return line;
  }
  return {};
}

bool ends_with(const std::string& text, const std::string& end) {
  return text.size() >= end.size() && text.compare(text.size() - end.size(), end.size(), end) == 0;
}

void remove_stale_temporaries(const fs::path& output) {
  const std::string prefix = profiles::temporary_prefix(output);
  std::error_code error;
  for (fs::directory_iterator it(folder_of(output), error), end; !error && it != end; it.increment(error)) {
    const std::string name = it->path().filename().string();
    if (name.rfind(prefix, 0) == 0 && ends_with(name, ".partial")) {
      std::error_code ignored;
      fs::remove(it->path(), ignored);
    }
  }
}

}  // namespace

bool written_by_wetfront(const fs::path& path) {
  if (profiles::is_wetfront_hdf5(path)) return true;
  std::ifstream in(path, std::ios::binary);
  std::string first;
  std::getline(in, first);
  if (first.rfind(kLayerBlockMark, 0) == 0) return true;
  const std::string header = header_line(path);
  return ends_with(header, std::string(",") + kRunIdColumn);
}

void check_outputs(const OutputPlan& plan) {
  for (const fs::path& output : plan.outputs) {
    if (output.empty()) continue;
    if (output.filename().empty() || output.filename() == "." || output.filename() == "..")
      throw base::InputError(output.string(), 0, "", "the output path names a folder, not a file");
    check_folder(output);
    std::error_code error;
    const fs::file_status status = fs::status(output, error);
    if (fs::is_directory(status))
      throw base::InputError(output.string(), 0, "", "is a folder; give the name of a file to write");
    for (const fs::path& input : plan.inputs) {
      if (!input.empty() && same_file(output, input))
        throw base::InputError(output.string(), 0, "",
                               fmt::format("is also an input of this command ('{}'); wetfront never writes over a "
                                           "file it reads: choose another output name",
                                           input.string()));
    }
    if (fs::exists(status) && !fs::is_regular_file(status))
      throw base::InputError(output.string(), 0, "", "exists and is not an ordinary file; choose another output name");
    if (fs::exists(status) && !plan.force && !written_by_wetfront(output))
      throw base::InputError(output.string(), 0, "",
                             fmt::format("exists and was not written by wetfront; it is left as it is. Choose "
                                         "another output name, or give {} to replace it",
                                         plan.force_option));
  }
}

OutputGuard::OutputGuard(const OutputPlan& plan) {
  check_outputs(plan);
  fs::path main;
  for (const fs::path& output : plan.outputs) {
    if (!output.empty()) {
      main = output;
      break;
    }
  }
  if (main.empty()) return;
  lock_path_ = folder_of(main) / fmt::format(".{}.lock", main.filename().string());
  // The lock file is removed on release; a writer that locked a file just removed tries again
  // on the new one (its inode differs from the path's), so two writers never hold both.
  for (int attempt = 0; attempt < 100 && lock_descriptor_ < 0; ++attempt) {
    const int descriptor = open(lock_path_.c_str(), O_RDWR | O_CREAT | O_CLOEXEC, 0644);
    if (descriptor < 0)
      throw base::InputError(
          main.string(), 0, "",
          fmt::format("cannot create the lock file '{}' ({})", lock_path_.string(), std::strerror(errno)));
    if (flock(descriptor, LOCK_EX | LOCK_NB) != 0) {
      const int cause = errno;
      close(descriptor);
      if (cause == EWOULDBLOCK)
        throw base::InputError(main.string(), 0, "",
                               "another wetfront command is writing this output now; wait until it has finished, "
                               "or choose another output name");
      throw base::InputError(main.string(), 0, "",
                             fmt::format("cannot lock '{}' ({})", lock_path_.string(), std::strerror(cause)));
    }
    struct stat held {
    }, named{};
    if (fstat(descriptor, &held) == 0 && stat(lock_path_.c_str(), &named) == 0 && held.st_dev == named.st_dev &&
        held.st_ino == named.st_ino) {
      lock_descriptor_ = descriptor;
    } else {
      close(descriptor);
    }
  }
  if (lock_descriptor_ < 0)
    throw base::InputError(main.string(), 0, "", fmt::format("cannot lock '{}'", lock_path_.string()));
  profiles::write_step("output lock taken");
  for (const fs::path& output : plan.outputs) {
    if (!output.empty()) remove_stale_temporaries(output);
  }
}

OutputGuard::~OutputGuard() {
  if (lock_descriptor_ < 0) return;
  std::error_code ignored;
  fs::remove(lock_path_, ignored);  // while still held, so nobody else is between lock and removal
  close(lock_descriptor_);          // closing releases the lock
}

std::vector<fs::path> site_input_files(const SiteSetup& site) {
  std::vector<fs::path> files{site.site_file, site.rain.path};
  if (site.irrigation) files.push_back(site.irrigation->path);
  if (site.pan.readings) files.push_back(site.pan.readings->path);
  if (site.pan.daily_evaporation) files.push_back(site.pan.daily_evaporation->path);
  for (const auto& sensor : site.sensors) files.push_back(sensor.readings);
  return files;
}

std::string new_run_id() {
  const auto now = std::chrono::system_clock::now();
  const auto seconds = std::chrono::duration_cast<std::chrono::seconds>(now.time_since_epoch()).count();
  std::random_device device;
  const std::uint64_t bits = (static_cast<std::uint64_t>(device()) << 32) ^ device();
  return fmt::format("{:x}-{:x}-{:012x}", seconds, static_cast<unsigned>(getpid()), bits & 0xffffffffffffULL);
}

std::string csv_run_id(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) return {};
  std::string line;
  bool header_seen = false;
  while (std::getline(in, line)) {
    if (!line.empty() && line.back() == '\r') line.pop_back();
    if (line.empty() || line[0] == '#') continue;
    if (!header_seen) {
      if (!ends_with(line, std::string(",") + kRunIdColumn)) return {};
      header_seen = true;
      continue;
    }
    const auto comma = line.rfind(',');
    return comma == std::string::npos ? std::string() : line.substr(comma + 1);
  }
  return {};
}

std::filesystem::path beside(const std::filesystem::path& path, const std::string& suffix) {
  std::filesystem::path out = path;
  out.replace_filename(path.stem().string() + suffix);
  return out;
}

}  // namespace wetfront::site
