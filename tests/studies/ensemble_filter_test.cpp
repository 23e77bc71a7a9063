// The analysis step of the ensemble Kalman filter on linear-Gaussian cases worked by hand.
// Formulas: the Kalman (1960) update of a Gaussian prior N(m, P) by a reading d = x + e,
// e ~ N(0, R): gain K = P / (P + R), mean m + K (d - m), variance (1 - K) P (common practice);
// the ensemble form with sample covariances and perturbed readings: Evensen (2003, Eqs. 20-21,
// from memory) and Burgers, van Leeuwen & Evensen (1998), who show that perturbed readings give
// the analysed ensemble the variance (1 - K) P.
#include <gtest/gtest.h>

#include <cmath>
#include <random>
#include <stdexcept>

#include "wetfront/studies/ensemble_filter.hpp"

namespace wetfront::studies {
namespace {

TEST(EnsembleFilter, ScalarCaseWorkedByHand) {
  // Members 1 and 3: mean 2, sample variance ((1-2)^2 + (3-2)^2) / (2 - 1) = 2. R = 2, so
  // K = 2 / (2 + 2) = 0.5. Perturbed readings 5 and 3: member 1 -> 1 + 0.5 (5 - 1) = 3,
  // member 3 -> 3 + 0.5 (3 - 3) = 3.
  Eigen::MatrixXd states(1, 2);
  states << 1, 3;
  Eigen::MatrixXd perturbed(1, 2);
  perturbed << 5, 3;
  const Eigen::VectorXd variance = Eigen::VectorXd::Constant(1, 2.0);
  EXPECT_NEAR(kalman_gain(states, states, variance)(0, 0), 0.5, 1e-15);
  const Eigen::MatrixXd analysed = analysed_states(states, states, perturbed, variance);
  EXPECT_NEAR(analysed(0, 0), 3.0, 1e-14);
  EXPECT_NEAR(analysed(0, 1), 3.0, 1e-14);
}

TEST(EnsembleFilter, UnobservedStateFollowsThroughItsCovariance) {
  // x1 = 0, 1, 2 is read; x2 = 0, 2, 4 is not. Anomalies (-1, 0, 1) and (-2, 0, 2);
  // C_xy = (2/2, 4/2) = (1, 2), C_yy = 1, R = 1: K = (0.5, 1). Readings 1, 1, 1 give
  // innovations 1, 0, -1: x1 -> 0.5, 1, 1.5 and x2 -> 1, 2, 3.
  Eigen::MatrixXd states(2, 3);
  states << 0, 1, 2, 0, 2, 4;
  const Eigen::MatrixXd predicted = states.topRows(1);
  const Eigen::MatrixXd readings = Eigen::MatrixXd::Ones(1, 3);
  const Eigen::VectorXd variance = Eigen::VectorXd::Ones(1);
  const Eigen::MatrixXd gain = kalman_gain(states, predicted, variance);
  EXPECT_NEAR(gain(0, 0), 0.5, 1e-15);
  EXPECT_NEAR(gain(1, 0), 1.0, 1e-15);
  Eigen::MatrixXd expected(2, 3);
  expected << 0.5, 1, 1.5, 1, 2, 3;
  EXPECT_LT((analysed_states(states, predicted, readings, variance) - expected).cwiseAbs().maxCoeff(), 1e-14);
}

TEST(EnsembleFilter, LocalisationWeightsTheCrossCovariance) {
  // The same case with the unobserved state's weight 0.25: K = (0.5, 0.25).
  Eigen::MatrixXd states(2, 3);
  states << 0, 1, 2, 0, 2, 4;
  Localisation weights;
  weights.state_reading = Eigen::MatrixXd(2, 1);
  weights.state_reading << 1.0, 0.25;
  const Eigen::MatrixXd gain = kalman_gain(states, states.topRows(1), Eigen::VectorXd::Ones(1), weights);
  EXPECT_NEAR(gain(0, 0), 0.5, 1e-15);
  EXPECT_NEAR(gain(1, 0), 0.25, 1e-15);
}

TEST(EnsembleFilter, ManyMembersReachTheKalmanMeanAndVariance) {
  // Prior N(1, 4), reading 3 with R = 1: K = 0.8, mean 1 + 0.8 * 2 = 2.6, variance 0.2 * 4 = 0.8.
  const int members = 40000;
  std::mt19937_64 generator(7);
  std::normal_distribution<double> prior(1.0, 2.0);
  Eigen::MatrixXd states(1, members);
  for (int j = 0; j < members; ++j) states(0, j) = prior(generator);
  const Eigen::VectorXd reading = Eigen::VectorXd::Constant(1, 3.0);
  const Eigen::VectorXd sd = Eigen::VectorXd::Ones(1);
  const Eigen::MatrixXd perturbed = perturbed_readings(reading, sd, members, 11, 0);
  const Eigen::MatrixXd analysed = analysed_states(states, states, perturbed, sd.array().square());
  const double mean = analysed.mean();
  const double variance = (analysed.array() - mean).square().sum() / (members - 1);
  // Sampling error of the mean about sqrt(0.8 / 40000) = 0.0045, of the variance about 0.006.
  EXPECT_NEAR(mean, 2.6, 0.03);
  EXPECT_NEAR(variance, 0.8, 0.04);
}

TEST(EnsembleFilter, PerturbationsBelongToTheirMember) {
  const Eigen::VectorXd readings = Eigen::VectorXd::Constant(3, 10.0);
  const Eigen::VectorXd sd = Eigen::VectorXd::Constant(3, 2.0);
  const Eigen::MatrixXd few = perturbed_readings(readings, sd, 4, 5, 2);
  const Eigen::MatrixXd more = perturbed_readings(readings, sd, 9, 5, 2);
  EXPECT_EQ(few, more.leftCols(4));                           // member j draws the same whatever the ensemble size
  EXPECT_NE(few, perturbed_readings(readings, sd, 4, 5, 3));  // another visit, other draws
  EXPECT_NE(few, perturbed_readings(readings, sd, 4, 6, 2));  // another seed, other draws
  const Eigen::MatrixXd many = perturbed_readings(readings, sd, 20000, 5, 2);
  EXPECT_NEAR(many.mean(), 10.0, 0.05);
  EXPECT_NEAR(std::sqrt((many.array() - many.mean()).square().mean()), 2.0, 0.03);
}

TEST(EnsembleFilter, GaspariCohnFunctionShape) {
  // Gaspari & Cohn (1999, Eq. 4.10; from memory): 1 at 0, 5/24 at the half width (both branches
  // agree there), 0 from twice the half width on.
  EXPECT_DOUBLE_EQ(gaspari_cohn(0.0, 30.0), 1.0);
  EXPECT_NEAR(gaspari_cohn(30.0, 30.0), 5.0 / 24.0, 1e-14);
  EXPECT_NEAR(gaspari_cohn(30.0 - 1e-9, 30.0), gaspari_cohn(30.0 + 1e-9, 30.0), 1e-9);
  EXPECT_NEAR(gaspari_cohn(60.0 - 1e-6, 30.0), 0.0, 1e-12);
  EXPECT_EQ(gaspari_cohn(75.0, 30.0), 0.0);
  EXPECT_EQ(gaspari_cohn(-10.0, 30.0), gaspari_cohn(10.0, 30.0));
}

TEST(EnsembleFilter, RefusesBadShapes) {
  const Eigen::MatrixXd one(1, 1);
  EXPECT_THROW(kalman_gain(one, one, Eigen::VectorXd::Ones(1)), std::invalid_argument);  // one member
  const Eigen::MatrixXd two = Eigen::MatrixXd::Ones(1, 2);
  EXPECT_THROW(kalman_gain(two, two, Eigen::VectorXd::Zero(1)), std::invalid_argument);  // zero variance
  EXPECT_THROW(kalman_gain(two, two, Eigen::VectorXd::Ones(2)), std::invalid_argument);  // lengths differ
}

}  // namespace
}  // namespace wetfront::studies
