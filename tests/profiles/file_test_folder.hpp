// A fresh folder per test for the tests that write run files (removed afterwards), the names in
// it, the datasets of a written file, and the message of an expected RunFileError.
#pragma once

#include <fmt/format.h>
#include <gtest/gtest.h>
#include <hdf5.h>
#include <unistd.h>

#include <algorithm>
#include <filesystem>
#include <functional>
#include <initializer_list>
#include <string>
#include <vector>

#include "wetfront/profiles/run_file.hpp"

namespace wetfront::profiles::testing {

class FileTestFolder : public ::testing::Test {
 protected:
  void SetUp() override {
    const auto* info = ::testing::UnitTest::GetInstance()->current_test_info();
    directory_ = std::filesystem::temp_directory_path() /
                 fmt::format("wetfront-profiles-{}-{}-{}", getpid(), info->test_suite_name(), info->name());
    std::filesystem::remove_all(directory_);
    std::filesystem::create_directories(directory_);
  }
  void TearDown() override { std::filesystem::remove_all(directory_); }

  // Names of everything in the test directory (to see leftover temporary files), sorted.
  std::vector<std::string> directory_listing() const {
    std::vector<std::string> names;
    for (const auto& entry : std::filesystem::directory_iterator(directory_))
      names.push_back(entry.path().filename().string());
    std::sort(names.begin(), names.end());
    return names;
  }

  std::filesystem::path directory_;
};

// Opens the HDF5 file `path` read-only, calls check(file, name) for each dataset name, closes it.
template <class Check>
void check_datasets(const std::filesystem::path& path, std::initializer_list<const char*> names, Check check) {
  const hid_t file = H5Fopen(path.c_str(), H5F_ACC_RDONLY, H5P_DEFAULT);
  ASSERT_GE(file, 0) << path;
  for (const char* name : names) check(file, name);
  H5Fclose(file);
}

// The message of the RunFileError that `action` throws; a test failure when it throws none.
inline std::string message_of(const std::function<void()>& action) {
  try {
    action();
  } catch (const RunFileError& error) {
    return error.what();
  }
  ADD_FAILURE() << "expected RunFileError";
  return {};
}

}  // namespace wetfront::profiles::testing
