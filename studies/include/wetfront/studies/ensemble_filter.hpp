// The analysis step of the ensemble Kalman filter (Evensen 1994) with perturbed readings
// (Burgers, van Leeuwen & Evensen 1998). No physics: states and predicted readings are plain
// columns, one per member.
//
// With N members, states X (n x N), the readings each member predicts Y = H(X) (m x N, H may
// be nonlinear), anomalies A = X - mean(X) and B = Y - mean(Y), and reading error variances R
// (diagonal: readings independent):
//   C_xy = A B^T / (N - 1),   C_yy = B B^T / (N - 1)                       (sample covariances)
//   K    = C_xy (C_yy + R)^-1                                              (Kalman gain)
//   X_a  = X + K (D - Y),   D_j = d + e_j,  e_j ~ N(0, R)                  (perturbed readings)
// (Evensen 2003, Ocean Dynamics 53, Eqs. 20-21 and the nonlinear measurement operator of his
// Sect. 4.5, from memory.) Perturbing the readings gives the analysed ensemble the covariance
// of the Kalman filter, (I - K H) P, in the limit of many members (Burgers et al. 1998).
//
// Localisation (Houtekamer & Mitchell 2001; Hamill, Whitaker & Snyder 2001): with few members,
// sample covariances between a state and a reading far from it are mostly noise; the gain then
// uses rho o C_xy and rho_yy o C_yy (element by element) with weights in [0, 1] that the caller
// gives, for example gaspari_cohn of the distance between state and reading and between readings.
//
// Every member's perturbation comes from its own generator, seeded by (seed, step, member), so
// the draws do not depend on the order or the thread the members were run on.
#pragma once

#include <cstddef>
#include <cstdint>

#include <Eigen/Dense>

namespace wetfront::studies {

// Columns minus their mean column.
Eigen::MatrixXd ensemble_anomalies(const Eigen::MatrixXd& members);

// The gain K (n x m) from states (n x N), predicted readings (m x N) and reading variances (m).
// Throws std::invalid_argument for fewer than two members, shapes that disagree, or a variance
// that is not positive.
// Localisation weights, each used when not empty: of C_xy (n x m) and of C_yy (m x m).
struct Localisation {
  Eigen::MatrixXd state_reading;
  Eigen::MatrixXd reading_reading;
};

Eigen::MatrixXd kalman_gain(const Eigen::MatrixXd& states, const Eigen::MatrixXd& predicted,
                            const Eigen::VectorXd& reading_variances, const Localisation& localisation = {});

// The compactly supported correlation function of Gaspari & Cohn (1999, Eq. 4.10; from memory):
// 1 at distance 0, falling smoothly to 0 at twice `half_width` and beyond.
double gaspari_cohn(double distance, double half_width);

// D (m x N): column j is readings + sd * z with z standard normal from member j's generator.
Eigen::MatrixXd perturbed_readings(const Eigen::VectorXd& readings, const Eigen::VectorXd& reading_sd,
                                   std::size_t members, std::uint64_t seed, std::uint64_t step);

// X_a = X + K (D - Y), with K from kalman_gain. Throws like kalman_gain, and when D and Y differ
// in shape.
Eigen::MatrixXd analysed_states(const Eigen::MatrixXd& states, const Eigen::MatrixXd& predicted,
                                const Eigen::MatrixXd& perturbed, const Eigen::VectorXd& reading_variances,
                                const Localisation& localisation = {});

}  // namespace wetfront::studies
