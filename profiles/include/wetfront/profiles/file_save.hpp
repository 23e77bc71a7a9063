// Saving finished file contents so that the target is either the old file or the whole new
// one: the bytes go to a temporary name in the same directory, are forced to the disk, and the
// file is renamed (atomic on POSIX file systems).
#pragma once

#include <filesystem>
#include <string_view>
#include <vector>

namespace wetfront::profiles {

// A file written under a temporary name and given its name only by commit(), so that several
// files can be made complete before any of them appears. The temporary file is removed if the
// object goes away uncommitted (an error in between). Throws std::system_error naming the path.
class StagedFile {
 public:
  StagedFile(std::filesystem::path path, std::string_view bytes);
  // Only names the temporary file, for a writer that creates and fills it itself (the HDF5
  // library writing a run file as the run goes); it then calls written().
  explicit StagedFile(std::filesystem::path path);
  ~StagedFile();
  StagedFile(const StagedFile&) = delete;
  StagedFile& operator=(const StagedFile&) = delete;
  const std::filesystem::path& temporary() const { return temporary_; }
  // Forces the temporary file, filled and closed by its writer, to the disk.
  void written();
  void commit();

 private:
  std::filesystem::path path_;
  std::filesystem::path temporary_;
  bool committed_ = false;
};

// StagedFile(path, bytes).commit().
void save_file_image(const std::filesystem::path& path, const std::vector<char>& bytes);

// Test hook for kills during a write: every step of saving files (a temporary file complete, a
// rename done, a lock taken) counts one; when the environment variable
// WETFRONT_STOP_AT_WRITE_STEP is k, the program ends at once (exit code 86, nothing cleaned
// up, as if killed) at step k. `what` names the step for the message on stderr.
void write_step(const char* what);

// The name StagedFile gives its temporary file starts with this: ".NAME." (and ends ".partial").
std::string temporary_prefix(const std::filesystem::path& path);

// True when `path` is an HDF5 file whose root attribute record_format names a wetfront record
// (a run record or a study file). Never throws; prints nothing.
bool is_wetfront_hdf5(const std::filesystem::path& path);

// Switches off the HDF5 library's own error printing for this thread: wetfront reports HDF5
// failures in its own messages.
void silence_hdf5_error_printing();

}  // namespace wetfront::profiles
