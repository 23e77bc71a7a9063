#include "wetfront/base/input_files.hpp"

#include <fstream>
#include <iterator>
#include <mutex>
#include <stdexcept>

namespace wetfront::base {
namespace {

enum class Mode { disk, recording, memory };

// The one per-process view of the input files (input_files.hpp says why there is one).
struct FileView {
  std::mutex lock;  // loaders of several sites may run on several threads
  Mode mode = Mode::disk;
  InputFileBytes files;
};

FileView& view() {
  static FileView the_view;
  return the_view;
}

std::optional<std::string> read_from_disk(const std::filesystem::path& path) {
  std::error_code error;
  if (std::filesystem::is_directory(path, error)) return std::nullopt;
  std::ifstream stream(path, std::ios::binary);
  if (!stream) return std::nullopt;
  return std::string((std::istreambuf_iterator<char>(stream)), std::istreambuf_iterator<char>());
}

void change_mode(Mode from, Mode to, InputFileBytes files) {
  FileView& v = view();
  const std::lock_guard guard(v.lock);
  if (v.mode != from) throw std::logic_error("input files: a recording or memory view is already open");
  v.mode = to;
  v.files = std::move(files);
}

}  // namespace

std::optional<std::string> read_input_file(const std::filesystem::path& path) {
  FileView& v = view();
  const std::string key = path.string();
  {
    const std::lock_guard guard(v.lock);
    if (v.mode == Mode::memory) {
      const auto found = v.files.find(key);
      return found == v.files.end() ? std::nullopt : found->second;
    }
    if (v.mode == Mode::disk) return read_from_disk(path);
  }
  auto bytes = read_from_disk(path);  // recording: read outside the lock, keep the first read
  const std::lock_guard guard(v.lock);
  if (v.mode == Mode::recording) v.files.emplace(key, bytes);
  return bytes;
}

bool is_input_file(const std::filesystem::path& path) {
  {
    FileView& v = view();
    const std::lock_guard guard(v.lock);
    if (v.mode == Mode::disk) {
      std::error_code error;
      return std::filesystem::is_regular_file(path, error);
    }
  }
  return read_input_file(path).has_value();
}

InputFileRecording::InputFileRecording() { change_mode(Mode::disk, Mode::recording, {}); }
InputFileRecording::~InputFileRecording() { change_mode(Mode::recording, Mode::disk, {}); }

InputFileBytes InputFileRecording::files() const {
  FileView& v = view();
  const std::lock_guard guard(v.lock);
  return v.files;
}

InputFilesFromMemory::InputFilesFromMemory(InputFileBytes files) {
  change_mode(Mode::disk, Mode::memory, std::move(files));
}
InputFilesFromMemory::~InputFilesFromMemory() { change_mode(Mode::memory, Mode::disk, {}); }

}  // namespace wetfront::base
