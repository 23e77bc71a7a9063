// Probe readings to water content: Topp et al. (1980) polynomial or a site calibration.
#include "wetfront/observations/water_content.hpp"

#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

double topp_water_content(double apparent_permittivity) {
  const double ka = apparent_permittivity;
  if (!(ka >= 1.0))
    throw std::domain_error(fmt::format("apparent permittivity {} is below 1 (vacuum); check the probe output", ka));
  // Liquid water, the most permittive part of a soil, has about 88 at 0 degC and 80 at 20 degC
  // (common practice); a soil reading above that is a probe or logger fault.
  if (ka > kMaxSoilPermittivity)
    throw std::domain_error(
        fmt::format("apparent permittivity {} is above {}, that of liquid water at 0 degC; check the probe output", ka,
                    kMaxSoilPermittivity));
  // Topp, Davis & Annan (1980): theta = -5.3e-2 + 2.92e-2 Ka - 5.5e-4 Ka^2 + 4.3e-6 Ka^3
  const double theta = -5.3e-2 + ka * (2.92e-2 + ka * (-5.5e-4 + ka * 4.3e-6));
  if (theta < 0)
    throw std::domain_error(
        fmt::format("apparent permittivity {} gives a negative water content by Topp's equation "
                    "({:.3f}); a soil reads about 2 or more even oven-dry: check the probe output",
                    ka, theta));
  return theta;
}

double calibrated_water_content(const PolynomialCalibration& calibration, double reading) {
  if (calibration.coefficients.empty()) throw base::InputError("a probe calibration needs at least one coefficient");
  double theta = 0;  // Horner's scheme from the highest power down
  for (auto c = calibration.coefficients.rbegin(); c != calibration.coefficients.rend(); ++c)
    theta = theta * reading + *c;
  return theta;
}

namespace {
struct Convert {
  double reading;
  double operator()(const ReadsVolumeFraction&) const { return reading; }
  double operator()(const ToppPermittivity&) const { return topp_water_content(reading); }
  double operator()(const PolynomialCalibration& c) const { return calibrated_water_content(c, reading); }
};
}  // namespace

double water_content_from_probe(const ProbeConversion& conversion, double reading) {
  return std::visit(Convert{reading}, conversion);
}

}  // namespace wetfront::observations
