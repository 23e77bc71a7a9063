#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>

#include "wetfront/forcing/canopy_split.hpp"

namespace wf = wetfront::forcing;

TEST(CanopySplit, BeersLawShareReachingTheSoil) {
  // Ep = ETc exp(-k LAI) (Ritchie 1972): ETc 0.5 cm/d, LAI 2, k 0.398 -> 0.5 exp(-0.796) = 0.22557
  const auto s = wf::split_by_leaf_area(0.5, 2.0, 0.398);
  EXPECT_NEAR(s.soil_evaporation, 0.22557, 1e-5);
  EXPECT_NEAR(s.soil_evaporation + s.transpiration, 0.5, 1e-15);
  const auto bare = wf::split_by_leaf_area(0.5, 0.0, wf::default_extinction_coefficient);
  EXPECT_DOUBLE_EQ(bare.soil_evaporation, 0.5);
  EXPECT_DOUBLE_EQ(bare.transpiration, 0.0);
  // Doubling LAI squares the transmitted fraction.
  const double one = wf::split_by_leaf_area(1.0, 1.5, 0.5).soil_evaporation;
  const double two = wf::split_by_leaf_area(1.0, 3.0, 0.5).soil_evaporation;
  EXPECT_NEAR(two, one * one, 1e-15);
  EXPECT_THROW(wf::split_by_leaf_area(0.5, -1.0, 0.4), wetfront::base::InputError);
}

TEST(CanopySplit, SoilCoverFraction) {
  const auto s = wf::split_by_soil_cover(0.5, 0.6);
  EXPECT_NEAR(s.soil_evaporation, 0.2, 1e-15);
  EXPECT_NEAR(s.transpiration, 0.3, 1e-15);
  EXPECT_THROW(wf::split_by_soil_cover(0.5, 1.2), wetfront::base::InputError);
}

TEST(DatedTable, LinearBetweenDatesHeldBeyondThem) {
  const wf::DatedTable lai{"leaf area index", {10.0, 40.0, 80.0}, {0.0, 3.0, 1.0}};
  EXPECT_DOUBLE_EQ(lai.at(0.0), 0.0);
  EXPECT_DOUBLE_EQ(lai.at(25.0), 1.5);
  EXPECT_DOUBLE_EQ(lai.at(60.0), 2.0);
  EXPECT_DOUBLE_EQ(lai.at(100.0), 1.0);
  EXPECT_NO_THROW(wf::check_dated_table(lai, 0, 20));
  const wf::DatedTable backwards{"root depth", {10.0, 5.0}, {1.0, 2.0}};
  EXPECT_THROW(wf::check_dated_table(backwards, 0, 1e4), wetfront::base::InputError);
}
