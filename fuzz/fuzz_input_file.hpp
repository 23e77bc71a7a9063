// The fuzz targets hand their bytes to readers that take a path: each input is written to one
// file in a private scratch folder (in /dev/shm when there is one), replaced on every call.
#pragma once

#include <unistd.h>

#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <fstream>
#include <string>

namespace wetfront::fuzz {

inline std::filesystem::path scratch_folder() {
  static const std::filesystem::path folder = [] {
    const std::filesystem::path base =
        std::filesystem::is_directory("/dev/shm") ? "/dev/shm" : std::filesystem::temp_directory_path();
    std::filesystem::path dir = base / ("wetfront-fuzz-" + std::to_string(getpid()));
    std::filesystem::create_directories(dir);
    return dir;
  }();
  return folder;
}

// Writes the bytes to scratch_folder()/name and returns the path.
inline std::filesystem::path input_file(const std::string& name, const std::uint8_t* data, std::size_t size) {
  const std::filesystem::path path = scratch_folder() / name;
  std::ofstream out(path, std::ios::binary | std::ios::trunc);
  out.write(reinterpret_cast<const char*>(data), static_cast<std::streamsize>(size));
  return path;
}

}  // namespace wetfront::fuzz
