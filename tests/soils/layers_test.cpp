// LayeredProfile: contiguity validation and depth lookup.
#include <gtest/gtest.h>

#include "input_error_of.hpp"
#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <stdexcept>
#include <string>

#include "wetfront/soils/layers.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace ws = wetfront::soils;

using wetfront::test_support::expect_mentions;
using wetfront::test_support::input_error_message;

namespace {
ws::SoilLayer layer(std::string name, double top, double bottom, const char* texture = "loam") {
  return ws::SoilLayer{std::move(name), top, bottom, ws::texture_class_parameters(texture)};
}

}  // namespace

TEST(LayeredProfile, AcceptsContiguousLayers) {
  const ws::LayeredProfile p({layer("topsoil", 0, 30), layer("subsoil", 30, 80), layer("substratum", 80, 200)});
  EXPECT_EQ(p.layers().size(), 3u);
  EXPECT_EQ(p.total_depth_cm(), 200.0);
}

TEST(LayeredProfile, RejectsEmptyProfile) {
  EXPECT_NE(input_error_message([] { ws::LayeredProfile p({}); }).find("at least one layer"), std::string::npos);
}

TEST(LayeredProfile, RejectsFirstLayerBelowSurface) {
  const auto msg = input_error_message([] { ws::LayeredProfile p({layer("topsoil", 5, 30)}); });
  expect_mentions(msg, {"'topsoil'", "starts at 5"});
}

TEST(LayeredProfile, RejectsGapNamingTheLayer) {
  const auto msg = input_error_message([] {
    ws::LayeredProfile p({layer("topsoil", 0, 30), layer("subsoil", 35, 80)});
  });
  expect_mentions(msg, {"'subsoil'", "35", "30"});
}

TEST(LayeredProfile, RejectsOverlapNamingTheLayer) {
  const auto msg = input_error_message([] {
    ws::LayeredProfile p({layer("topsoil", 0, 30), layer("subsoil", 25, 80)});
  });
  expect_mentions(msg, {"'subsoil'", "25"});
}

TEST(LayeredProfile, RejectsZeroAndNegativeThickness) {
  auto msg = input_error_message([] { ws::LayeredProfile p({layer("topsoil", 0, 30), layer("thin", 30, 30)}); });
  EXPECT_NE(msg.find("'thin'"), std::string::npos) << msg;
  msg = input_error_message([] { ws::LayeredProfile p({layer("upside down", 0, -10)}); });
  EXPECT_NE(msg.find("'upside down'"), std::string::npos) << msg;
}

TEST(LayeredProfile, RejectsNonFiniteDepths) {
  input_error_message([] { ws::LayeredProfile p({layer("topsoil", 0, std::nan(""))}); });
  input_error_message([] { ws::LayeredProfile p({layer("topsoil", 0, 30), layer("subsoil", std::nan(""), 80)}); });
  input_error_message([] { ws::LayeredProfile p({layer("topsoil", 0, INFINITY)}); });
}

TEST(LayeredProfile, InterfaceDepthBelongsToTheLayerBelow) {
  const ws::LayeredProfile p({layer("topsoil", 0, 30, "sandy loam"), layer("subsoil", 30, 80, "clay")});
  EXPECT_EQ(p.layer_index_at(0.0), 0u);
  EXPECT_EQ(p.layer_index_at(29.999), 0u);
  EXPECT_EQ(p.layer_index_at(30.0), 1u);
  EXPECT_EQ(p.layer_index_at(79.0), 1u);
  EXPECT_EQ(p.layer_index_at(80.0), 1u);  // the bottom face belongs to the last layer
  const auto& below = std::get<ws::VanGenuchtenMualem>(p.model_at(30.0));
  EXPECT_EQ(below.n, 1.09);  // clay
}
