// Tension disc infiltrometer (Wooding 1968 with a Gardner soil).
#include "wetfront/soils/tension_infiltrometer.hpp"

#include <cmath>
#include <numbers>
#include <vector>

#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

namespace {

using namespace wetfront::soils;

TEST(DiscInflow, WorkedValuesOfWoodingEquation) {
  // Wooding (1968): Q = pi r^2 Ks exp(alpha h) (1 + 4 / (pi r alpha)); r = 10 cm,
  // Ks = 20 cm/d, alpha = 0.05 /cm; expected values computed independently with Python.
  EXPECT_NEAR(disc_inflow(-15.0, 10.0, 20.0, 0.05), 10525.831427641651, 1e-8);
  EXPECT_NEAR(disc_inflow(-6.0, 10.0, 20.0, 0.05), 16507.789690385784, 1e-8);
  EXPECT_NEAR(disc_inflow(-3.0, 10.0, 20.0, 0.05), 19179.31533404712, 1e-8);
}

TEST(AnalyseDisc, HandExampleTwoHeads) {
  // Q halves from -3 to -9 cm: alpha = ln 2 / 6 = 0.115525 /cm (ratio form of Wooding 1968
  // under Gardner 1958). K and Ks by Python from the same equations: K(-3) = 4.542660,
  // K(-9) = 2.271330, Ks = 6.424291 cm/d.
  const std::vector<DiscFlow> flows = {{-9.0, 1500.0}, {-3.0, 3000.0}};
  const auto result = analyse_disc(flows, 10.0);
  ASSERT_EQ(result.pairs.size(), 1u);
  EXPECT_NEAR(result.pairs[0].alpha_per_cm, 0.11552453009332421, 1e-14);
  ASSERT_EQ(result.conductivities.size(), 2u);
  EXPECT_DOUBLE_EQ(result.conductivities[0].supply_head_cm, -9.0);
  EXPECT_NEAR(result.conductivities[0].conductivity_cm_per_d, 2.271329802059408, 1e-12);
  EXPECT_NEAR(result.conductivities[1].conductivity_cm_per_d, 4.542659604118816, 1e-12);
  EXPECT_NEAR(result.saturated_conductivity_cm_per_d, 6.424290821389223, 1e-12);
  EXPECT_DOUBLE_EQ(result.saturated_from.drier_head_cm, -9.0);
  EXPECT_DOUBLE_EQ(result.saturated_from.wetter_head_cm, -3.0);
}

TEST(AnalyseDisc, RoundTripGardnerSoilAnyOrder) {
  const double ks = 20.0;
  const double alpha = 0.05;
  std::vector<DiscFlow> flows;
  for (const double head : {-3.0, -15.0, -6.0}) flows.push_back({head, disc_inflow(head, 10.0, ks, alpha)});
  const auto result = analyse_disc(flows, 10.0);
  ASSERT_EQ(result.pairs.size(), 2u);
  for (const auto& pair : result.pairs) EXPECT_NEAR(pair.alpha_per_cm, alpha, 1e-12);
  EXPECT_DOUBLE_EQ(result.pairs[0].heads.drier_head_cm, -15.0);
  EXPECT_DOUBLE_EQ(result.pairs[1].heads.wetter_head_cm, -3.0);
  for (const auto& k : result.conductivities) {
    EXPECT_NEAR(k.conductivity_cm_per_d, ks * std::exp(alpha * k.supply_head_cm), 1e-10);
  }
  EXPECT_NEAR(result.saturated_conductivity_cm_per_d, ks, 1e-10);
}

TEST(AnalyseDisc, PiecewiseAlphaUsesTheWettestPairForKs) {
  // Steeper near saturation (macropores): alpha 0.2 /cm between -3 and -1 cm, 0.05 below.
  // Ks must come from the wettest pair only.
  const double r = 12.0;
  const double q_wet = 9000.0;
  const double q_mid = q_wet * std::exp(-0.2 * 2.0);
  const double q_dry = q_mid * std::exp(-0.05 * 7.0);
  const std::vector<DiscFlow> flows = {{-1.0, q_wet}, {-3.0, q_mid}, {-10.0, q_dry}};
  const auto result = analyse_disc(flows, r);
  EXPECT_NEAR(result.pairs[0].alpha_per_cm, 0.05, 1e-12);
  EXPECT_NEAR(result.pairs[1].alpha_per_cm, 0.2, 1e-12);
  const double k_wet = q_wet / (std::numbers::pi * r * r * (1.0 + 4.0 / (std::numbers::pi * r * 0.2)));
  EXPECT_NEAR(result.saturated_conductivity_cm_per_d, k_wet * std::exp(0.2 * 1.0), 1e-10);
  EXPECT_DOUBLE_EQ(result.conductivities[0].alpha_from.wetter_head_cm, -3.0);
}

TEST(AnalyseDisc, RejectsBadInput) {
  const std::vector<DiscFlow> one = {{-3.0, 100.0}};
  EXPECT_THROW(analyse_disc(one, 10.0), wetfront::base::InputError);
  const std::vector<DiscFlow> positive_head = {{-3.0, 100.0}, {2.0, 200.0}};
  EXPECT_THROW(analyse_disc(positive_head, 10.0), wetfront::base::InputError);
  const std::vector<DiscFlow> zero_head = {{-3.0, 100.0}, {0.0, 200.0}};
  EXPECT_THROW(analyse_disc(zero_head, 10.0), wetfront::base::InputError);
  const std::vector<DiscFlow> negative_rate = {{-3.0, -100.0}, {-6.0, 50.0}};
  EXPECT_THROW(analyse_disc(negative_rate, 10.0), wetfront::base::InputError);
  const std::vector<DiscFlow> repeated = {{-3.0, 100.0}, {-3.0, 120.0}};
  EXPECT_THROW(analyse_disc(repeated, 10.0), wetfront::base::InputError);
  const std::vector<DiscFlow> falling_toward_wet = {{-3.0, 100.0}, {-6.0, 150.0}};
  EXPECT_THROW(analyse_disc(falling_toward_wet, 10.0), wetfront::base::InputError);
  const std::vector<DiscFlow> good = {{-3.0, 200.0}, {-6.0, 150.0}};
  EXPECT_THROW(analyse_disc(good, 0.0), wetfront::base::InputError);
  EXPECT_NO_THROW(analyse_disc(good, 10.0));
}

}  // namespace
