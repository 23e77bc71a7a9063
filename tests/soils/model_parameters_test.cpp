// The parameter table of every hydraulic model (model_parameters.hpp): each listed parameter
// reaches a field of the model's value type, keys are unique, names and site-file keys are
// distinct, and the units map to the dimensions the site file reads them in.
#include <gtest/gtest.h>

#include <algorithm>
#include <optional>
#include <set>
#include <string>
#include <utility>
#include <variant>

#include "wetfront/soils/model_parameters.hpp"

namespace ws = wetfront::soils;

TEST(ModelParameters, EveryListedParameterIsAFieldOfItsModel) {
  for (ws::HydraulicModel model : ws::all_models()) {
    SCOPED_TRACE(std::string(ws::model_name(model)));
    std::set<std::string_view> keys;
    std::set<const double*> fields;
    for (const auto& p : ws::model_parameters(model)) {
      EXPECT_TRUE(keys.insert(p.key).second) << p.key << " listed twice";
      double* field = ws::parameter_value(model, p.key);
      ASSERT_NE(field, nullptr) << p.key;
      EXPECT_TRUE(fields.insert(field).second) << p.key << " shares a field with another key";
      *field = 0.125;  // the table writes where it reads
      EXPECT_EQ(*ws::parameter_value(std::as_const(model), p.key), 0.125) << p.key;
      EXPECT_FALSE(p.symbol.empty()) << p.key;
    }
    EXPECT_EQ(ws::parameter_value(model, "no such parameter"), nullptr);
  }
}

TEST(ModelParameters, NamesAndSiteFileKeysAreDistinct) {
  std::set<std::string_view> names, keys;
  for (const auto& model : ws::all_models()) {
    EXPECT_TRUE(names.insert(ws::model_name(model)).second) << ws::model_name(model);
    EXPECT_TRUE(keys.insert(ws::model_key(model)).second) << ws::model_key(model);
  }
  EXPECT_EQ(names.size(), std::variant_size_v<ws::HydraulicModel>);
}

TEST(ModelParameters, UnitsGiveTheDimensionsTheSiteFileReads) {
  const ws::HydraulicModel air_entry = ws::VanGenuchtenAirEntry{};
  const auto dimension_of = [&](std::string_view key) {
    for (const auto& p : ws::model_parameters(air_entry))
      if (p.key == key) return ws::parameter_dimension(p);
    ADD_FAILURE() << key << " not in the air-entry model";
    return std::optional<wetfront::base::Dimension>();
  };
  EXPECT_EQ(dimension_of("residual_water_content"), wetfront::base::Dimension::water_content);
  EXPECT_EQ(dimension_of("alpha"), wetfront::base::Dimension::inverse_length);
  EXPECT_EQ(dimension_of("saturated_conductivity"), wetfront::base::Dimension::conductivity);
  EXPECT_EQ(dimension_of("air_entry_head"), wetfront::base::Dimension::pressure_head);
  EXPECT_EQ(dimension_of("n"), std::nullopt);  // a plain number
  EXPECT_EQ(dimension_of("pore_connectivity"), std::nullopt);
}

TEST(ModelParameters, EveryKeyOnceInTheListOfAllKeys) {
  const auto all = ws::all_parameter_keys();
  EXPECT_EQ(std::set<std::string_view>(all.begin(), all.end()).size(), all.size());
  for (const auto& model : ws::all_models())
    for (const auto& p : ws::model_parameters(model))
      EXPECT_NE(std::find(all.begin(), all.end(), p.key), all.end()) << p.key;
}
