// Run files: round trip of every field, self-description, and the write-then-rename rule.
#include <fmt/format.h>
#include <gtest/gtest.h>
#include <hdf5.h>
#include <hdf5_hl.h>
#include <sys/resource.h>
#include <unistd.h>

#include <csignal>

#include <filesystem>
#include <fstream>
#include <set>

#include "file_test_folder.hpp"
#include "record_comparison.hpp"
#include "sample_record.hpp"
#include "wetfront/profiles/run_file.hpp"

namespace wetfront::profiles {
namespace {

namespace fs = std::filesystem;

class RunFileTest : public testing::FileTestFolder {
 protected:
  // Writes `record` as `name` in the test directory, reads it back and expects every field
  // unchanged; returns what was read.
  RunRecord round_trip(const RunRecord& record, const std::string& name) const {
    write_run(directory_ / name, record);
    RunRecord read = read_run(directory_ / name);
    testing::expect_same_record(record, read);
    return read;
  }
};

using testing::message_of;

TEST_F(RunFileTest, CompleteRecordRoundTripsEveryField) {
  round_trip(testing::sample_record(), "season.h5");
  EXPECT_EQ(directory_listing(), std::vector<std::string>{"season.h5"});
}

TEST_F(RunFileTest, IncompleteRunRoundTripsItsFailure) {
  const RunRecord read = round_trip(testing::sample_failed_record(), "stopped.h5");
  const fs::path path = directory_ / "stopped.h5";
  EXPECT_FALSE(read.run.complete);
  ASSERT_TRUE(read.run.failure.has_value());
  EXPECT_EQ(read.run.failure->time_days, 12.5);
  EXPECT_EQ(read.run.failure->depth_cm, 37.5);
  EXPECT_EQ(read.run.profiles.size(), 13u);
  // The visit on day 21 lies beyond the failure: the table stops at the last day reached.
  EXPECT_EQ(read.visit_balance.back().end_day, 12.0);

  // What a general reader sees at the root.
  const hid_t file = H5Fopen(path.c_str(), H5F_ACC_RDONLY, H5P_DEFAULT);
  ASSERT_GE(file, 0);
  int complete = -1;
  double failure_time = 0;
  EXPECT_GE(H5LTget_attribute_int(file, "/", "complete", &complete), 0);
  EXPECT_GE(H5LTget_attribute_double(file, "/", "failure_time_days", &failure_time), 0);
  H5Fclose(file);
  EXPECT_EQ(complete, 0);
  EXPECT_EQ(failure_time, 12.5);
}

TEST_F(RunFileTest, RunWithoutPlanesSensorsOrOutputsRoundTrips) {
  RunRecord written = testing::sample_record();
  written.run.profiles.clear();
  written.run.balances.clear();
  written.flux_plane_depths_cm.clear();
  written.sensors.clear();
  written.forcing.clear();
  written.layers.clear();
  written.visit_days.clear();
  written.visit_balance.clear();
  written.darcy_estimate.reset();
  written.water_table_estimate.reset();
  written.stored_water.reset();
  written.run.complete = false;
  written.run.failure = solver::RunFailure{0.0, 0.0, "initial state inconsistent"};
  written.run_start_date = "2025-04-01T06:30";
  round_trip(written, "empty.h5");
}

// Every dataset in the file, by path.
herr_t collect_dataset(hid_t group, const char* name, const H5L_info_t*, void* data) {
  const hid_t object = H5Oopen(group, name, H5P_DEFAULT);
  if (object < 0) return -1;
  if (H5Iget_type(object) == H5I_DATASET) static_cast<std::vector<std::string>*>(data)->push_back(name);
  H5Oclose(object);
  return 0;
}

// A dimension without values: a scale whose NAME is netCDF-C's fixed phrase
// (nc4internal.h, DIM_WITHOUT_VARIABLE).
bool is_named_dimension(hid_t file, const std::string& name) {
  char text[128] = {};
  if (H5Aexists_by_name(file, name.c_str(), "NAME", H5P_DEFAULT) <= 0) return false;
  if (H5LTget_attribute_string(file, name.c_str(), "NAME", text) < 0) return false;
  return std::string(text).rfind("This is a netCDF dimension but not a netCDF variable.", 0) == 0;
}

bool is_text(hid_t file, const std::string& name) {
  const hid_t dataset = H5Dopen2(file, name.c_str(), H5P_DEFAULT);
  const hid_t type = H5Dget_type(dataset);
  const bool text = H5Tget_class(type) == H5T_STRING;
  H5Tclose(type);
  H5Dclose(dataset);
  return text;
}

// CF: every variable has a long_name; numbers have UDUNITS-2 units, text has none (CF-1.10
// section 3.1: units are not required for text). The named dimensions are not variables.
TEST_F(RunFileTest, EveryVariableCarriesLongNameAndNumbersCarryUnits) {
  const fs::path path = directory_ / "season.h5";
  write_run(path, testing::sample_record());
  const hid_t file = H5Fopen(path.c_str(), H5F_ACC_RDONLY, H5P_DEFAULT);
  ASSERT_GE(file, 0);
  std::vector<std::string> datasets;
  ASSERT_GE(H5Lvisit(file, H5_INDEX_NAME, H5_ITER_INC, collect_dataset, &datasets), 0);
  EXPECT_GE(datasets.size(), 40u);
  const std::set<std::string> without_units = {"inputs/layers/parameter_value", "sensor_comparison/metrics/bias",
                                               "sensor_comparison/metrics/root_mean_square_error"};
  for (const std::string& name : datasets) {
    if (is_named_dimension(file, name)) {
      EXPECT_EQ(H5Aexists_by_name(file, name.c_str(), "long_name", H5P_DEFAULT), 0) << name;
      continue;
    }
    EXPECT_GT(H5Aexists_by_name(file, name.c_str(), "long_name", H5P_DEFAULT), 0) << name;
    const bool needs_units = !is_text(file, name) && without_units.count(name) == 0;
    EXPECT_EQ(H5Aexists_by_name(file, name.c_str(), "units", H5P_DEFAULT) > 0, needs_units) << name;
  }
  char conventions[32] = {};
  ASSERT_GE(H5LTget_attribute_string(file, ".", "Conventions", conventions), 0);
  EXPECT_STREQ(conventions, "CF-1.10");
  char units[64] = {};
  ASSERT_GE(H5LTget_attribute_string(file, "time", "units", units), 0);
  EXPECT_STREQ(units, "days since 2025-04-01");
  // The profile datasets are attached to the time and cell-depth scales.
  const hid_t head = H5Dopen2(file, "pressure_head", H5P_DEFAULT);
  const hid_t time = H5Dopen2(file, "time", H5P_DEFAULT);
  const hid_t depth = H5Dopen2(file, "cell_depth", H5P_DEFAULT);
  EXPECT_GT(H5DSis_attached(head, time, 0), 0);
  EXPECT_GT(H5DSis_attached(head, depth, 1), 0);
  H5Dclose(depth);
  H5Dclose(time);
  H5Dclose(head);
  H5Fclose(file);
}

TEST_F(RunFileTest, WritingReplacesAnExistingFileWhole) {
  const fs::path path = directory_ / "season.h5";
  RunRecord first = testing::sample_record();
  first.site_name = "first version";
  write_run(path, first);
  RunRecord second = testing::sample_failed_record();
  second.site_name = "second version";
  write_run(path, second);
  testing::expect_same_record(second, read_run(path));
  EXPECT_EQ(directory_listing(), std::vector<std::string>{"season.h5"});
}

TEST_F(RunFileTest, FailureAfterTheFileIsWrittenLeavesNothingBehind) {
  // The target is a non-empty directory: the whole temporary file is written, then the
  // final rename fails. The temporary must go and the message must name the target.
  const fs::path path = directory_ / "occupied";
  fs::create_directories(path / "inside");
  const std::string message = message_of([&] { write_run(path, testing::sample_record()); });
  EXPECT_NE(message.find(path.string()), std::string::npos) << message;
  EXPECT_EQ(directory_listing(), std::vector<std::string>{"occupied"});
  EXPECT_TRUE(fs::is_directory(path / "inside"));
}

// Limits the size of files this process may write, like a full disk, while alive.
class FileSizeLimit {
 public:
  explicit FileSizeLimit(rlim_t bytes) {
    previous_handler_ = std::signal(SIGXFSZ, SIG_IGN);  // writes fail with EFBIG instead
    getrlimit(RLIMIT_FSIZE, &previous_);
    rlimit limited = previous_;
    limited.rlim_cur = bytes;
    setrlimit(RLIMIT_FSIZE, &limited);
  }
  ~FileSizeLimit() {
    setrlimit(RLIMIT_FSIZE, &previous_);
    std::signal(SIGXFSZ, previous_handler_);
  }
  FileSizeLimit(const FileSizeLimit&) = delete;
  FileSizeLimit& operator=(const FileSizeLimit&) = delete;

