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
  ~StagedFile();
  StagedFile(const StagedFile&) = delete;
  StagedFile& operator=(const StagedFile&) = delete;
  void commit();

 private:
  std::filesystem::path path_;
  std::filesystem::path temporary_;
  bool committed_ = false;
};

// StagedFile(path, bytes).commit().
void save_file_image(const std::filesystem::path& path, const std::vector<char>& bytes);

}  // namespace wetfront::profiles
