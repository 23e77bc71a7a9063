// Hydraulic models: published parameter sets at chosen heads, derivatives against central
// differences, inverse retention round trips, limits, bounds and monotonicity.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <initializer_list>
#include <limits>
#include <string>
#include <vector>

#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace ws = wetfront::soils;

namespace {

struct NamedModel {
  std::string label;
  ws::HydraulicModel model;
  double kink_head_cm;  // head where the model switches branch (0 when smooth below 0)
};

// Suctions 1e-3 .. 1e5 cm, ten per decade, as negative pressure heads.
std::vector<double> test_heads() {
  std::vector<double> heads;
  for (int k = -30; k <= 50; ++k) heads.push_back(-std::pow(10.0, k / 10.0));
  return heads;
}

// Every Carsel & Parrish class, air-entry variants, Brooks-Corey and Gardner sets.
std::vector<NamedModel> all_models() {
  std::vector<NamedModel> models;
  for (const auto& c : ws::texture_classes()) {
    models.push_back({std::string(c.name), c.parameters, 0.0});
    models.push_back(
        {std::string(c.name) + " with air entry -2 cm", ws::VanGenuchtenAirEntry{c.parameters, -2.0}, -2.0});
  }
  auto loam_negative_l = ws::texture_class_parameters("loam");
  loam_negative_l.pore_connectivity = -1.0;
  models.push_back({"loam with l = -1", loam_negative_l, 0.0});
  models.push_back({"Brooks-Corey lambda 0.4", ws::BrooksCorey{0.05, 0.40, -20.0, 0.4, 50.0}, -20.0});
  models.push_back({"Brooks-Corey lambda 2", ws::BrooksCorey{0.02, 0.35, -5.0, 2.0, 300.0}, -5.0});
  models.push_back({"Gardner a 0.05", ws::GardnerExponential{0.02, 0.38, 0.05, 30.0}, 0.0});
  models.push_back({"Gardner a 0.002", ws::GardnerExponential{0.10, 0.45, 0.002, 2.0}, 0.0});
  return models;
}

// Step for a central difference: relative to the head (truncation ~ (dh/h)^2 for the power
// laws of van Genuchten and Brooks-Corey) and at most 0.01 cm (truncation ~ (a dh)^2 / 6 for
// Gardner's exponential).
double difference_step(double h, double relative_step) { return std::min(relative_step * std::abs(h), 0.01); }

template <class F>
double central_difference(F f, double h, double dh) {
  return (f(h + dh) - f(h - dh)) / (2.0 * dh);
}

// Tolerance for comparing with a central difference: 1e-6 relative for truncation, plus the
// rounding of the two function values, about 4 eps |f| / (2 dh) (common practice), which
// dominates where f is nearly flat (Se and K close to 1 and Ks near saturation).
double difference_tolerance(double numeric, double function_value, double dh) {
  constexpr double eps = std::numeric_limits<double>::epsilon();
  return 1e-6 * std::abs(numeric) + 4.0 * eps * std::abs(function_value) / (2.0 * dh);
}

}  // namespace

// ---- Published parameter sets at chosen heads -------------------------------------------
// Parameters: Carsel & Parrish (1988, WRR 24:755) class means with l = 0.5.
// Expected theta and K: the van Genuchten (1980) eq. 3 and eq. 8 formulas evaluated
// independently at 30 digits with mpmath, script tests/soils/hydraulic_reference_values.py.
struct ClassValue {
  const char* texture;
  double head_cm;
  double theta;
  double conductivity_cm_per_d;
};
class PublishedSets : public ::testing::TestWithParam<ClassValue> {};

TEST_P(PublishedSets, WaterContentAndConductivityMatchIndependentEvaluation) {
  const auto v = GetParam();
  const ws::HydraulicModel model = ws::texture_class_parameters(v.texture);
  EXPECT_NEAR(ws::water_content(model, v.head_cm), v.theta, 1e-12 * v.theta);
  EXPECT_NEAR(ws::conductivity(model, v.head_cm), v.conductivity_cm_per_d, 1e-10 * v.conductivity_cm_per_d);
}

