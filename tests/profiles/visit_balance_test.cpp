// Per-visit water balance: intervals telescope to the season totals.
#include <gtest/gtest.h>

#include <cmath>
#include <limits>

#include "sample_record.hpp"
#include "wetfront/profiles/visit_balance.hpp"

namespace wetfront::profiles {
namespace {

// Sum of one term over the interval rows, in row order.
double sum_of(const std::vector<IntervalBalance>& rows, double IntervalBalance::*term) {
  double total = 0;
  for (const IntervalBalance& row : rows) total += row.*term;
  return total;
}

constexpr double IntervalBalance::*kTerms[] = {
    &IntervalBalance::water_input_cm,        &IntervalBalance::potential_evaporation_cm,
    &IntervalBalance::actual_evaporation_cm, &IntervalBalance::runoff_cm,
    &IntervalBalance::infiltration_cm,       &IntervalBalance::transpiration_cm,
    &IntervalBalance::bottom_flux_cm,        &IntervalBalance::ponded_change_cm,
    &IntervalBalance::storage_change_cm,     &IntervalBalance::balance_error_change_cm};

// Cumulative rows whose values are multiples of 1/64 below 2^20: every difference and every
// partial sum is exactly representable, so the telescoping sum must be exact.
std::vector<solver::CumulativeBalance> dyadic_rows() {
  std::vector<solver::CumulativeBalance> rows;
  for (int day = 0; day <= 10; ++day) {
    solver::CumulativeBalance row;
    row.time_days = day;
    const double step = day / 64.0;
    row.water_input_cm = 3 * step;
    row.potential_evaporation_cm = 5 * step;
    row.actual_evaporation_cm = 2 * step + (day % 3) / 64.0;
    row.runoff_cm = day > 4 ? 1 / 64.0 : 0.0;
    row.infiltration_cm = 7 * step;
    row.transpiration_cm = 11 * step;
    row.bottom_flux_cm = 13 * step;
    row.plane_flux_cm = {17 * step, -step};
    row.ponded_depth_cm = (day % 2) / 64.0;
    row.soil_storage_cm = 30.0 + 19 * step - (day % 4) / 64.0;
    row.balance_error_cm = (day % 5) / 64.0;
    rows.push_back(row);
  }
  return rows;
}

TEST(VisitBalance, IntervalsFollowTheVisits) {
  const auto rows = dyadic_rows();
  const std::vector<double> visits = {3.0, 7.0};
  const auto table = balance_between_visits(rows, visits);
  ASSERT_EQ(table.size(), 3u);
  EXPECT_EQ(table[0].start_day, 0.0);
  EXPECT_EQ(table[0].end_day, 3.0);
  EXPECT_EQ(table[1].start_day, 3.0);
  EXPECT_EQ(table[1].end_day, 7.0);
  EXPECT_EQ(table[2].start_day, 7.0);
  EXPECT_EQ(table[2].end_day, 10.0);
  EXPECT_EQ(table[1].water_input_cm, rows[7].water_input_cm - rows[3].water_input_cm);
  EXPECT_EQ(table[1].storage_change_cm, rows[7].soil_storage_cm - rows[3].soil_storage_cm);
  EXPECT_EQ(table[2].plane_flux_cm[1], rows[10].plane_flux_cm[1] - rows[7].plane_flux_cm[1]);
}

TEST(VisitBalance, RowsSumExactlyToTheSeasonTotalWhenTheNumbersAreExact) {
  const auto rows = dyadic_rows();
  const std::vector<double> visits = {1.0, 2.0, 5.0, 6.0, 9.0};
  const auto table = balance_between_visits(rows, visits);
  const IntervalBalance total = season_total(rows);
  ASSERT_EQ(table.size(), 6u);
  for (auto term : kTerms) EXPECT_EQ(sum_of(table, term), total.*term);
  for (std::size_t p = 0; p < 2; ++p) {
    double plane_sum = 0;
    for (const auto& row : table) plane_sum += row.plane_flux_cm[p];
    EXPECT_EQ(plane_sum, total.plane_flux_cm[p]);
  }
}

TEST(VisitBalance, RowsSumToTheSeasonTotalUpToAdditionRoundingForAnyNumbers) {
  const RunRecord record = testing::sample_record();
  const auto& rows = record.run.balances;
  const auto table = balance_between_visits(rows, record.visit_days);
  const IntervalBalance total = season_total(rows);
  ASSERT_EQ(table.size(), 4u);
  for (auto term : kTerms) {
    // Rounding of the n - 1 additions of the telescoping sum: a few units in the last
    // place of the largest cumulative value involved (the soil storage, about 30 cm).
    const double scale = std::abs(rows.front().soil_storage_cm) + std::abs(rows.back().soil_storage_cm) + 30.0;
    EXPECT_NEAR(sum_of(table, term), total.*term, 8 * std::numeric_limits<double>::epsilon() * scale);
  }
}

TEST(VisitBalance, NoVisitsGivesOneSeasonRow) {
  const auto rows = dyadic_rows();
  const auto table = balance_between_visits(rows, {});
  ASSERT_EQ(table.size(), 1u);
  EXPECT_EQ(table[0], season_total(rows));
}

TEST(VisitBalance, VisitsAtTheStartAndEndAddNoEmptyRows) {
  const auto rows = dyadic_rows();
  const std::vector<double> visits = {0.0, 4.0, 10.0};
  const auto table = balance_between_visits(rows, visits);
  ASSERT_EQ(table.size(), 2u);
  EXPECT_EQ(table[0].end_day, 4.0);
  EXPECT_EQ(table[1].end_day, 10.0);
}

TEST(VisitBalance, VisitsBeyondTheLastTimeReachedAreLeftOut) {
  auto rows = dyadic_rows();
  rows.resize(6);  // a run that stopped after day 5
  const std::vector<double> visits = {3.0, 8.0};
  const auto table = balance_between_visits(rows, visits);
  ASSERT_EQ(table.size(), 2u);
  EXPECT_EQ(table[1].start_day, 3.0);
  EXPECT_EQ(table[1].end_day, 5.0);
}

TEST(VisitBalance, VisitBetweenOutputTimesIsAnError) {
  const auto rows = dyadic_rows();
  const std::vector<double> visits = {3.5};
  try {
    balance_between_visits(rows, visits);
    FAIL() << "accepted a visit between output times";
  } catch (const std::invalid_argument& error) {
    EXPECT_STREQ(error.what(), "visit 1 (day 3.5) is not an output time; add the visit days to the output times");
  }
}

TEST(VisitBalance, VisitsOutOfOrderAreAnError) {
  const auto rows = dyadic_rows();
  const std::vector<double> visits = {5.0, 2.0};
  EXPECT_THROW(balance_between_visits(rows, visits), std::invalid_argument);
  const std::vector<double> early = {-1.0};
  EXPECT_THROW(balance_between_visits(rows, early), std::invalid_argument);
}

TEST(VisitBalance, SeasonTotalOfNoRowsIsAnError) {
  EXPECT_THROW(season_total({}), std::invalid_argument);
  EXPECT_TRUE(balance_between_visits({}, std::vector<double>{1.0}).empty());
}

}  // namespace
}  // namespace wetfront::profiles
