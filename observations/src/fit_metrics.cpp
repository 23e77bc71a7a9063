// Bias, RMSE, Nash-Sutcliffe (1970) and Kling-Gupta (Gupta et al. 2009) efficiencies.
#include "wetfront/observations/fit_metrics.hpp"

#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

FitMetrics fit_metrics(std::span<const double> simulated, std::span<const double> observed) {
  if (simulated.size() != observed.size())
    throw base::InputError(fmt::format("{} simulated values for {} observations", simulated.size(), observed.size()));
  constexpr double nan = std::numeric_limits<double>::quiet_NaN();
  FitMetrics m;
  m.count = static_cast<int>(observed.size());
  if (m.count == 0) return {0, nan, nan, nan, nan, nan, nan, nan};

  const double n = m.count;
  double sum_s = 0, sum_o = 0, sum_error = 0, sum_squared_error = 0;
  for (std::size_t i = 0; i < observed.size(); ++i) {
    const double error = simulated[i] - observed[i];
    sum_s += simulated[i];
    sum_o += observed[i];
    sum_error += error;
    sum_squared_error += error * error;
  }
  const double mean_s = sum_s / n, mean_o = sum_o / n;
  double ss_s = 0, ss_o = 0, cross = 0;  // sums of squared deviations and cross products
  for (std::size_t i = 0; i < observed.size(); ++i) {
    const double ds = simulated[i] - mean_s, dob = observed[i] - mean_o;
    ss_s += ds * ds;
    ss_o += dob * dob;
    cross += ds * dob;
  }
  m.bias = sum_error / n;
  m.root_mean_square_error = std::sqrt(sum_squared_error / n);
  // Nash & Sutcliffe (1970): 1 - sum (s - o)^2 / sum (o - mean o)^2
  m.nash_sutcliffe = ss_o > 0 ? 1.0 - sum_squared_error / ss_o : nan;
  // Gupta et al. (2009): r, alpha = sigma_s / sigma_o, beta = mu_s / mu_o
  m.correlation = (ss_s > 0 && ss_o > 0) ? cross / std::sqrt(ss_s * ss_o) : nan;
  m.variability_ratio = ss_o > 0 ? std::sqrt(ss_s / ss_o) : nan;
  m.mean_ratio = mean_o != 0 ? mean_s / mean_o : nan;
  m.kling_gupta = 1.0 - std::sqrt(std::pow(m.correlation - 1.0, 2) + std::pow(m.variability_ratio - 1.0, 2) +
                                  std::pow(m.mean_ratio - 1.0, 2));
  return m;
}

}  // namespace wetfront::observations