INSTANTIATE_TEST_SUITE_P(
    CarselParrish1988, PublishedSets,
    ::testing::Values(ClassValue{"sand", -1.0, 0.42864134607122074, 657.30732300458297},
                      ClassValue{"sand", -10.0, 0.21434410344213855, 15.126452819794223},
                      ClassValue{"sand", -100.0, 0.0493067774914912, 1.7627262878074102e-5},
                      ClassValue{"sand", -1000.0, 0.045090024775439141, 1.1138679134868295e-11},
                      ClassValue{"sand", -15000.0, 0.045000951763773025, 5.6894363801774164e-19},
                      ClassValue{"sandy loam", -1.0, 0.40879154004197911, 85.909394671100516},
                      ClassValue{"sandy loam", -10.0, 0.34309672592343907, 13.467604859185344},
                      ClassValue{"sandy loam", -100.0, 0.12182328906756034, 0.0045515671546251113},
                      ClassValue{"sandy loam", -1000.0, 0.072395305520953026, 2.8133654484133924e-7},
                      ClassValue{"sandy loam", -15000.0, 0.065664191020874524, 3.0230902551436022e-12},
                      ClassValue{"loam", -1.0, 0.42929564611677336, 17.799292372444451},
                      ClassValue{"loam", -10.0, 0.40738893791182292, 5.37741323642046},
                      ClassValue{"loam", -100.0, 0.24213178471815216, 0.033922520345281148},
                      ClassValue{"loam", -1000.0, 0.12525330862273961, 1.6347536846404801e-5},
                      ClassValue{"loam", -15000.0, 0.08838469248730187, 1.6489069637115671e-9},
                      ClassValue{"silt loam", -1.0, 0.44955322336192696, 6.8929481998773191},
                      ClassValue{"silt loam", -10.0, 0.43919859686672968, 2.6367940273307533},
                      ClassValue{"silt loam", -100.0, 0.32968809173162803, 0.070362233264327602},
                      ClassValue{"silt loam", -1000.0, 0.17867116570747427, 0.00010372066531777896},
                      ClassValue{"silt loam", -15000.0, 0.10394353577830543, 2.9313043644059019e-8},
                      ClassValue{"clay", -1.0, 0.37986691670358892, 0.59704419186260079},
                      ClassValue{"clay", -10.0, 0.37841238248878797, 0.20591415021099887},
                      ClassValue{"clay", -100.0, 0.36543723369993461, 0.020186813893066001},
                      ClassValue{"clay", -1000.0, 0.32464893989789563, 0.00028642147735630821},
                      ClassValue{"clay", -15000.0, 0.27069105653902371, 7.6923233125163076e-7}));

namespace {

// Water content (to 1e-12, relative) and conductivity (to 1e-10, relative) at each head, against
// independently evaluated values.
struct ValueAtHead {
  double h, theta, k;
};
void expect_values(const ws::HydraulicModel& model, std::initializer_list<ValueAtHead> expected) {
  for (const auto& e : expected) {
    EXPECT_NEAR(ws::water_content(model, e.h), e.theta, 1e-12 * e.theta) << "h = " << e.h;
    EXPECT_NEAR(ws::conductivity(model, e.h), e.k, 1e-10 * e.k) << "h = " << e.h;
  }
}

}  // namespace

// Air-entry model on the Carsel & Parrish (1988) loam with h_e = -2 cm. Expected values:
// Ippisch, Vogel & Bastian (2006) eq. 9-11 evaluated independently (mpmath, same script).
TEST(AirEntryModel, LoamMatchesIndependentEvaluation) {
  const ws::HydraulicModel model = ws::VanGenuchtenAirEntry{ws::texture_class_parameters("loam"), -2.0};
  expect_values(model, {{-2.5, 0.42914996042373197, 23.049179879821761},
                        {-10.0, 0.40932950713784908, 9.0446169777204067},
                        {-100.0, 0.24309875432088381, 0.057056467478447256},
                        {-1000.0, 0.12553169780339191, 2.7495973027233018e-5},
                        {-15000.0, 0.0884458730927902, 2.7734026125532715e-9}});
}

// Brooks & Corey (1964) retention with Burdine conductivity; a parameter set chosen for the
// test (theta_r 0.05, theta_s 0.40, h_b -20 cm, lambda 0.4, Ks 50 cm/d), evaluated
// independently with mpmath (tests/soils/hydraulic_reference_values.py).
TEST(BrooksCoreyModel, MatchesIndependentEvaluation) {
  const ws::HydraulicModel model = ws::BrooksCorey{0.05, 0.40, -20.0, 0.4, 50.0};
  expect_values(model, {{-25.0, 0.37011353634912844, 24.482623994624947},
                        {-100.0, 0.23385694630826371, 0.28991186547107821},
                        {-1000.0, 0.12319476868138913, 0.00018292202077093054},
                        {-15000.0, 0.074776704371881805, 3.1533629561623368e-8}});
  EXPECT_DOUBLE_EQ(ws::water_content(model, -19.0), 0.40);  // wetter than the bubbling head
  EXPECT_DOUBLE_EQ(ws::conductivity(model, -19.0), 50.0);
}

