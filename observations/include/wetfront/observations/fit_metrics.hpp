// Goodness of fit between simulated (s) and observed (o) values paired one to one.
//
//   bias = mean(s - o)                         (same units as the values)
//   RMSE = sqrt(mean((s - o)^2))
//   NSE  = 1 - sum (s - o)^2 / sum (o - mean o)^2              Nash & Sutcliffe (1970, J. Hydrol. 10:282)
//   KGE  = 1 - sqrt((r - 1)^2 + (alpha - 1)^2 + (beta - 1)^2)  Gupta et al. (2009, J. Hydrol. 377:80)
//          r Pearson correlation, alpha = sigma_s / sigma_o, beta = mu_s / mu_o
// The standard deviations are population ones (divide by n); alpha does not depend on that
// choice. A statistic that is undefined (no pairs, no spread in the observations, zero
// observed mean for beta) is NaN. beta for pressure heads is a ratio of two negative means;
// it is defined but less telling than the bias.
#pragma once

#include <span>
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

struct FitMetrics {
  int count = 0;
  double bias = 0;  // mean(s - o)
  double root_mean_square_error = 0;
  double nash_sutcliffe = 0;
  double kling_gupta = 0;
  double correlation = 0;        // r
  double variability_ratio = 0;  // alpha
  double mean_ratio = 0;         // beta
};

// Throws base::InputError when the spans differ in length.
FitMetrics fit_metrics(std::span<const double> simulated, std::span<const double> observed);

}  // namespace wetfront::observations