 private:
  rlimit previous_{};
  void (*previous_handler_)(int) = SIG_DFL;
};

TEST_F(RunFileTest, FailureInTheMiddleKeepsTheOldFileAndRemovesTheTemporary) {
  const fs::path path = directory_ / "season.h5";
  const RunRecord original = testing::sample_record();
  write_run(path, original);
  ASSERT_GT(fs::file_size(path), 20000u);
  RunRecord replacement = testing::sample_failed_record();
  replacement.site_name = "replacement";
  std::string message;
  {
    // The disk "fills up" 16 KiB into the new file, partway through the writing.
    FileSizeLimit limit(16384);
    message = message_of([&] { write_run(path, replacement); });
  }
  EXPECT_NE(message.find(path.string()), std::string::npos) << message;
  EXPECT_EQ(directory_listing(), std::vector<std::string>{"season.h5"});
  testing::expect_same_record(original, read_run(path));
}

TEST_F(RunFileTest, MissingDirectoryIsReportedWithThePath) {
  const fs::path path = directory_ / "no such folder" / "season.h5";
  const std::string message = message_of([&] { write_run(path, testing::sample_record()); });
  EXPECT_NE(message.find(path.string()), std::string::npos) << message;
  EXPECT_FALSE(fs::exists(path.parent_path()));
}

TEST_F(RunFileTest, InconsistentRecordIsRejectedBeforeAnyFileIsMade) {
  RunRecord record = testing::sample_record();
  record.run.profiles[4].water_content.pop_back();
  const fs::path path = directory_ / "season.h5";
  const std::string message = message_of([&] { write_run(path, record); });
  EXPECT_NE(message.find("profile 4 (day 4): water_content has 19 values, expected 20"), std::string::npos) << message;
  EXPECT_TRUE(directory_listing().empty());
}

TEST_F(RunFileTest, RecordChecksNameTheField) {
  const auto check_message = [](const RunRecord& record) {
    try {
      check_record(record);
    } catch (const std::invalid_argument& error) {
      return std::string(error.what());
    }
    return std::string("accepted");
  };
  RunRecord record = testing::sample_record();
  EXPECT_EQ(check_message(record), "accepted");

  RunRecord bad_date = record;
  bad_date.run_start_date = "1 April 2025";
  EXPECT_NE(check_message(bad_date).find("'1 April 2025' is not an ISO 8601 date"), std::string::npos);

  RunRecord bad_sensor = record;
  bad_sensor.sensors[1].depth_cm = -5.0;
  EXPECT_NE(check_message(bad_sensor).find("sensor 1 ('tensiometer 45 cm')"), std::string::npos);

  RunRecord bad_planes = record;
  bad_planes.flux_plane_depths_cm.push_back(80.0);
  EXPECT_NE(check_message(bad_planes).find("1 flux plane values but the record lists 2"), std::string::npos);

  RunRecord bad_times = record;
  bad_times.run.balances[3].time_days = 3.5;
  EXPECT_NE(check_message(bad_times).find("balance row 3 is at day 3.5 but profile 3 is at day 3"), std::string::npos);

  RunRecord complete_with_failure = record;
  complete_with_failure.run.failure = solver::RunFailure{1.0, 2.0, "x"};
  EXPECT_NE(check_message(complete_with_failure).find("complete but carries a failure"), std::string::npos);

  // The field checks must have one entry per visit interval (four in the sample).
  RunRecord short_darcy = record;
  short_darcy.darcy_estimate->amount_cm.pop_back();
  EXPECT_NE(check_message(short_darcy).find("Darcy estimate amount has 3 entries, expected 4"), std::string::npos)
      << check_message(short_darcy);
  RunRecord bad_yield = record;
  bad_yield.water_table_estimate->specific_yield = 1.5;
  EXPECT_NE(check_message(bad_yield).find("specific yield 1.5 is not between 0 and 1"), std::string::npos);
  RunRecord short_storage = record;
  short_storage.stored_water->visit_days.pop_back();
  EXPECT_NE(check_message(short_storage).find("stored water has 4 visit times, expected 5"), std::string::npos);
}

// netCDF-4 lets a variable use only dimensions of its own or an ancestor group; each group with
// per-interval variables holds the visit intervals as its own coordinate.
TEST_F(RunFileTest, FieldChecksUseTheirGroupsVisitIntervalAxis) {
  const fs::path path = directory_ / "season.h5";
  write_run(path, testing::sample_record());
  const auto names = {"recharge_estimates/darcy/amount", "recharge_estimates/water_table/amount",
                      "recharge_estimates/water_table/end_depth", "stored_water/observed_change", "visits/water_input"};
  testing::check_datasets(path, names, [](hid_t file, const char* name) {
    const std::string group = fs::path(name).parent_path().string();
    const hid_t interval_end = H5Dopen2(file, (group + "/interval_end").c_str(), H5P_DEFAULT);
    ASSERT_GE(interval_end, 0) << group;
    const hid_t dataset = H5Dopen2(file, name, H5P_DEFAULT);
    ASSERT_GE(dataset, 0) << name;
    EXPECT_GT(H5DSis_attached(dataset, interval_end, 0), 0) << name;
    H5Dclose(dataset);
    H5Dclose(interval_end);
  });
  const RunRecord back = read_run(path);
  ASSERT_TRUE(back.water_table_estimate.has_value());
  EXPECT_EQ(back.water_table_estimate->agreement[2], "differ");
  ASSERT_TRUE(back.stored_water.has_value());
  EXPECT_TRUE(std::isnan(back.stored_water->observed_cm[0]));
}

TEST_F(RunFileTest, ReadingAMissingFileSaysSo) {
  const fs::path path = directory_ / "absent.h5";
  const std::string message = message_of([&] { read_run(path); });
  EXPECT_EQ(message, fmt::format("cannot read run record '{}': no such file", path.string()));
}

TEST_F(RunFileTest, ReadingATextFileSaysItIsNotHdf5) {
  const fs::path path = directory_ / "notes.h5";
  std::ofstream(path) << "depth,head\n10,-50\n";
  const std::string message = message_of([&] { read_run(path); });
  EXPECT_EQ(message, fmt::format("cannot read run record '{}': not an HDF5 file", path.string()));
}

TEST_F(RunFileTest, ReadingAForeignHdf5FileSaysItIsNotARunRecord) {
  const fs::path path = directory_ / "other.h5";
  const hid_t file = H5Fcreate(path.c_str(), H5F_ACC_TRUNC, H5P_DEFAULT, H5P_DEFAULT);
  ASSERT_GE(file, 0);
  const hsize_t dims[1] = {3};
  const double values[3] = {1, 2, 3};
  ASSERT_GE(H5LTmake_dataset_double(file, "values", 1, dims, values), 0);
  H5Fclose(file);
  const std::string message = message_of([&] { read_run(path); });
  EXPECT_NE(message.find("not a wetfront run record"), std::string::npos) << message;
  EXPECT_NE(message.find(path.string()), std::string::npos) << message;
}

TEST_F(RunFileTest, ReadingAMisshapedDatasetNamesIt) {
  const fs::path path = directory_ / "season.h5";
  write_run(path, testing::sample_record());
  // Replace /water_content with one of the wrong shape.
  const hid_t file = H5Fopen(path.c_str(), H5F_ACC_RDWR, H5P_DEFAULT);
  ASSERT_GE(file, 0);
  ASSERT_GE(H5Ldelete(file, "water_content", H5P_DEFAULT), 0);
  const hsize_t dims[2] = {31, 19};
  std::vector<double> values(31 * 19, 0.3);
  ASSERT_GE(H5LTmake_dataset_double(file, "water_content", 2, dims, values.data()), 0);
  H5Fclose(file);
  const std::string message = message_of([&] { read_run(path); });
  EXPECT_NE(message.find("dataset /water_content has shape 31 x 19, expected 31 x 20"), std::string::npos) << message;
}

// A file of the first layout (profiles in /profiles, scales shared across groups) is refused
// with its layout version named, not half read.
TEST_F(RunFileTest, ReadingAnEarlierLayoutNamesItsVersion) {
  const fs::path path = directory_ / "season.h5";
  write_run(path, testing::sample_record());
  const hid_t file = H5Fopen(path.c_str(), H5F_ACC_RDWR, H5P_DEFAULT);
  ASSERT_GE(file, 0);
  const int old_version = 1;
  ASSERT_GE(H5LTset_attribute_int(file, ".", "record_format_version", &old_version, 1), 0);
  H5Fclose(file);
  const std::string message = message_of([&] { read_run(path); });
  EXPECT_NE(message.find("run record layout version 1"), std::string::npos) << message;
  EXPECT_NE(message.find("reads only version 2"), std::string::npos) << message;
  EXPECT_NE(message.find(path.string()), std::string::npos) << message;
}

}  // namespace
}  // namespace wetfront::profiles
