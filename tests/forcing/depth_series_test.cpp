#include <gtest/gtest.h>

#include "wetfront/forcing/depth_series.hpp"
#include "input_error_of.hpp"
#include "wetfront/base/input_error.hpp"

namespace wf = wetfront::forcing;

using wetfront::test_support::input_error_message;

namespace {
wf::DepthSeries daily_rain(std::vector<std::optional<double>> depths_cm) {
  wf::DepthSeries s;
  s.quantity = "rain";
  s.source_file = "rain.csv";
  s.run_start = *wetfront::base::parse_timestamp("2024-05-01");
  for (std::size_t i = 0; i < depths_cm.size(); ++i)
    s.intervals.push_back({double(i), double(i) + 1.0, depths_cm[i], int(i) + 2});
  return s;
}
}  // namespace

TEST(DepthSeries, DailyDepthsBecomeRatesInCmPerDay) {
  const auto r = wf::depth_series_to_rate(daily_rain({0.0, 1.2, 0.3}), 3.0, wf::GapPolicy::error);
  EXPECT_DOUBLE_EQ(r.rate_cm_per_day.end_day, 3.0);
  EXPECT_DOUBLE_EQ(r.rate_cm_per_day.series.at(1.5), 1.2);
  EXPECT_DOUBLE_EQ(r.rate_cm_per_day.series.integral(0, 3), 1.5);
  EXPECT_TRUE(r.gaps.empty());
}

TEST(DepthSeries, SubDailyIntensitiesKeepTheirDepth) {
  wf::DepthSeries s = daily_rain({});
  // 0.6 cm in 3 hours = 4.8 cm/d; the rest of the day dry.
  s.intervals = {{0.0, 0.5, 0.0, 2}, {0.5, 0.625, 0.6, 3}, {0.625, 1.0, 0.0, 4}};
  const auto r = wf::depth_series_to_rate(s, 1.0, wf::GapPolicy::error);
  EXPECT_DOUBLE_EQ(r.rate_cm_per_day.series.at(0.55), 4.8);
  EXPECT_NEAR(r.rate_cm_per_day.series.integral(0, 1), 0.6, 1e-12);
}

TEST(DepthSeries, MissingValueIsAnErrorNamingFileLineAndDate) {
  const std::string what = input_error_message([] {
    wf::depth_series_to_rate(daily_rain({0.1, std::nullopt, 0.2}), 3.0, wf::GapPolicy::error);
  });
  EXPECT_NE(what.find("rain.csv:3"), std::string::npos) << what;
  EXPECT_NE(what.find("2024-05-02"), std::string::npos) << what;
  EXPECT_NE(what.find("missing value"), std::string::npos) << what;
}

TEST(DepthSeries, GapBetweenRecordsIsAnErrorUnlessTheCallerChooses) {
  wf::DepthSeries s = daily_rain({0.1, 0.2, 0.3, 0.4});
  s.intervals.erase(s.intervals.begin() + 2);  // no record for day [2, 3)
  EXPECT_THROW(wf::depth_series_to_rate(s, 4.0, wf::GapPolicy::error), wetfront::base::InputError);

  const auto zero = wf::depth_series_to_rate(s, 4.0, wf::GapPolicy::fill_with_zero);
  EXPECT_DOUBLE_EQ(zero.rate_cm_per_day.end_day, 4.0);
  EXPECT_DOUBLE_EQ(zero.rate_cm_per_day.series.at(2.5), 0.0);
  EXPECT_DOUBLE_EQ(zero.rate_cm_per_day.series.integral(0, 4), 0.7);
  ASSERT_EQ(zero.gaps.size(), 1u);
  EXPECT_DOUBLE_EQ(zero.gaps[0].start_day, 2.0);
  EXPECT_DOUBLE_EQ(zero.gaps[0].end_day, 3.0);

  const auto stop = wf::depth_series_to_rate(s, 4.0, wf::GapPolicy::stop_run_at_gap);
  EXPECT_DOUBLE_EQ(stop.rate_cm_per_day.end_day, 2.0);
  EXPECT_DOUBLE_EQ(stop.rate_cm_per_day.series.integral(0, 2), 0.3);
}

TEST(DepthSeries, RecordsEndingBeforeTheRunEndAreAGap) {
  EXPECT_THROW(wf::depth_series_to_rate(daily_rain({0.1, 0.2}), 5.0, wf::GapPolicy::error), wetfront::base::InputError);
  const auto stop = wf::depth_series_to_rate(daily_rain({0.1, 0.2}), 5.0, wf::GapPolicy::stop_run_at_gap);
  EXPECT_DOUBLE_EQ(stop.rate_cm_per_day.end_day, 2.0);
}

TEST(DepthSeries, NegativeDepthOverlapAndEmptyIntervalAreErrors) {
  EXPECT_THROW(wf::depth_series_to_rate(daily_rain({0.1, -0.2}), 2.0, wf::GapPolicy::fill_with_zero),
               wetfront::base::InputError);
  wf::DepthSeries overlap = daily_rain({0.1, 0.2});
  overlap.intervals[1].start_day = 0.5;
  EXPECT_THROW(wf::check_depth_series(overlap), wetfront::base::InputError);
  wf::DepthSeries empty = daily_rain({0.1});
  empty.intervals[0].end_day = empty.intervals[0].start_day;
  EXPECT_THROW(wf::check_depth_series(empty), wetfront::base::InputError);
}

TEST(DepthSeries, RecordsOutsideTheRunAreClipped) {
  wf::DepthSeries s = daily_rain({});
  s.intervals = {{-1.0, 0.0, 5.0, 2}, {0.0, 2.0, 1.0, 3}, {2.0, 4.0, 2.0, 4}};
  const auto r = wf::depth_series_to_rate(s, 3.0, wf::GapPolicy::error);
  EXPECT_DOUBLE_EQ(r.rate_cm_per_day.end_day, 3.0);
  // 0.5 cm/d over [0,2) and 1 cm/d over [2,3)
  EXPECT_DOUBLE_EQ(r.rate_cm_per_day.series.integral(0, 3), 2.0);
}
