// Run files written as the run goes (RunFileStream): the same content as the file built whole in
// memory before, the profiles along an unlimited time dimension, and a writer killed in the middle
// leaving the old file as it was.
#include <fmt/format.h>
#include <gtest/gtest.h>
#include <hdf5.h>
#include <sys/wait.h>
#include <unistd.h>

#include <csignal>
#include <filesystem>
#include <fstream>
#include <iterator>

#include "file_test_folder.hpp"
#include "hdf5_content.hpp"
#include "sample_record.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/run_file_stream.hpp"

namespace wetfront::profiles {
namespace {

namespace fs = std::filesystem;

// The sample record written by the writer that built the whole file in memory (commit b826002),
// before the profiles were streamed.
const fs::path kWrittenWhole = fs::path(WETFRONT_SOURCE_DIR) / "tests/profiles/data/sample-run-written-whole.h5";

using RunFileStreamTest = testing::FileTestFolder;
using testing::message_of;

// The record as a streamed run hands it over: the profiles went to the stream, not the record.
void stream_record(const fs::path& path, const RunRecord& record) {
  RunFileStream stream(path, record.run_start_date, record.run.cell_depths_cm, record.run.face_depths_cm);
  for (const solver::ProfileSnapshot& snapshot : record.run.profiles) stream.append(snapshot);
  RunRecord without_profiles = record;
  without_profiles.run.profiles.clear();
  stream.finish(without_profiles);
  stream.commit();
}

std::string bytes_of(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  return {std::istreambuf_iterator<char>(in), {}};
}

void expect_same_lines(const std::vector<std::string>& expected, const std::vector<std::string>& actual) {
  ASSERT_EQ(expected.size(), actual.size());
  for (std::size_t i = 0; i < expected.size(); ++i) EXPECT_EQ(expected[i], actual[i]) << "line " << i;
}

TEST_F(RunFileStreamTest, StreamedFileHoldsWhatTheFileBuiltWholeHeld) {
  const fs::path streamed = directory_ / "streamed.h5";
  stream_record(streamed, testing::sample_record());
  expect_same_lines(wetfront::testing::hdf5_content(kWrittenWhole), wetfront::testing::hdf5_content(streamed));
}

TEST_F(RunFileStreamTest, WriteRunHoldsWhatTheFileBuiltWholeHeld) {
  const fs::path written = directory_ / "written.h5";
  write_run(written, testing::sample_record());
  expect_same_lines(wetfront::testing::hdf5_content(kWrittenWhole), wetfront::testing::hdf5_content(written));
}

TEST_F(RunFileStreamTest, ProfilesLieAlongTheUnlimitedTimeDimension) {
  const fs::path path = directory_ / "season.h5";
  stream_record(path, testing::sample_record());
  const auto names = {"time",      "pressure_head", "water_content", "conductivity",
                      "sink_rate", "face_flux",     "ponded_depth"};
  testing::check_datasets(path, names, [](hid_t file, const char* name) {
    const hid_t dataset = H5Dopen2(file, name, H5P_DEFAULT);
    const hid_t space = H5Dget_space(dataset);
    hsize_t dims[2] = {0, 0}, max_dims[2] = {0, 0};
    H5Sget_simple_extent_dims(space, dims, max_dims);
    EXPECT_EQ(dims[0], 31u) << name;
    EXPECT_EQ(max_dims[0], H5S_UNLIMITED) << name;
    H5Sclose(space);
    H5Dclose(dataset);
  });
}

TEST_F(RunFileStreamTest, KilledWhileWritingProfilesTheOldFileStaysAsItWas) {
  const fs::path path = directory_ / "season.h5";
  write_run(path, testing::sample_failed_record());
  const std::string old_bytes = bytes_of(path);
  const RunRecord record = testing::sample_record();
  const pid_t child = fork();
  ASSERT_GE(child, 0);
  if (child == 0) {  // a writer killed after ten profiles, its temporary file flushed to the disk
    RunFileStream stream(path, record.run_start_date, record.run.cell_depths_cm, record.run.face_depths_cm);
    for (std::size_t i = 0; i < 10; ++i) stream.append(record.run.profiles[i]);
    hid_t open_file = -1;
    if (H5Fget_obj_ids(H5F_OBJ_ALL, H5F_OBJ_FILE, 1, &open_file) == 1) H5Fflush(open_file, H5F_SCOPE_GLOBAL);
    kill(getpid(), SIGKILL);
    _exit(1);
  }
  int status = 0;
  waitpid(child, &status, 0);
  ASSERT_TRUE(WIFSIGNALED(status) && WTERMSIG(status) == SIGKILL);
  EXPECT_EQ(bytes_of(path), old_bytes);
  const std::vector<std::string> names = directory_listing();
  ASSERT_EQ(names.size(), 2u);
  // The temporary file carries the prefix OutputGuard removes on the next run.
  EXPECT_EQ(names[0].rfind(temporary_prefix(path), 0), 0u) << names[0];
  EXPECT_TRUE(names[0].ends_with(".partial")) << names[0];
  EXPECT_EQ(names[1], "season.h5");
}

TEST_F(RunFileStreamTest, AStreamGivenUpLeavesNoTemporaryFile) {
  const RunRecord record = testing::sample_record();
  {
    RunFileStream stream(directory_ / "season.h5", record.run_start_date, record.run.cell_depths_cm,
                         record.run.face_depths_cm);
    stream.append(record.run.profiles[0]);
    EXPECT_EQ(directory_listing().size(), 1u);
  }
  EXPECT_TRUE(directory_listing().empty());
}

TEST_F(RunFileStreamTest, AProfileOfTheWrongShapeOrOrderIsRefused) {
  const RunRecord record = testing::sample_record();
  const fs::path path = directory_ / "season.h5";
  RunFileStream stream(path, record.run_start_date, record.run.cell_depths_cm, record.run.face_depths_cm);
  solver::ProfileSnapshot short_profile = record.run.profiles[0];
  short_profile.head_cm.pop_back();
  EXPECT_NE(message_of([&] { stream.append(short_profile); }).find("pressure_head has 19 values, expected 20"),
            std::string::npos);
  stream.append(record.run.profiles[1]);
  EXPECT_NE(message_of([&] { stream.append(record.run.profiles[0]); }).find("at day 0 does not follow day 1"),
            std::string::npos);
}

TEST_F(RunFileStreamTest, BalanceRowsMustMatchTheProfilesWritten) {
  RunRecord record = testing::sample_record();
  const fs::path path = directory_ / "season.h5";
  RunFileStream stream(path, record.run_start_date, record.run.cell_depths_cm, record.run.face_depths_cm);
  for (std::size_t i = 0; i < 5; ++i) stream.append(record.run.profiles[i]);
  record.run.profiles.clear();
  const std::string message = message_of([&] { stream.finish(record); });
  EXPECT_NE(message.find("31 balance rows for 5 profiles written"), std::string::npos) << message;
  EXPECT_NE(message.find(path.string()), std::string::npos) << message;
}

TEST_F(RunFileStreamTest, AReaderOfTheReportCanLeaveTheProfilesOut) {
  const fs::path path = directory_ / "season.h5";
  const RunRecord written = testing::sample_record();
  write_run(path, written);
  const RunRecord read = read_run(path, ProfileReading::leave_out);
  EXPECT_TRUE(read.run.profiles.empty());
  EXPECT_EQ(read.run.cell_depths_cm, written.run.cell_depths_cm);
  EXPECT_EQ(read.run.balances.size(), written.run.balances.size());
  EXPECT_EQ(read.visit_balance, written.visit_balance);
  EXPECT_EQ(read_run(path).run.profiles.size(), written.run.profiles.size());
}

}  // namespace
}  // namespace wetfront::profiles
