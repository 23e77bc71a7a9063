#include "failure_report.hpp"

#include <cmath>
#include <cstdlib>
#include <string>

#include <fmt/format.h>
#include <ida/ida.h>

namespace wetfront::solver::detail {

namespace {

std::string why(int flag, double last_step_days, long step_budget) {
  switch (flag) {
    case step_budget_exceeded:
    case IDA_TOO_MUCH_WORK:
      return fmt::format("it needed more than {} time steps, the work limit for a run of this length", step_budget);
    case IDA_ERR_FAIL:
      return fmt::format("the time step shrank to {:.2g} d and still could not meet the accuracy asked for",
                         last_step_days);
    case IDA_CONV_FAIL:
    case IDA_REP_RES_ERR:
    case IDA_RES_FAIL:
    case IDA_LSETUP_FAIL:
    case IDA_LSOLVE_FAIL:
      return fmt::format("the equations of one time step could not be solved, even with a step of {:.2g} d",
                         last_step_days);
    default: return "the time integration stopped";
  }
}

bool is_steep_van_genuchten(const soils::HydraulicModel& model) {
  const auto* vg = std::get_if<soils::VanGenuchtenMualem>(&model);
  return vg && vg->n < 1.3;
}

}  // namespace

RunFailure describe_failure(int flag, double t, double last_step_days, long step_budget, std::size_t cell,
                            const ColumnModel& model, std::span<const double> y) {
  RunFailure f;
  f.time_days = t;
  f.depth_cm = model.grid().cell_depths_cm()[cell];
  const auto& soil = model.cell_model(cell);
  const double h = model.cell_head(cell, y);
  const double theta = model.cell_water_content(cell, y);
  const double theta_r = soils::residual_water_content(soil), theta_s = soils::saturated_water_content(soil);
  const double saturation = (theta - theta_r) / (theta_s - theta_r);

  std::string state, advice;
  if (!std::isfinite(h)) {
    state = "in a state with no finite pressure head";
  } else if (h >= model.cell_table(cell).saturation_head_cm() || saturation > 0.98) {
    state = fmt::format("saturated or nearly so (pressure head {:.4g} cm, water content {:.4f})", h, theta);
    advice = is_steep_van_genuchten(soil)
                 ? "the air-entry form of van Genuchten for this soil (its n is below 1.3, so the Mualem conductivity "
                   "falls steeply just below saturation), or a larger specific storage (1e-4 /cm)"
                 : "a larger specific storage (1e-4 /cm)";
  } else if (saturation < 0.02) {
    state = fmt::format("very dry, close to its residual water content (pressure head {:.4g} cm, water content {:.4f})",
                        h, theta);
    advice = "a less extreme initial head or dry limit for this soil";
  } else {
    state = fmt::format("unsaturated (pressure head {:.4g} cm, water content {:.4f})", h, theta);
  }
  if (!advice.empty()) advice += "; ";
  advice += "smaller cells near that depth, or a shorter largest time step";

  char* name = IDAGetReturnFlagName(flag);
  const std::string code = flag == step_budget_exceeded ? "step limit" : (name ? name : "unknown");
  std::free(name);
  f.reason = fmt::format(
      "the solver could not continue at day {:.6g} of the run, {:.4g} cm below the surface, where the soil was {}: "
      "{}. Try {}. (integrator report: {})",
      t, f.depth_cm, state, why(flag, last_step_days, step_budget), advice, code);
  return f;
}

}  // namespace wetfront::solver::detail