// Gardner (1958) exponential model; parameter set chosen for the test (theta_r 0.02,
// theta_s 0.38, a 0.05 1/cm, Ks 30 cm/d), evaluated independently with mpmath.
TEST(GardnerModel, MatchesIndependentEvaluation) {
  const ws::HydraulicModel model = ws::GardnerExponential{0.02, 0.38, 0.05, 30.0};
  expect_values(model, {{-1.0, 0.36244259282025704, 28.53688273502142},
                        {-10.0, 0.23835103749654803, 18.195919791379003},
                        {-100.0, 0.022425660919670768, 0.20213840997256401},
                        {-500.0, 0.02000000000499966, 4.1663831594892062e-10}});
}

// ---- Derivatives against central differences ---------------------------------------------
// C(h) = range * dSe/dh: differencing Se (not theta) keeps full precision where theta is
// close to theta_r. Points closer than 10 steps to a branch switch are skipped.
TEST(Derivatives, MoistureCapacityMatchesCentralDifference) {
  constexpr double step = 1e-4;
  for (const auto& m : all_models()) {
    const double range = ws::saturated_water_content(m.model) - ws::residual_water_content(m.model);
    for (const double h : test_heads()) {
      const double dh = difference_step(h, step);
      if (std::abs(h - m.kink_head_cm) < 10 * dh) continue;
      const double numeric =
          range * central_difference([&](double x) { return ws::effective_saturation(m.model, x); }, h, dh);
      const double analytic = ws::moisture_capacity(m.model, h);
      EXPECT_NEAR(analytic, numeric,
                  range * difference_tolerance(numeric / range, ws::effective_saturation(m.model, h), dh))
          << m.label << " at h = " << h;
      EXPECT_GE(analytic, 0.0) << m.label << " at h = " << h;
    }
  }
}

TEST(Derivatives, ConductivitySlopeMatchesCentralDifference) {
  constexpr double step = 1e-4;
  for (const auto& m : all_models()) {
    for (const double h : test_heads()) {
      const double dh = difference_step(h, step);
      if (std::abs(h - m.kink_head_cm) < 10 * dh) continue;
      const double numeric = central_difference([&](double x) { return ws::conductivity(m.model, x); }, h, dh);
      const double analytic = ws::conductivity_slope(m.model, h);
      EXPECT_NEAR(analytic, numeric, difference_tolerance(numeric, ws::conductivity(m.model, h), dh))
          << m.label << " at h = " << h;
      EXPECT_GE(analytic, 0.0) << m.label << " at h = " << h;
    }
  }
}

TEST(Derivatives, EvaluateBundleAgreesWithSingleFunctions) {
  for (const auto& m : all_models()) {
    for (const double h : test_heads()) {
      const auto s = ws::evaluate(m.model, h);
      EXPECT_EQ(s.water_content, ws::water_content(m.model, h)) << m.label;
      EXPECT_EQ(s.moisture_capacity, ws::moisture_capacity(m.model, h)) << m.label;
      EXPECT_EQ(s.conductivity, ws::conductivity(m.model, h)) << m.label;
      EXPECT_EQ(s.conductivity_slope, ws::conductivity_slope(m.model, h)) << m.label;
    }
  }
}

// ---- Inverse retention ------------------------------------------------------------------
// h(theta(h)) = h to the accuracy the curve allows: a water-content rounding of a few ulps
// moves the head by about eps * theta / C(h), large where the curve is flat.
TEST(InverseRetention, RoundTripOverFullSuctionRange) {
  constexpr double eps = std::numeric_limits<double>::epsilon();
  for (const auto& m : all_models()) {
    int checked = 0;
    for (const double h : test_heads()) {
      if (h >= m.kink_head_cm && m.kink_head_cm < 0.0) continue;  // flat at theta_s above h_e or h_b
      // Below Se ~ 1e-12 theta equals theta_r to double precision: no head can be recovered.
      if (ws::effective_saturation(m.model, h) < 1e-12) continue;
      const double theta = ws::water_content(m.model, h);
      const double back = ws::pressure_head_at(m.model, theta);
      const double allowed = 1e-9 * std::abs(h) + 8.0 * eps * theta / ws::moisture_capacity(m.model, h);
      EXPECT_NEAR(back, h, allowed) << m.label << " theta = " << theta;
      ++checked;
    }
    EXPECT_GT(checked, 20) << m.label;
  }
}

TEST(InverseRetention, SaturationGivesTheAirEntryOrZeroHead) {
  const auto loam = ws::texture_class_parameters("loam");
  EXPECT_EQ(ws::pressure_head_at(loam, loam.saturated_water_content), 0.0);
  EXPECT_EQ(ws::pressure_head_at(ws::VanGenuchtenAirEntry{loam, -2.0}, loam.saturated_water_content), -2.0);
  EXPECT_EQ(ws::pressure_head_at(ws::BrooksCorey{0.05, 0.40, -20.0, 0.4, 50.0}, 0.40), -20.0);
  EXPECT_EQ(ws::pressure_head_at(ws::GardnerExponential{0.02, 0.38, 0.05, 30.0}, 0.38), 0.0);
}

