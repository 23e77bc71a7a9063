#include "member_state.hpp"

#include <algorithm>
#include <stdexcept>

namespace wetfront::site::detail {

std::vector<double> analysed_heads(const soils::LayeredProfile& soil, std::span<const double> cell_depths_cm,
                                   std::span<const double> forecast_heads_cm, std::span<const double> forecast_contents,
                                   std::span<const double> analysed_contents) {
  const std::size_t n = cell_depths_cm.size();
  if (forecast_heads_cm.size() != n || forecast_contents.size() != n || analysed_contents.size() != n)
    throw std::invalid_argument("analysed_heads: one head and two water contents per cell");
  std::vector<double> heads(n);
  for (std::size_t i = 0; i < n; ++i) {
    heads[i] = forecast_heads_cm[i];
    if (analysed_contents[i] == forecast_contents[i]) continue;
    const soils::HydraulicModel& model = soil.model_at(cell_depths_cm[i]);
    const double residual = soils::residual_water_content(model);
    const double saturated = soils::saturated_water_content(model);
    const double margin = kContentMargin * (saturated - residual);
    const double wettest = saturated - margin;
    const double driest = std::max(residual + margin, soils::water_content(model, kDriestHeadCm));
    const bool saturated_forecast = forecast_heads_cm[i] >= soils::pressure_head_at(model, wettest);
    if (analysed_contents[i] >= wettest && saturated_forecast) continue;
    const double content = std::clamp(analysed_contents[i], driest, wettest);
    heads[i] = std::max(soils::pressure_head_at(model, content), kDriestHeadCm);
  }
  return heads;
}

}  // namespace wetfront::site::detail
