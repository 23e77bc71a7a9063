// Writing a run file as the run goes: each profile is appended to chunked datasets along the
// unlimited time dimension of a temporary file beside the target, so memory does not grow with
// the number of output times; the rest of the record (balances, visits, inputs, checks: a few
// numbers per output time) is written when the run is over, and only then does the file take
// its name (file_save.hpp). The layout is that of write_run (docs/hdf5-layout.md).
#pragma once

#include <filesystem>
#include <memory>
#include <span>
#include <string>

#include "wetfront/profiles/file_save.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles {

class RunFileStream {
 public:
  // Creates the temporary file ".NAME.PID-N.partial" beside `path` with the depth axes of the grid
  // and empty profile datasets (a write step: "temporary run file begun"). `run_start_date` is the
  // zero of the time axis. Throws RunFileError naming `path`.
  RunFileStream(const std::filesystem::path& path, const std::string& run_start_date,
                std::span<const double> cell_depths_cm, std::span<const double> face_depths_cm);
  // Removes the temporary file unless it was committed.
  ~RunFileStream();
  RunFileStream(const RunFileStream&) = delete;
  RunFileStream& operator=(const RunFileStream&) = delete;

  // The profile at the next output time (times increasing, one value per cell and face).
  // Throws RunFileError.
  void append(const solver::ProfileSnapshot& snapshot);
  std::size_t profiles_appended() const { return appended_; }

  // Writes the rest of `record`, whose profiles are the ones appended (record.run.profiles is
  // empty, or holds exactly those), and forces the file to the disk (a write step: "temporary
  // file written"). Throws RunFileError naming the first inconsistency or the write failure.
  void finish(const RunRecord& record);
  // Gives the finished file its name (a write step: "file renamed"). Throws RunFileError.
  void commit();

 private:
  struct OpenFile;
  std::filesystem::path path_;
  StagedFile staged_;
  std::unique_ptr<OpenFile> file_;
  std::size_t cells_ = 0;
  std::size_t appended_ = 0;
  double last_time_days_ = 0;
};

}  // namespace wetfront::profiles
