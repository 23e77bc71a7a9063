// Flagging recharge estimates that disagree by more than a factor of two.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <string>

#include "wetfront/observations/recharge_estimates.hpp"

namespace wetfront::observations {
namespace {

bool mentions(const EstimateAgreement& a, const std::string& phrase) {
  for (const std::string& reason : a.reasons_to_consider)
    if (reason.find(phrase) != std::string::npos) return true;
  return false;
}

TEST(RechargeComparison, FactorOfTwoIsTheBoundary) {
  const EstimateAgreement exactly_two = compare_recharge_estimates(1.0, 2.0);
  EXPECT_FALSE(exactly_two.disagree);
  EXPECT_DOUBLE_EQ(exactly_two.ratio, 2.0);
  EXPECT_TRUE(exactly_two.reasons_to_consider.empty());

  const EstimateAgreement beyond = compare_recharge_estimates(4.2, 2.0);
  EXPECT_TRUE(beyond.disagree);
  EXPECT_NEAR(beyond.ratio, 2.1, 1e-12);
  EXPECT_TRUE(mentions(beyond, "soil parameters"));
  EXPECT_TRUE(mentions(beyond, "sensor depth"));
  EXPECT_TRUE(mentions(beyond, "preferential flow"));
}

TEST(RechargeComparison, OppositeSignsAndZeros) {
  EXPECT_TRUE(compare_recharge_estimates(1.0, -1.0).disagree);
  const EstimateAgreement both_zero = compare_recharge_estimates(0.0, 0.0);
  EXPECT_FALSE(both_zero.disagree);
  EXPECT_TRUE(std::isnan(both_zero.ratio));
  const EstimateAgreement one_zero = compare_recharge_estimates(0.0, 0.05);
  EXPECT_TRUE(one_zero.disagree);
  EXPECT_TRUE(std::isinf(one_zero.ratio));
  // Both below a negligible amount of 0.1 cm: no disagreement whatever the ratio.
  EXPECT_FALSE(compare_recharge_estimates(0.0, 0.05, {2.0, 0.1}).disagree);
  EXPECT_THROW(compare_recharge_estimates(1.0, 1.0, {1.0, 0.0}), wetfront::base::InputError);
}

}  // namespace
}  // namespace wetfront::observations
