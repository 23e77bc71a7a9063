#include "member_state.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace wetfront::site::detail {

double log_suction(double head_cm) { return std::log10(1.0 + std::max(-head_cm, 0.0)); }

std::vector<double> heads_from_log_suction(const soils::LayeredProfile& soil, std::span<const double> cell_depths_cm,
                                           std::span<const double> forecast_heads_cm,
                                           std::span<const double> analysed_log_suction) {
  const std::size_t n = cell_depths_cm.size();
  if (forecast_heads_cm.size() != n || analysed_log_suction.size() != n)
    throw std::invalid_argument("heads_from_log_suction: one forecast head and one analysed value per cell");
  std::vector<double> heads(forecast_heads_cm.begin(), forecast_heads_cm.end());
  for (std::size_t i = 0; i < n; ++i) {
    const double value = analysed_log_suction[i];
    if (value == log_suction(forecast_heads_cm[i]) || (value <= 0 && forecast_heads_cm[i] >= 0)) continue;
    const soils::HydraulicModel& model = soil.model_at(cell_depths_cm[i]);
    const double residual = soils::residual_water_content(model);
    const double saturated = soils::saturated_water_content(model);
    const double margin = kContentMargin * (saturated - residual);
    const double wettest_cm = soils::pressure_head_at(model, saturated - margin);
    const double driest_cm = std::max(soils::pressure_head_at(model, residual + margin), kDriestHeadCm);
    heads[i] = std::clamp(1.0 - std::pow(10.0, std::max(value, 0.0)), driest_cm, wettest_cm);
  }
  return heads;
}

}  // namespace wetfront::site::detail
