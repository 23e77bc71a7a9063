// Constant-head well permeameter: shape factor, single- and two-head analyses.
#include "wetfront/soils/well_permeameter.hpp"

#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

namespace {

using namespace wetfront::soils;

constexpr double per_min_to_per_d = 1440.0;

TEST(WellShapeFactor, MatchesTheThreeFitsAtHOverAOf10Over3) {
  // Zhang, Groenevelt & Parkin (1998) C = ((H/a) / (p + q H/a))^s, coefficients from
  // memory; expected values evaluated independently with Python at H = 10 cm, a = 3 cm.
  EXPECT_NEAR(well_shape_factor(10.0, 3.0, ShapeFactorSoil::sand), 1.2088331635490945, 1e-12);
  EXPECT_NEAR(well_shape_factor(10.0, 3.0, ShapeFactorSoil::structured_loam_or_clay), 1.2902341316100776, 1e-12);
  EXPECT_NEAR(well_shape_factor(10.0, 3.0, ShapeFactorSoil::unstructured_clay), 1.287542758593837, 1e-12);
}

TEST(WellShapeFactor, GrowsWithDepthToRadiusRatio) {
  for (const auto soil :
       {ShapeFactorSoil::sand, ShapeFactorSoil::structured_loam_or_clay, ShapeFactorSoil::unstructured_clay}) {
    EXPECT_LT(well_shape_factor(5.0, 3.0, soil), well_shape_factor(10.0, 3.0, soil));
    EXPECT_LT(well_shape_factor(10.0, 3.0, soil), well_shape_factor(25.0, 3.0, soil));
  }
  EXPECT_THROW(well_shape_factor(0.0, 3.0, ShapeFactorSoil::sand), wetfront::base::InputError);
  EXPECT_THROW(well_shape_factor(10.0, -1.0, ShapeFactorSoil::sand), wetfront::base::InputError);
}

TEST(WellCategories, AlphaStarValuesOfElrickEtAl1989) {
  // Elrick, Reynolds & Tan (1989), alpha* categories (from memory).
  EXPECT_DOUBLE_EQ(sorptive_number_per_cm(WellSoilCategory::compacted_clay), 0.01);
  EXPECT_DOUBLE_EQ(sorptive_number_per_cm(WellSoilCategory::fine_unstructured), 0.04);
  EXPECT_DOUBLE_EQ(sorptive_number_per_cm(WellSoilCategory::structured), 0.12);
  EXPECT_DOUBLE_EQ(sorptive_number_per_cm(WellSoilCategory::coarse_sand), 0.36);
  EXPECT_DOUBLE_EQ(sorptive_number_per_cm(WellSoilCategory::highly_structured), 0.36);
  for (const auto category : all_categories()) EXPECT_EQ(parse_category(category_name(category)), category);
  EXPECT_THROW(parse_category("loamy"), wetfront::base::InputError);
}

TEST(SingleHead, WorkedValueStructuredSoil) {
  // Reynolds & Elrick (1985) eq. with phi_m = Kfs / alpha*: Kfs = C Q / (2 pi H^2 + pi a^2 C
  // + 2 pi H / alpha*). H = 10 cm, a = 3 cm, Q = 25 cm3/min, alpha* = 0.12 /cm, structured C;
  // expected value computed independently with Python: Kfs = 39.0849 cm/d.
  const auto result = single_head_analysis({10.0, 25.0 * per_min_to_per_d}, 3.0, WellSoilCategory::structured);
  EXPECT_NEAR(result.field_saturated_conductivity_cm_per_d, 39.08491590599886, 1e-9);
  EXPECT_NEAR(result.matric_flux_potential_cm2_per_d, 325.70763254999054, 1e-8);
  EXPECT_DOUBLE_EQ(result.sorptive_number_per_cm, 0.12);
  EXPECT_TRUE(result.warnings.empty());
}

TEST(SingleHead, RoundTripThroughForwardFlow) {
  for (const auto category : all_categories()) {
    const double alpha = sorptive_number_per_cm(category);
    const double kfs = 12.5;
    const double q = well_outflow(15.0, 2.5, shape_factor_soil(category), kfs, kfs / alpha);
    const auto result = single_head_analysis({15.0, q}, 2.5, category);
    EXPECT_NEAR(result.field_saturated_conductivity_cm_per_d, kfs, 1e-10 * kfs) << category_name(category);
  }
}

TEST(SingleHead, RejectsNonPositiveInputs) {
  EXPECT_THROW(single_head_analysis({10.0, -5.0}, 3.0, WellSoilCategory::structured), wetfront::base::InputError);
  EXPECT_THROW(single_head_analysis({0.0, 500.0}, 3.0, WellSoilCategory::structured), wetfront::base::InputError);
  EXPECT_THROW(single_head_analysis({10.0, 500.0}, 0.0, WellSoilCategory::structured), wetfront::base::InputError);
}

TEST(TwoHeads, WorkedFlowsRecoverKfsAndPhi) {
  // Flows for Kfs = 30 cm/d, phi_m = 250 cm2/d, a = 3 cm, structured C, from the
  // Reynolds & Elrick (1985) eq. evaluated independently with Python.
  const WellFlow shallow{5.0, 15771.622914874537};
  const WellFlow deep{15.0, 41343.99948814238};
  EXPECT_NEAR(well_outflow(5.0, 3.0, ShapeFactorSoil::structured_loam_or_clay, 30.0, 250.0),
              shallow.steady_outflow_cm3_per_d, 1e-7);
  const auto result = two_head_analysis(shallow, deep, 3.0, WellSoilCategory::structured);
  EXPECT_NEAR(result.field_saturated_conductivity_cm_per_d, 30.0, 1e-9);
  EXPECT_NEAR(result.matric_flux_potential_cm2_per_d, 250.0, 1e-7);
  EXPECT_NEAR(result.sorptive_number_per_cm, 0.12, 1e-12);
  EXPECT_TRUE(result.warnings.empty());
  EXPECT_NE(result.method.find("two heads"), std::string::npos);
}

TEST(TwoHeads, NegativeSolutionFallsBackToSingleHeadWithWarning) {
  // The deeper head gives barely more flow than the shallower one: the system then needs a
  // negative Kfs or phi_m.
  const WellFlow shallow{5.0, 20000.0};
  const WellFlow deep{15.0, 21000.0};
  const auto result = two_head_analysis(shallow, deep, 3.0, WellSoilCategory::structured);
  ASSERT_EQ(result.warnings.size(), 1u);
  EXPECT_NE(result.warnings[0].find("negative"), std::string::npos);
  const double expected =
      0.5 * (single_head_analysis(shallow, 3.0, WellSoilCategory::structured).field_saturated_conductivity_cm_per_d +
             single_head_analysis(deep, 3.0, WellSoilCategory::structured).field_saturated_conductivity_cm_per_d);
  EXPECT_NEAR(result.field_saturated_conductivity_cm_per_d, expected, 1e-12 * expected);
  EXPECT_GT(result.field_saturated_conductivity_cm_per_d, 0.0);
}

TEST(TwoHeads, RejectsEqualDepths) {
  EXPECT_THROW(two_head_analysis({10.0, 500.0}, {10.0, 600.0}, 3.0, WellSoilCategory::structured),
               wetfront::base::InputError);
}

}  // namespace
