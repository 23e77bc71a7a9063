// Reading a user's input files whole, from the disk or from bytes read once elsewhere.
//
// A study spread over MPI ranks reads the user's files on rank 0 only: rank 0 records the bytes
// of every file its loaders read (InputFileRecording) and sends them to the other ranks, which
// parse the same bytes from memory (InputFilesFromMemory) with the same loaders, so that every
// rank builds the same site and the same errors name the same files and lines.
//
// The mode is one per process (the loaders are many and deep; threading a file source through
// each of them would touch every reader). It changes only while no loader runs: a recording or
// a memory view is opened before a study loads its inputs and closed after.
#pragma once

#include <filesystem>
#include <map>
#include <optional>
#include <string>

namespace wetfront::base {

// Path as the loaders named it -> the file's bytes, or nullopt for a file that could not be
// opened (so that a missing file fails on every rank with the same message).
using InputFileBytes = std::map<std::string, std::optional<std::string>>;

// The whole contents of `path`, or nullopt when it cannot be opened.
std::optional<std::string> read_input_file(const std::filesystem::path& path);

// Whether `path` names a readable regular file (not a folder).
bool is_input_file(const std::filesystem::path& path);

// While one lives, every file read through read_input_file or checked by is_input_file is kept.
class InputFileRecording {
 public:
  InputFileRecording();
  ~InputFileRecording();
  InputFileRecording(const InputFileRecording&) = delete;
  InputFileRecording& operator=(const InputFileRecording&) = delete;
  // The files read so far.
  InputFileBytes files() const;
};

// While one lives, read_input_file and is_input_file answer from `files` only, never the disk;
// a path not among them reads as missing.
class InputFilesFromMemory {
 public:
  explicit InputFilesFromMemory(InputFileBytes files);
  ~InputFilesFromMemory();
  InputFilesFromMemory(const InputFilesFromMemory&) = delete;
  InputFilesFromMemory& operator=(const InputFilesFromMemory&) = delete;
};

}  // namespace wetfront::base
