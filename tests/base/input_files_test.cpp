// Input files read once and served from memory (base/input_files.hpp), as the ranks of an MPI
// study use them: the bytes recorded on one side are what the other side reads.
#include <filesystem>
#include <fstream>

#include <gtest/gtest.h>

#include "wetfront/base/csv_table.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/input_files.hpp"

namespace wetfront::base {
namespace {

class InputFilesTest : public ::testing::Test {
 protected:
  void SetUp() override {
    folder_ = std::filesystem::temp_directory_path() /
              ("wetfront-input-files-" + std::string(::testing::UnitTest::GetInstance()->current_test_info()->name()));
    std::filesystem::create_directories(folder_);
    std::ofstream(folder_ / "rain.csv") << "time [d],rain [mm]\n0,1.5\n1,0\n";
  }
  void TearDown() override { std::filesystem::remove_all(folder_); }
  std::filesystem::path folder_;
};

TEST_F(InputFilesTest, RecordedBytesAreServedFromMemoryWithoutTheDisk) {
  InputFileBytes files;
  {
    const InputFileRecording recording;
    EXPECT_EQ(CsvTable::read(folder_ / "rain.csv").row_count(), 2u);
    EXPECT_FALSE(read_input_file(folder_ / "missing.csv").has_value());
    files = recording.files();
  }
  ASSERT_EQ(files.size(), 2u);
  EXPECT_EQ(files.at((folder_ / "rain.csv").string()), "time [d],rain [mm]\n0,1.5\n1,0\n");
  std::filesystem::remove_all(folder_);  // the memory view must not need the disk

  const InputFilesFromMemory memory(files);
  EXPECT_TRUE(is_input_file(folder_ / "rain.csv"));
  EXPECT_FALSE(is_input_file(folder_ / "missing.csv"));
  EXPECT_FALSE(is_input_file(folder_ / "never-read.csv"));
  EXPECT_EQ(CsvTable::read(folder_ / "rain.csv").row_count(), 2u);
  // A file missing when recorded is missing from memory too, with the reader's own message.
  EXPECT_THROW(CsvTable::read(folder_ / "missing.csv"), InputError);
}

TEST_F(InputFilesTest, OnlyOneViewAtATime) {
  const InputFileRecording recording;
  EXPECT_THROW(InputFilesFromMemory{InputFileBytes{}}, std::logic_error);
  EXPECT_TRUE(is_input_file(folder_ / "rain.csv"));
  EXPECT_EQ(recording.files().size(), 1u);
}

}  // namespace
}  // namespace wetfront::base
