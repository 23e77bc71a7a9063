// Laboratory cores; the relations are in core_samples.hpp.
#include "wetfront/soils/core_samples.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {
namespace {

void check_ring(const CoreSample& c) {
  if (!(std::isfinite(c.ring_volume_cm3) && c.ring_volume_cm3 > 0.0))
    throw base::InputError(
        fmt::format("core sample '{}': ring volume {} cm3 must be a positive number", c.name, c.ring_volume_cm3));
  if (!std::isfinite(c.tare_mass_g) || !std::isfinite(c.oven_dry_mass_g) || c.tare_mass_g < 0.0)
    throw base::InputError(fmt::format("core sample '{}': tare and oven-dry masses must be finite and >= 0 g", c.name));
  if (!(c.oven_dry_mass_g > c.tare_mass_g))
    throw base::InputError(
        fmt::format("core sample '{}': oven-dry mass {} g is not above the tare {} g, so the ring holds no soil",
                    c.name, c.oven_dry_mass_g, c.tare_mass_g));
}

double water_content_of(const CoreSample& c, double wet_mass_g, double water_density, const std::string& what) {
  if (!std::isfinite(wet_mass_g))
    throw base::InputError(fmt::format("core sample '{}': {} is not a number", c.name, what));
  if (wet_mass_g < c.oven_dry_mass_g)
    throw base::InputError(fmt::format(
        "core sample '{}': {} {} g is below the oven-dry mass {} g; a moist core cannot weigh less than when dry",
        c.name, what, wet_mass_g, c.oven_dry_mass_g));
  const double theta = (wet_mass_g - c.oven_dry_mass_g) / (water_density * c.ring_volume_cm3);
  if (theta >= 1.0)
    throw base::InputError(fmt::format(
        "core sample '{}': {} gives a volumetric water content of {:.3f}, which is not below 1; check the ring "
        "volume and masses",
        c.name, what, theta));
  return theta;
}

}  // namespace

CoreProperties core_properties(const CoreSample& core, double water_density_g_per_cm3) {
  check_ring(core);
  CoreProperties p;
  p.volumetric_water_content = water_content_of(core, core.wet_mass_g, water_density_g_per_cm3, "wet mass");
  p.water_mass_g = core.wet_mass_g - core.oven_dry_mass_g;
  p.dry_soil_mass_g = core.oven_dry_mass_g - core.tare_mass_g;
  p.gravimetric_water_content_g_per_g = p.water_mass_g / p.dry_soil_mass_g;
  p.dry_bulk_density_g_per_cm3 = p.dry_soil_mass_g / core.ring_volume_cm3;
  return p;
}

double porosity(double dry_bulk_density_g_per_cm3, double particle_density_g_per_cm3) {
  if (!(particle_density_g_per_cm3 > 0.0))
    throw base::InputError(fmt::format("particle density {} g/cm3 must be positive", particle_density_g_per_cm3));
  if (!(dry_bulk_density_g_per_cm3 > 0.0 && dry_bulk_density_g_per_cm3 < particle_density_g_per_cm3))
    throw base::InputError(fmt::format("dry bulk density {} g/cm3 must lie between 0 and the particle density {} g/cm3",
                                       dry_bulk_density_g_per_cm3, particle_density_g_per_cm3));
  return 1.0 - dry_bulk_density_g_per_cm3 / particle_density_g_per_cm3;
}

PorosityCheck check_against_porosity(double saturated_water_content, double porosity_value, double tolerance) {
  PorosityCheck c;
  c.porosity = porosity_value;
  c.saturated_water_content = saturated_water_content;
  c.ratio = saturated_water_content / porosity_value;
  c.exceeds_porosity = saturated_water_content > porosity_value + tolerance;
  if (c.exceeds_porosity)
    c.message = fmt::format(
        "saturated water content {:.3f} exceeds the porosity {:.3f} from bulk and particle density: check the ring "
        "volume, the masses or the particle density (organic soils are lighter than 2.65 g/cm3)",
        saturated_water_content, porosity_value);
  return c;
}

std::vector<RetentionPoint> retention_points_from_core(const CoreSample& core, std::span<const SuctionStep> steps,
                                                       double water_density_g_per_cm3) {
  check_ring(core);
  std::vector<RetentionPoint> points;
  points.reserve(steps.size());
  for (std::size_t i = 0; i < steps.size(); ++i) {
    const auto& s = steps[i];
    const std::string what = fmt::format("step {} (suction {} cm) wet mass", i + 1, s.suction_cm);
    points.push_back({s.suction_cm, water_content_of(core, s.wet_mass_g, water_density_g_per_cm3, what)});
  }
  return points;
}

}  // namespace wetfront::soils
