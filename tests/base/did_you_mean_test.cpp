#include <gtest/gtest.h>

#include <array>
#include <string_view>

#include "wetfront/base/did_you_mean.hpp"

namespace wb = wetfront::base;

TEST(DidYouMean, EditDistanceCountsInsertionsDeletionsAndSubstitutions) {
  // kitten -> sitting: two substitutions and one insertion (common practice example).
  EXPECT_EQ(wb::edit_distance("kitten", "sitting"), 3u);
  EXPECT_EQ(wb::edit_distance("", "abc"), 3u);
  EXPECT_EQ(wb::edit_distance("Weather", "weather"), 0u);  // letter case ignored
}

TEST(DidYouMean, SuggestsOnlyPlausibleTypos) {
  constexpr std::array<std::string_view, 3> keys = {"weather", "plane_depth", "surface"};
  EXPECT_EQ(wb::did_you_mean("wether", keys), "weather");
  EXPECT_EQ(wb::did_you_mean("plane_dept", keys), "plane_depth");
  EXPECT_EQ(wb::did_you_mean("surfaces", keys), "surface");
  EXPECT_FALSE(wb::did_you_mean("irrigation", keys));
}
