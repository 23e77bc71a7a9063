// Keeping a command's outputs safe: nothing it reads and nothing wetfront did not write is
// ever replaced (unless forced), the output folder is checked before any work, one writer at a
// time holds the output set (an advisory lock), and temporary files left by a killed writer
// are removed. Every file of one output set carries the same run id.
#pragma once

#include <filesystem>
#include <string>
#include <vector>

#include "wetfront/site/site_file.hpp"

namespace wetfront::site {

struct OutputPlan {
  std::vector<std::filesystem::path> outputs;  // every file the command may write or remove; empty ones ignored
  std::vector<std::filesystem::path> inputs;   // every file the command reads; empty ones ignored
  bool force = false;                          // --force: replace files wetfront did not write
  std::string force_option = "--force";        // named in messages
};

// Throws base::InputError naming the path when an output's folder is missing, not a folder or
// not writable; when an output is a folder; when an output is the same file as an input (by
// device and inode, so other spellings, links and symbolic links count; --force does not
// allow this); and when an output exists and wetfront did not write it, unless plan.force.
void check_outputs(const OutputPlan& plan);

// True for files wetfront writes: an HDF5 run record or study file, a CSV file whose header
// ends with the column "run id", a layer block that starts with kLayerBlockMark.
bool written_by_wetfront(const std::filesystem::path& path);
inline constexpr const char* kLayerBlockMark = "# Layer block written by wetfront";
inline constexpr const char* kRunIdColumn = "run id";

// check_outputs, then an exclusive advisory lock (flock) on ".NAME.lock" beside the first output
// for as long as the object lives, then removal of temporary files (".NAME.*.partial") that a
// killed writer left beside any output. A second writer of the same outputs is refused with a
// message naming the file. The lock file is removed when the guard goes (a killed writer leaves
// it, empty and unlocked, for the next writer to reuse).
class OutputGuard {
 public:
  explicit OutputGuard(const OutputPlan& plan);
  ~OutputGuard();
  OutputGuard(const OutputGuard&) = delete;
  OutputGuard& operator=(const OutputGuard&) = delete;

 private:
  std::filesystem::path lock_path_;
  int lock_descriptor_ = -1;
};

// Every file a season run of `site` reads: the site file and each record it names.
std::vector<std::filesystem::path> site_input_files(const SiteSetup& site);

// A file beside `path` named after its stem: ("a/site.toml", "-sweep.h5") -> "a/site-sweep.h5".
std::filesystem::path beside(const std::filesystem::path& path, const std::string& suffix);

// A new run id: time and process in hex plus random bits, e.g. "20261202T155100Z-1a2b-9f3c0d1e".
std::string new_run_id();

// The run id in the last column of a wetfront CSV file (first data row); empty when the file
// does not exist, has no rows or no "run id" column.
std::string csv_run_id(const std::filesystem::path& path);

}  // namespace wetfront::site
