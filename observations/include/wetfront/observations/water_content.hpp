// Water content from probe readings: already a volume fraction, an apparent (bulk)
// dielectric permittivity converted with Topp et al. (1980), or a site calibration.
#pragma once

#include <variant>
#include <vector>

namespace wetfront::observations {

// Topp, Davis & Annan (1980, Water Resources Research 16:574), their fitted polynomial:
//   theta = -5.3e-2 + 2.92e-2 Ka - 5.5e-4 Ka^2 + 4.3e-6 Ka^3
// Readings above this are refused: liquid water at 0 degC (common practice).
inline constexpr double kMaxSoilPermittivity = 88.0;
// Ka is the apparent relative permittivity (dimensionless). Throws std::domain_error for
// Ka < 1 (nothing has a relative permittivity below that of vacuum), Ka above
// kMaxSoilPermittivity, and Ka that give a negative water content (below about 1.8).
double topp_water_content(double apparent_permittivity);

// theta = c0 + c1 x + c2 x^2 + ..., x the raw reading (whatever the calibration was made in).
struct PolynomialCalibration {
  std::vector<double> coefficients;  // c0, c1, ...; at least one
};
double calibrated_water_content(const PolynomialCalibration& calibration, double reading);

struct ReadsVolumeFraction {};  // the probe reports cm3/cm3 already
struct ToppPermittivity {};     // the probe reports apparent permittivity Ka
using ProbeConversion = std::variant<ReadsVolumeFraction, ToppPermittivity, PolynomialCalibration>;

// Water content, cm3/cm3, from one reading under the given conversion.
double water_content_from_probe(const ProbeConversion& conversion, double reading);

}  // namespace wetfront::observations
