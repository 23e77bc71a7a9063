// Saving a finished file image so that the target is either the old file or the whole new
// one: the bytes go to a temporary name in the same directory, are forced to the disk, and
// the file is renamed (atomic on POSIX file systems).
#pragma once

#include <filesystem>
#include <vector>

namespace wetfront::profiles {

// Throws std::system_error (or std::filesystem::filesystem_error) naming the path; the
// temporary file is removed on failure.
void save_file_image(const std::filesystem::path& path, const std::vector<char>& bytes);

}  // namespace wetfront::profiles
