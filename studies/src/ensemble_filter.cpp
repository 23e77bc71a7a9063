#include "wetfront/studies/ensemble_filter.hpp"

#include <cmath>
#include <random>
#include <stdexcept>

#include "random_draws.hpp"

namespace wetfront::studies {

Eigen::MatrixXd ensemble_anomalies(const Eigen::MatrixXd& members) {
  return members.colwise() - members.rowwise().mean();
}

Eigen::MatrixXd kalman_gain(const Eigen::MatrixXd& states, const Eigen::MatrixXd& predicted,
                            const Eigen::VectorXd& reading_variances, const Localisation& localisation) {
  const Eigen::Index members = states.cols();
  if (members < 2) throw std::invalid_argument("the ensemble Kalman filter needs at least two members");
  if (predicted.cols() != members || predicted.rows() != reading_variances.size())
    throw std::invalid_argument("kalman_gain: states, predicted readings and variances do not fit together");
  if (!(reading_variances.array() > 0).all())
    throw std::invalid_argument("kalman_gain: every reading variance must be positive");
  const Eigen::MatrixXd a = ensemble_anomalies(states);
  const Eigen::MatrixXd b = ensemble_anomalies(predicted);
  const double scale = 1.0 / static_cast<double>(members - 1);
  Eigen::MatrixXd cross = scale * a * b.transpose();                  // C_xy
  Eigen::MatrixXd innovation_covariance = scale * b * b.transpose();  // C_yy
  const auto& rho_xy = localisation.state_reading;
  const auto& rho_yy = localisation.reading_reading;
  if ((rho_xy.size() > 0 && (rho_xy.rows() != cross.rows() || rho_xy.cols() != cross.cols())) ||
      (rho_yy.size() > 0 &&
       (rho_yy.rows() != innovation_covariance.rows() || rho_yy.cols() != innovation_covariance.cols())))
    throw std::invalid_argument("kalman_gain: the localisation weights do not fit the states and readings");
  if (rho_xy.size() > 0) cross = cross.cwiseProduct(rho_xy);
  if (rho_yy.size() > 0) innovation_covariance = innovation_covariance.cwiseProduct(rho_yy);
  innovation_covariance.diagonal() += reading_variances;  // C_yy + R: symmetric positive definite
  // K^T = (C_yy + R)^-1 C_xy^T
  return innovation_covariance.ldlt().solve(cross.transpose()).transpose();
}

double gaspari_cohn(double distance, double half_width) {
  const double r = std::abs(distance) / half_width;
  if (r >= 2.0) return 0.0;
  if (r <= 1.0) return (((-0.25 * r + 0.5) * r + 0.625) * r - 5.0 / 3.0) * r * r + 1.0;
  return ((((r / 12.0 - 0.5) * r + 0.625) * r + 5.0 / 3.0) * r - 5.0) * r + 4.0 - 2.0 / (3.0 * r);
}

Eigen::MatrixXd perturbed_readings(const Eigen::VectorXd& readings, const Eigen::VectorXd& reading_sd,
                                   std::size_t members, std::uint64_t seed, std::uint64_t step) {
  if (reading_sd.size() != readings.size())
    throw std::invalid_argument("perturbed_readings: readings and their uncertainties differ in length");
  Eigen::MatrixXd perturbed(readings.size(), static_cast<Eigen::Index>(members));
  for (std::size_t j = 0; j < members; ++j) {
    // std::seed_seq and the engine's seeding from it are fixed by the standard.
    std::seed_seq sequence{static_cast<std::uint32_t>(seed), static_cast<std::uint32_t>(seed >> 32),
                           static_cast<std::uint32_t>(step), static_cast<std::uint32_t>(step >> 32),
                           static_cast<std::uint32_t>(j),    static_cast<std::uint32_t>(j >> 32)};
    std::mt19937_64 generator(sequence);
    for (Eigen::Index i = 0; i < readings.size(); ++i)
      perturbed(i, static_cast<Eigen::Index>(j)) = readings[i] + reading_sd[i] * detail::standard_normal(generator);
  }
  return perturbed;
}

Eigen::MatrixXd analysed_states(const Eigen::MatrixXd& states, const Eigen::MatrixXd& predicted,
                                const Eigen::MatrixXd& perturbed, const Eigen::VectorXd& reading_variances,
                                const Localisation& localisation) {
  if (perturbed.rows() != predicted.rows() || perturbed.cols() != predicted.cols())
    throw std::invalid_argument("analysed_states: perturbed and predicted readings differ in shape");
  return states + kalman_gain(states, predicted, reading_variances, localisation) * (perturbed - predicted);
}

}  // namespace wetfront::studies
