// Checks of the reference solutions themselves, before they are used to judge the solver.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include "adaptive_simpson.hpp"
#include "gardner_water_table_infiltration.hpp"
#include "steady_flux_profile.hpp"

namespace wetfront::reference {
namespace {

TEST(AdaptiveSimpson, IntegratesSmoothAndEndpointSingularFunctions) {
  // Elementary integrals (common practice): int_0^pi sin = 2, int_0^1 x^-1/2 = 2 (the
  // singular end is never evaluated: start just inside it, the missing part is 2 sqrt(1e-12)).
  EXPECT_NEAR(adaptive_simpson([](double x) { return std::sin(x); }, 0.0, std::numbers::pi, 1e-12), 2.0, 1e-11);
  EXPECT_NEAR(adaptive_simpson([](double x) { return 1.0 / std::sqrt(x); }, 1e-12, 1.0, 1e-10), 2.0 - 2e-6, 1e-8);
  EXPECT_NEAR(adaptive_simpson([](double x) { return std::exp(x); }, 1.0, 0.0, 1e-12), 1.0 - std::exp(1.0), 1e-11);
}

TEST(SrivastavaYeh, EigenvaluesSolveTheCharacteristicEquationInTheirBrackets) {
  // tan(l L*) + 2 l = 0, one root in ((n - 1/2) pi / L*, n pi / L*): Srivastava & Yeh (1991).
  const double height = 10.0;
  const auto roots = srivastava_yeh_eigenvalues(height, 50);
  ASSERT_EQ(roots.size(), 50u);
  for (std::size_t i = 0; i < roots.size(); ++i) {
    const double n = static_cast<double>(i + 1);
    EXPECT_GT(roots[i], (n - 0.5) * std::numbers::pi / height);
    EXPECT_LT(roots[i], n * std::numbers::pi / height);
    EXPECT_NEAR(std::tan(roots[i] * height) + 2.0 * roots[i], 0.0, 1e-9 * (1.0 + roots[i]));
  }
}

TEST(SrivastavaYeh, MatchesIndependentEvaluationOfTheSeries) {
  // L* = 10, qA* = 0.1, qB* = 0.9, t* = 2, z* = 8: K* = 0.466202 (the Srivastava & Yeh 1991
  // series evaluated independently: roots by Brent's method in scipy, 200 terms, 0.4662016).
  const SrivastavaYehSolution solution(10.0, 0.1, 0.9, 1e-3);
  EXPECT_NEAR(solution.relative_conductivity(8.0, 2.0), 0.466202, 5e-7);
}

TEST(SrivastavaYeh, StartsFromTheSteadyProfileAndEndsAtTheNewOne) {
  // Limits of the Srivastava & Yeh (1991) solution: K* -> qA* - (qA* - 1) e^-z* as t* -> 0 away
  // from the surface, K* -> qB* - (qB* - 1) e^-z* as t* -> infinity.
  const SrivastavaYehSolution solution(10.0, 0.1, 0.9, 1e-6);
  for (const double z : {1.0, 3.0, 5.0, 7.0}) {
    EXPECT_NEAR(solution.relative_conductivity(z, 1e-6), steady_relative_conductivity(0.1, z), 1e-9) << "z* = " << z;
    EXPECT_NEAR(solution.relative_conductivity(z, 300.0), steady_relative_conductivity(0.9, z), 1e-12) << "z* = " << z;
  }
  EXPECT_DOUBLE_EQ(solution.relative_conductivity(4.0, 0.0), steady_relative_conductivity(0.1, 4.0));
  EXPECT_THROW((void)solution.relative_conductivity(4.0, 1e-7), std::domain_error);
}

TEST(SrivastavaYeh, SatisfiesTheLinearisedRichardsEquationAndItsBoundaryConditions) {
  // With K linear in theta the Richards equation becomes dK*/dt* = d2K*/dz*2 + dK*/dz*, the
  // table holds K* = 1 at z* = 0, and the downward surface flux is dK*/dz* + K* = qB* at z* = L*
  // (Srivastava & Yeh 1991, dimensionless problem statement). Checked by centred differences.
  const double height = 10.0;
  const double qa = 0.1;
  const double qb = 0.9;
  const SrivastavaYehSolution solution(height, qa, qb, 0.01);
  const double dz = 1e-3;
  const double dt = 1e-4;
  for (const double t : {0.5, 2.0, 8.0}) {
    EXPECT_NEAR(solution.relative_conductivity(0.0, t), 1.0, 1e-12);
    for (const double z : {2.0, 6.0, 9.5}) {
      const double k = solution.relative_conductivity(z, t);
      const double k_up = solution.relative_conductivity(z + dz, t);
      const double k_down = solution.relative_conductivity(z - dz, t);
      const double rate = (solution.relative_conductivity(z, t + dt) - solution.relative_conductivity(z, t - dt)) / (2 * dt);
      const double rhs = (k_up - 2 * k + k_down) / (dz * dz) + (k_up - k_down) / (2 * dz);
      EXPECT_NEAR(rate, rhs, 1e-5) << "z* = " << z << ", t* = " << t;
    }
    // One-sided second-order difference at the surface.
    const double k0 = solution.relative_conductivity(height, t);
    const double k1 = solution.relative_conductivity(height - dz, t);
    const double k2 = solution.relative_conductivity(height - 2 * dz, t);
    const double slope = (3 * k0 - 4 * k1 + k2) / (2 * dz);
    EXPECT_NEAR(slope + k0, qb, 1e-5) << "t* = " << t;
  }
}

TEST(SrivastavaYeh, DimensionalWrapperUsesTheScalings) {
  // z* = a z, t* = a Ks t / (theta_s - theta_r), h = ln(K*) / a (Srivastava & Yeh 1991).
  GardnerWaterTableProblem problem;  // a = 0.1, Ks = 1, theta 0.40/0.06, L = 100, 0.1 -> 0.9
  const GardnerWaterTableInfiltration column(problem, 0.1);
  const SrivastavaYehSolution dimensionless(10.0, 0.1, 0.9, 0.1 * 0.1 / 0.34);
  const double time_days = 2.0 * 0.34 / 0.1;  // t* = 2
  EXPECT_NEAR(column.dimensionless_time(time_days), 2.0, 1e-14);
  EXPECT_NEAR(column.pressure_head_cm(20.0, time_days), std::log(dimensionless.relative_conductivity(8.0, 2.0)) / 0.1,
              1e-12);
  EXPECT_NEAR(column.initial_pressure_head_cm(100.0), 0.0, 1e-12);
  EXPECT_NEAR(column.initial_pressure_head_cm(0.0), std::log(0.1 + 0.9 * std::exp(-10.0)) / 0.1, 1e-12);
}

soils::GardnerExponential gardner_soil() { return {0.06, 0.40, 0.1, 1.0}; }

TEST(SteadyFluxProfile, MatchesTheGardnerClosedForm) {
  // For K = Ks e^(a h) the steady profile is K* = q* - (q* - 1) e^(-a z) (Srivastava & Yeh
  // 1991, steady part), so h = ln(q* + (1 - q*) e^(-a z)) / a for infiltration and evaporation.
  for (const double flux : {0.3, -0.2}) {
    const SteadyFluxProfile profile(gardner_soil(), flux);
    for (const double z : {0.5, 5.0, 10.0, 15.0}) {
      const double exact = std::log(flux + (1.0 - flux) * std::exp(-0.1 * z)) / 0.1;
      EXPECT_NEAR(profile.pressure_head_cm(z), exact, 1e-8) << "q = " << flux << ", z = " << z;
      EXPECT_NEAR(profile.height_above_table_cm(exact), z, 1e-8) << "q = " << flux << ", z = " << z;
    }
  }
  // Asymptote K(h) = q for infiltration: h = ln(0.3) / a.
  EXPECT_NEAR(SteadyFluxProfile(gardner_soil(), 0.3).asymptotic_head_cm(), std::log(0.3) / 0.1, 1e-9);
  const SteadyFluxProfile far(gardner_soil(), 0.3);
  EXPECT_NEAR(far.pressure_head_cm(60.0), std::log(0.3 + 0.7 * std::exp(-6.0)) / 0.1, 1e-8);
}

soils::VanGenuchtenMualem loam() {
  // Loam, Carsel & Parrish (1988) class averages (from memory): theta_r 0.078, theta_s 0.43,
  // alpha 0.036 /cm, n 1.56, Ks 24.96 cm/d.
  return {0.078, 0.43, 0.036, 1.56, 24.96, 0.5};
}

TEST(SteadyFluxProfile, VanGenuchtenProfileObeysDarcysLaw) {
  // q = K(h) (dh/dz + 1) (Darcy, z upward, q positive downward); q = 0 gives h = -z.
  const SteadyFluxProfile rest(loam(), 0.0);
  EXPECT_NEAR(rest.pressure_head_cm(37.0), -37.0, 1e-9);
  for (const double flux : {0.5, 5.0, -0.05}) {
    const SteadyFluxProfile profile(loam(), flux);
    for (const double z : {1.0, 20.0, 60.0, 95.0}) {
      const double dz = 1e-3;
      const double h = profile.pressure_head_cm(z);
      const double gradient = (profile.pressure_head_cm(z + dz) - profile.pressure_head_cm(z - dz)) / (2 * dz);
      EXPECT_NEAR(soils::conductivity(loam(), h) * (gradient + 1.0), flux, 1e-5 * (1.0 + std::abs(flux)))
          << "q = " << flux << ", z = " << z;
    }
  }
  EXPECT_THROW(SteadyFluxProfile(loam(), 30.0), std::domain_error);
}

TEST(LayeredSteadyFluxProfile, MatchesTheGardnerClosedFormAcrossAnInterface) {
  // In a Gardner layer dK/dz = a (q - K) (Darcy, z up), so K = q + (K0 - q) e^(-a z) from the
  // head h0 at the layer base (Srivastava & Yeh 1991, steady part, with a general base); the
  // head is continuous across the interface.
  const soils::GardnerExponential lower{0.05, 0.35, 0.2, 20.0};  // coarse: a = 0.2 /cm, Ks 20 cm/d
  const soils::GardnerExponential upper{0.06, 0.40, 0.05, 2.0};  // fine: a = 0.05 /cm, Ks 2 cm/d
  const double q = 0.8;
  const LayeredSteadyFluxProfile profile({{30.0, lower}, {70.0, upper}}, q);
  auto lower_head = [&](double z) { return std::log(q / 20.0 + (1.0 - q / 20.0) * std::exp(-0.2 * z)) / 0.2; };
  const double interface_head = lower_head(30.0);
  const double interface_k = 2.0 * std::exp(0.05 * interface_head);
  auto upper_head = [&](double z) { return std::log((q + (interface_k - q) * std::exp(-0.05 * (z - 30.0))) / 2.0) / 0.05; };
  for (const double z : {1.0, 15.0, 29.9}) EXPECT_NEAR(profile.pressure_head_cm(z), lower_head(z), 1e-8) << z;
  for (const double z : {30.0, 30.1, 50.0, 99.0}) EXPECT_NEAR(profile.pressure_head_cm(z), upper_head(z), 1e-8) << z;
  // One layer reproduces the single-layer profile.
  const LayeredSteadyFluxProfile single({{100.0, loam()}}, 0.5);
  EXPECT_NEAR(single.pressure_head_cm(70.0), SteadyFluxProfile(loam(), 0.5).pressure_head_cm(70.0), 1e-12);
}

}  // namespace
}  // namespace wetfront::reference
