// Series solution of Srivastava & Yeh (1991); see the header for the equations.
#include "gardner_water_table_infiltration.hpp"

#include <cmath>
#include <numbers>
#include <stdexcept>

namespace wetfront::reference {
namespace {

// Characteristic function whose roots are the eigenvalues: sin(l L) + 2 l cos(l L), which is
// tan(l L) + 2 l = 0 multiplied by cos(l L) (nonzero inside each bracket).
double characteristic(double l, double height) { return std::sin(l * height) + 2.0 * l * std::cos(l * height); }

double root_in_bracket(double lower, double upper, double height) {
  double f_lower = characteristic(lower, height);
  for (int iteration = 0; iteration < 200 && upper - lower > 4e-16 * upper; ++iteration) {
    const double middle = 0.5 * (lower + upper);
    const double f_middle = characteristic(middle, height);
    if ((f_middle < 0.0) == (f_lower < 0.0)) {
      lower = middle;
      f_lower = f_middle;
    } else {
      upper = middle;
    }
  }
  return 0.5 * (lower + upper);
}

}  // namespace

std::vector<double> srivastava_yeh_eigenvalues(double dimensionless_height, int count) {
  if (!(dimensionless_height > 0.0)) throw std::domain_error("dimensionless column height must be positive");
  std::vector<double> roots;
  roots.reserve(static_cast<std::size_t>(count));
  for (int n = 1; n <= count; ++n) {
    // At (n - 1/2) pi / L*: cos = 0, sin = +-1; at n pi / L*: sin = 0, 2 l cos = +-2 l with the
    // opposite sign, so exactly one sign change lies between.
    const double lower = (n - 0.5) * std::numbers::pi / dimensionless_height;
    const double upper = n * std::numbers::pi / dimensionless_height;
    roots.push_back(root_in_bracket(lower, upper, dimensionless_height));
  }
  return roots;
}

double steady_relative_conductivity(double flux_ratio, double z) { return flux_ratio - (flux_ratio - 1.0) * std::exp(-z); }

SrivastavaYehSolution::SrivastavaYehSolution(double dimensionless_height, double initial_flux_ratio,
                                             double new_flux_ratio, double earliest_dimensionless_time)
    : height_(dimensionless_height),
      initial_flux_(initial_flux_ratio),
      new_flux_(new_flux_ratio),
      earliest_time_(earliest_dimensionless_time) {
  if (!(earliest_dimensionless_time > 0.0)) throw std::domain_error("earliest dimensionless time must be positive");
  // l_n > (n - 1/2) pi / L*; keep terms until exp(-l_n^2 t*) < 1e-18, i.e. l_n^2 t* > 41.5.
  const double largest_root_needed = std::sqrt(41.5 / earliest_dimensionless_time);
  const int count = static_cast<int>(std::ceil(largest_root_needed * height_ / std::numbers::pi + 1.0));
  roots_ = srivastava_yeh_eigenvalues(height_, count);
}

double SrivastavaYehSolution::relative_conductivity(double z, double t) const {
  if (t == 0.0) return steady_relative_conductivity(initial_flux_, z);
  if (t < earliest_time_ * (1.0 - 1e-12)) throw std::domain_error("time earlier than the series was prepared for");
  double sum = 0.0;
  for (const double l : roots_) {
    sum += std::sin(l * z) * std::sin(l * height_) * std::exp(-l * l * t) / (1.0 + height_ / 2.0 + 2.0 * l * l * height_);
  }
  return steady_relative_conductivity(new_flux_, z) -
         4.0 * (new_flux_ - initial_flux_) * std::exp((height_ - z) / 2.0) * std::exp(-t / 4.0) * sum;
}

GardnerWaterTableInfiltration::GardnerWaterTableInfiltration(const GardnerWaterTableProblem& problem,
                                                             double earliest_time_days)
    : problem_(problem),
      solution_(problem.sorptive_number_per_cm * problem.column_height_cm,
                problem.initial_surface_flux_cm_per_d / problem.saturated_conductivity_cm_per_d,
                problem.new_surface_flux_cm_per_d / problem.saturated_conductivity_cm_per_d,
                problem.sorptive_number_per_cm * problem.saturated_conductivity_cm_per_d * earliest_time_days /
                    (problem.saturated_water_content - problem.residual_water_content)) {}

double GardnerWaterTableInfiltration::dimensionless_time(double time_days) const {
  return problem_.sorptive_number_per_cm * problem_.saturated_conductivity_cm_per_d * time_days /
         (problem_.saturated_water_content - problem_.residual_water_content);
}

double GardnerWaterTableInfiltration::pressure_head_cm(double depth_cm, double time_days) const {
  const double a = problem_.sorptive_number_per_cm;
  const double z = a * (problem_.column_height_cm - depth_cm);
  return std::log(solution_.relative_conductivity(z, dimensionless_time(time_days))) / a;
}

double GardnerWaterTableInfiltration::initial_pressure_head_cm(double depth_cm) const {
  const double a = problem_.sorptive_number_per_cm;
  const double z = a * (problem_.column_height_cm - depth_cm);
  return std::log(steady_relative_conductivity(
             problem_.initial_surface_flux_cm_per_d / problem_.saturated_conductivity_cm_per_d, z)) /
         a;
}

}  // namespace wetfront::reference
