#include <gtest/gtest.h>

#include <stdexcept>

#include "wetfront/base/step_series.hpp"
#include "wetfront/base/time_point.hpp"

namespace wf = wetfront::base;

TEST(StepSeries, ValueHoldsFromItsStartUntilTheNext) {
  const wf::StepSeries s{{0.0, 2.0, 5.0}, {1.0, 3.0, 0.5}};
  EXPECT_DOUBLE_EQ(s.at(-1.0), 1.0);  // first value also before the first start
  EXPECT_DOUBLE_EQ(s.at(0.0), 1.0);
  EXPECT_DOUBLE_EQ(s.at(1.999), 1.0);
  EXPECT_DOUBLE_EQ(s.at(2.0), 3.0);
  EXPECT_DOUBLE_EQ(s.at(7.0), 0.5);  // last value holds onward
}

TEST(StepSeries, IntegralSumsThePiecesItCrosses) {
  const wf::StepSeries s{{0.0, 2.0, 5.0}, {1.0, 3.0, 0.5}};
  // 1*(2-1) + 3*(5-2) + 0.5*(6-5) = 1 + 9 + 0.5
  EXPECT_DOUBLE_EQ(s.integral(1.0, 6.0), 10.5);
  EXPECT_DOUBLE_EQ(s.integral(6.0, 1.0), -10.5);
  EXPECT_DOUBLE_EQ(s.integral(2.5, 3.0), 1.5);
  EXPECT_DOUBLE_EQ(s.integral(-2.0, 0.0), 2.0);
}

TEST(TimeAxis, ParsesTheAcceptedIsoForms) {
  const auto start = wf::parse_timestamp("2024-05-01");
  ASSERT_TRUE(start);
  const auto morning = wf::parse_timestamp("2024-05-03T06:00");
  const auto with_space = wf::parse_timestamp("2024-05-03 06:00:00");
  ASSERT_TRUE(morning && with_space);
  EXPECT_DOUBLE_EQ(wf::days_since(*start, *morning), 2.25);
  EXPECT_EQ(*morning, *with_space);
  // Across the end of February in a leap year: 2024-02-28 to 2024-03-01 is two days.
  EXPECT_DOUBLE_EQ(wf::days_since(*wf::parse_timestamp("2024-02-28"), *wf::parse_timestamp("2024-03-01")), 2.0);
}

TEST(TimeAxis, RejectsOtherForms) {
  EXPECT_FALSE(wf::parse_timestamp("2024-5-1"));
  EXPECT_FALSE(wf::parse_timestamp("01/05/2024"));
  EXPECT_FALSE(wf::parse_timestamp("2024-05-01T06"));
  EXPECT_FALSE(wf::parse_timestamp("2024-05-01T06:00+02:00"));
  EXPECT_FALSE(wf::parse_timestamp("2024-02-30"));
  EXPECT_FALSE(wf::parse_timestamp(""));
}

TEST(TimeAxis, FormatsDaysBackAsDates) {
  const auto start = *wf::parse_timestamp("2024-05-01");
  EXPECT_EQ(wf::format_timestamp(wf::time_after(start, 3.0)), "2024-05-04");
  EXPECT_EQ(wf::format_timestamp(wf::time_after(start, 0.5)), "2024-05-01T12:00:00");
}

TEST(StepSeries, IntegralIsOrientedAndZeroOverAPoint) {
  // The integral from b to a is minus the integral from a to b (common practice for a
  // definite integral), so sums over consecutive intervals telescope whatever their order.
  const wf::StepSeries s{{0.0, 1.0}, {2.0, 4.0}};
  EXPECT_DOUBLE_EQ(s.integral(0.5, 0.5), 0.0);
  EXPECT_DOUBLE_EQ(s.integral(0.0, 2.0), 6.0);
  EXPECT_DOUBLE_EQ(s.integral(2.0, 0.0), -6.0);
  EXPECT_DOUBLE_EQ(s.integral(0.0, 0.5) + s.integral(0.5, 2.0), s.integral(0.0, 2.0));
  EXPECT_DOUBLE_EQ(s.integral(0.0, 1.5) + s.integral(1.5, 0.5), s.integral(0.0, 0.5));
}

TEST(StepSeries, ASeriesWithoutValuesIsAFaultOfTheProgram) {
  const wf::StepSeries empty;
  EXPECT_THROW((void)empty.at(0.0), std::logic_error);
}
