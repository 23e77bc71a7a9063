// Class A pan coefficient against Allen et al. (1998), FAO Irrigation and Drainage Paper 56,
// Table 5 and its regression equations (after Allen & Pruitt 1991).
// Table values: from memory, check against the table. The case A regression coefficients were
// checked against an independent implementation; the case B coefficients are from memory.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <array>
#include <cmath>
#include <utility>

#include "wetfront/forcing/pan_coefficient.hpp"

namespace wf = wetfront::forcing;
using S = wf::PanSurroundings;
using W = wf::WindClass;
using H = wf::HumidityClass;
using F = wf::FetchClass;

TEST(PanCoefficientTable, ReproducesTableEntries) {
  // Allen et al. (1998) Table 5, from memory, check against the table.
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(S::green_fetch, W::light, H::medium, F::m10), 0.75);
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(S::dry_fetch, W::light, H::medium, F::m10), 0.70);
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(S::green_fetch, W::light, H::low, F::m1), 0.55);
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(S::green_fetch, W::very_strong, H::high, F::m1000), 0.65);
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(S::dry_fetch, W::light, H::high, F::m1), 0.85);
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(S::dry_fetch, W::very_strong, H::low, F::m1000), 0.35);
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(S::dry_fetch, W::moderate, H::medium, F::m100), 0.60);
}

TEST(PanCoefficientTable, TableTrendsRunTheRightWay) {
  // Structure of the table (common practice): Kp falls with wind and rises with humidity in
  // both cases; it rises with green fetch (case A) and falls with dry fetch (case B).
  for (S s : {S::green_fetch, S::dry_fetch})
    for (F f : {F::m1, F::m10, F::m100, F::m1000})
      for (H h : {H::low, H::medium, H::high}) {
        EXPECT_GE(wf::class_a_pan_coefficient_from_table(s, W::light, h, f),
                  wf::class_a_pan_coefficient_from_table(s, W::very_strong, h, f));
      }
  for (W w : {W::light, W::moderate, W::strong, W::very_strong})
    for (H h : {H::low, H::medium, H::high}) {
      EXPECT_LE(wf::class_a_pan_coefficient_from_table(S::green_fetch, w, h, F::m1),
                wf::class_a_pan_coefficient_from_table(S::green_fetch, w, h, F::m1000));
      EXPECT_GE(wf::class_a_pan_coefficient_from_table(S::dry_fetch, w, h, F::m1),
                wf::class_a_pan_coefficient_from_table(S::dry_fetch, w, h, F::m1000));
    }
}

TEST(PanCoefficientTable, ClassesFromMeasuredValues) {
  for (const auto& [speed, wind] : {std::pair{1.99, W::light}, {2.0, W::moderate}, {5.0, W::moderate},
                                    {7.0, W::strong}, {8.5, W::very_strong}})
    EXPECT_EQ(wf::wind_class_of(speed), wind) << speed << " m/s";
  for (const auto& [percent, humidity] : {std::pair{39.9, H::low}, {70.0, H::medium}, {71.0, H::high}})
    EXPECT_EQ(wf::humidity_class_of(percent), humidity) << percent << " %";
  for (const auto& [metres, fetch] : {std::pair{2.0, F::m1}, {5.0, F::m10}, {250.0, F::m100}, {5000.0, F::m1000}})
    EXPECT_EQ(wf::fetch_class_of(metres), fetch) << metres << " m";
  const wf::PanSite site{S::green_fetch, 1.5, 55.0, 12.0};
  EXPECT_DOUBLE_EQ(wf::class_a_pan_coefficient_from_table(site), 0.75);
  EXPECT_THROW(wf::humidity_class_of(120.0), wetfront::base::InputError);
}

TEST(PanCoefficientRegression, AgreesWithTheTableAtClassRepresentativeInputs) {
  // Representative inputs: wind 1, 3.5, 6.5, 8 m/s (8 is the upper limit of the fit, standing
  // for "very strong"); humidity 35, 55, 80 %. Tolerance 0.08 on the table's 0.05 steps.
  const std::array<std::pair<W, double>, 4> winds{
      {{W::light, 1.0}, {W::moderate, 3.5}, {W::strong, 6.5}, {W::very_strong, 8.0}}};
  const std::array<std::pair<H, double>, 3> humidities{{{H::low, 35.0}, {H::medium, 55.0}, {H::high, 80.0}}};
  const std::array<std::pair<F, double>, 4> fetches{
      {{F::m1, 1.0}, {F::m10, 10.0}, {F::m100, 100.0}, {F::m1000, 1000.0}}};
  double worst = 0;
  for (S s : {S::green_fetch, S::dry_fetch})
    for (auto [w, u2] : winds)
      for (auto [h, rh] : humidities)
        for (auto [f, fet] : fetches) {
          const double table = wf::class_a_pan_coefficient_from_table(s, w, h, f);
          const double fit = wf::class_a_pan_coefficient_from_regression({s, u2, rh, fet});
          EXPECT_NEAR(fit, table, 0.08) << wf::to_string(s) << ", wind " << u2 << ", RH " << rh << ", fetch " << fet;
          worst = std::max(worst, std::abs(fit - table));
        }
  RecordProperty("worst_difference", std::to_string(worst));
}

TEST(PanCoefficientRegression, HandCheckedValues) {
  // Case A at u2 = 2 m/s, RH = 50 %, FET = 10 m, evaluated by hand:
  // 0.108 - 0.0572 + 0.0971691 + 0.5609841 - 0.0130880 = 0.6959
  // (ln 10 = 2.302585, ln 50 = 3.912023, [ln 10]^2 = 5.301898)
  EXPECT_NEAR(wf::class_a_pan_coefficient_from_regression({S::green_fetch, 2.0, 50.0, 10.0}), 0.6959, 5e-4);
  // Case B at u2 = 2 m/s, RH = 50 %, FET = 10 m: ln(172.8) = 5.152135,
  // 0.61 + 0.1705 - 0.0162 - 0.0001918 + 0.0150589 - 0.0297803 - 0.1257469 + 0.0172101 = 0.6408
  EXPECT_NEAR(wf::class_a_pan_coefficient_from_regression({S::dry_fetch, 2.0, 50.0, 10.0}), 0.6408, 5e-4);
}

TEST(PanCoefficientRegression, RefusesInputsOutsideTheFit) {
  EXPECT_THROW(wf::class_a_pan_coefficient_from_regression({S::green_fetch, 0.5, 50.0, 10.0}),
               wetfront::base::InputError);
  EXPECT_THROW(wf::class_a_pan_coefficient_from_regression({S::green_fetch, 2.0, 90.0, 10.0}),
               wetfront::base::InputError);
  EXPECT_THROW(wf::class_a_pan_coefficient_from_regression({S::dry_fetch, 2.0, 50.0, 2000.0}),
               wetfront::base::InputError);
}

TEST(PanCoefficientChoice, UserValueTableOrRegression) {
  wf::PanCoefficientChoice c;
  c.user_value = 0.82;
  EXPECT_DOUBLE_EQ(wf::pan_coefficient(c), 0.82);
  c.user_value = 1.5;
  EXPECT_THROW(wf::pan_coefficient(c), wetfront::base::InputError);
  c.method = wf::PanCoefficientChoice::Method::table;
  c.site = {S::dry_fetch, 1.0, 55.0, 10.0};
  EXPECT_DOUBLE_EQ(wf::pan_coefficient(c), 0.70);
  c.method = wf::PanCoefficientChoice::Method::regression;
  EXPECT_NEAR(wf::pan_coefficient(c), 0.70, 0.08);
}