TEST(InverseRetention, WaterContentOutsideTheCurveIsRejected) {
  const auto loam = ws::texture_class_parameters("loam");
  EXPECT_THROW(ws::pressure_head_at(loam, loam.residual_water_content), std::domain_error);
  EXPECT_THROW(ws::pressure_head_at(loam, 0.01), std::domain_error);
  EXPECT_THROW(ws::pressure_head_at(loam, 0.431), std::domain_error);
  EXPECT_THROW(ws::pressure_head_at(loam, std::nan("")), std::domain_error);
}

// ---- Limits, bounds, monotonicity ---------------------------------------------------------
TEST(Limits, SaturatedValuesAtAndAboveZeroHead) {
  for (const auto& m : all_models()) {
    for (const double h : {0.0, 5.0, 100.0}) {
      EXPECT_EQ(ws::conductivity(m.model, h), ws::saturated_conductivity(m.model)) << m.label;
      EXPECT_EQ(ws::water_content(m.model, h), ws::saturated_water_content(m.model)) << m.label;
      EXPECT_EQ(ws::effective_saturation(m.model, h), 1.0) << m.label;
      EXPECT_EQ(ws::moisture_capacity(m.model, h), 0.0) << m.label;
      EXPECT_EQ(ws::conductivity_slope(m.model, h), 0.0) << m.label;
      EXPECT_EQ(ws::relative_conductivity(m.model, h), 1.0) << m.label;
    }
  }
}

TEST(Limits, SaturationInUnitIntervalAndCurvesMonotone) {
  for (const auto& m : all_models()) {
    double previous_theta = -1.0, previous_k = -1.0;
    // Heads from dry to wet: theta and K must not decrease.
    auto heads = test_heads();
    for (auto it = heads.rbegin(); it != heads.rend(); ++it) {
      const double h = *it;
      const double se = ws::effective_saturation(m.model, h);
      EXPECT_GE(se, 0.0) << m.label << " at h = " << h;
      EXPECT_LE(se, 1.0) << m.label << " at h = " << h;
      const double theta = ws::water_content(m.model, h);
      const double k = ws::conductivity(m.model, h);
      EXPECT_GE(theta, previous_theta) << m.label << " at h = " << h;
      EXPECT_GE(k, previous_k) << m.label << " at h = " << h;
      EXPECT_GE(k, 0.0) << m.label;
      EXPECT_LE(k, ws::saturated_conductivity(m.model)) << m.label;
      previous_theta = theta;
      previous_k = k;
    }
  }
}

TEST(Limits, DryLimitApproachesResidualAndZeroConductivity) {
  const auto sand = ws::texture_class_parameters("sand");
  EXPECT_NEAR(ws::water_content(sand, -1e7), sand.residual_water_content, 1e-9);
  EXPECT_LT(ws::relative_conductivity(sand, -1e7), 1e-25);
  EXPECT_GT(ws::conductivity(sand, -1e5), 0.0);  // still resolved, not rounded to zero
}

// ---- Air-entry model continuity at h_e ----------------------------------------------------
TEST(AirEntryModel, ContinuousAtAirEntryHeadWithFiniteSlope) {
  for (const auto& c : ws::texture_classes()) {
    const double he = -2.0;
    const ws::HydraulicModel model = ws::VanGenuchtenAirEntry{c.parameters, he};
    const double ks = c.parameters.saturated_conductivity_cm_per_d;
    const double ts = c.parameters.saturated_water_content;
    for (const double gap : {1e-6, 1e-9}) {
      EXPECT_NEAR(ws::conductivity(model, he - gap), ks, 1e-4 * ks * gap / 1e-6) << c.name;
      EXPECT_NEAR(ws::water_content(model, he - gap), ts, 1e-5 * gap / 1e-6) << c.name;
    }
    EXPECT_EQ(ws::conductivity(model, he), ks);
    // The point of the air-entry value (Ippisch et al. 2006): dK/dh stays bounded next to h_e,
    // unlike plain van Genuchten-Mualem with n < 2 near h = 0.
    const double slope_near = ws::conductivity_slope(model, he - 1e-9);
    const double slope_farther = ws::conductivity_slope(model, he - 1e-3);
    EXPECT_TRUE(std::isfinite(slope_near)) << c.name;
    EXPECT_LT(slope_near, 2.0 * slope_farther + 1e-12) << c.name;
  }
}

TEST(VanGenuchtenModel, SlopeUnboundedNearSaturationWhenNBelowTwo) {
  // Mualem factor ~ x^(n-1): dK/dh grows without bound as h -> 0- for n < 2 (Ippisch et al. 2006).
  const auto clay = ws::texture_class_parameters("clay");
  EXPECT_GT(ws::conductivity_slope(clay, -1e-8), 10.0 * ws::conductivity_slope(clay, -1e-4));
}
