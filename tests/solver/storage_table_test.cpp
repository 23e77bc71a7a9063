// The storage tables that replace the soil functions in the residual (solver/src/storage_table.hpp)
// must reproduce the soil models: the head and conductivity read back from the stored water of a
// head agree with the closed forms of each model, both interpolants are monotone, the inverse
// is exact to round-off, and every storage (even below the residual water content) has a finite
// head. The closed forms are those of soils/ (van Genuchten 1980 eq. 3 and 8, Ippisch et al.
// 2006, Brooks & Corey 1964, Gardner 1958); the checks compare the table with them (identity).
#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "solver_test_soils.hpp"
#include "storage_table.hpp"
#include "wetfront/soils/model_parameters.hpp"

namespace wetfront::solver_tests {
namespace {

using solver::detail::StorageTable;

constexpr double specific_storage = 1e-5;

// s(h) = theta(h) + Ss e(h - h_sat), e(u) = u + 1 above and exp(u) below (w = 1 cm).
double storage_of(const soils::HydraulicModel& model, double h) {
  const double u = h - soils::full_saturation_head(model);
  return soils::water_content(model, h) + specific_storage * (u >= 0 ? u + 1.0 : std::exp(u));
}

struct NamedModel {
  std::string name;
  soils::HydraulicModel model;
};

std::vector<NamedModel> models() {
  return {{"loam", loam()},
          {"sand", sand()},
          {"clay n 1.09", clay()},
          {"clay with air entry", clay_with_air_entry()},
          {"sand n 8", soils::VanGenuchtenMualem{0.045, 0.43, 0.145, 8.0, 500.0, 0.5}},
          {"Brooks-Corey", soils::BrooksCorey{0.05, 0.40, -20.0, 0.6, 50.0}},
          {"Gardner", soils::GardnerExponential{0.05, 0.40, 0.05, 50.0}}};
}

std::vector<double> heads_below_saturation(double h_sat) {
  std::vector<double> heads;
  for (double d = 2e-2; d < 3e4; d *= 1.37) heads.push_back(h_sat - d);
  return heads;
}

TEST(StorageTable, HeadAndConductivityMatchTheModels) {
  for (const auto& [name, model] : models()) {
    const StorageTable table(model, specific_storage);
    for (double h : heads_below_saturation(table.saturation_head_cm())) {
      const double s = storage_of(model, h);
      if (s <= table.dry_storage()) continue;  // beyond the table's resolving range (tested below)
      const auto p = table.at(s);
      EXPECT_NEAR(p.head_cm, h, 1e-5 * std::abs(h)) << name << " at " << h << " cm";
      const double k = soils::conductivity(model, h);
      EXPECT_NEAR(p.conductivity, k, 1e-4 * k + 1e-300) << name << " at " << h << " cm";
    }
  }
}

TEST(StorageTable, SaturatedAboveTheSaturationHead) {
  for (const auto& [name, model] : models()) {
    const StorageTable table(model, specific_storage);
    const double h = table.saturation_head_cm() + 7.0;
    const auto p = table.at(storage_of(model, h));
    EXPECT_NEAR(p.head_cm, h, 1e-9) << name;
    EXPECT_EQ(p.conductivity, soils::saturated_conductivity(model)) << name;
    EXPECT_NEAR(p.head_per_storage, 1.0 / specific_storage, 1e-6 / specific_storage) << name;
  }
}

TEST(StorageTable, MonotoneWithFiniteHeadsEverywhere) {
  for (const auto& [name, model] : models()) {
    const StorageTable table(model, specific_storage);
    const double low = table.dry_storage() - 5e-4, high = table.full_storage() + 1e-3;
    double last_head = -INFINITY, last_k = -INFINITY, last_potential = -INFINITY;
    for (int k = 0; k <= 200000; ++k) {
      const double s = low + (high - low) * k / 200000.0;
      const auto p = table.at(s);
      ASSERT_TRUE(std::isfinite(p.head_cm)) << name << " at storage " << s;
      EXPECT_GE(p.head_cm, last_head) << name << " at storage " << s;
      EXPECT_GE(p.conductivity, last_k) << name << " at storage " << s;
      EXPECT_GE(p.potential, last_potential) << name << " at storage " << s;
      EXPECT_GE(p.head_per_storage, 0.0) << name;
      last_head = p.head_cm, last_k = p.conductivity, last_potential = p.potential;
    }
  }
}

TEST(StorageTable, InverseIsExactToRoundOff) {
  for (const auto& [name, model] : models()) {
    const StorageTable table(model, specific_storage);
    for (double h : {-1e6, -15000.0, -330.0, -47.3, -1.0, -1e-3, 0.0, 12.0}) {
      const double hh = h + table.saturation_head_cm();
      EXPECT_NEAR(table.at(table.storage_at(hh)).head_cm, hh, 1e-9 * std::max(1.0, std::abs(hh))) << name << " " << hh;
    }
  }
}

// The integral of K dh between two heads by adaptive Simpson on the model's closed form.
double integral_of_conductivity(const soils::HydraulicModel& model, double a, double b, int depth = 40) {
  const auto k = [&](double h) { return soils::conductivity(model, h); };
  const auto simpson = [&](double x, double y) { return (y - x) / 6 * (k(x) + 4 * k((x + y) / 2) + k(y)); };
  const double whole = simpson(a, b), m = (a + b) / 2;
  const double halves = simpson(a, m) + simpson(m, b);
  if (depth == 0 || std::abs(halves - whole) <= 1e-10 * std::abs(halves) + 1e-300) return halves;
  return integral_of_conductivity(model, a, m, depth - 1) + integral_of_conductivity(model, m, b, depth - 1);
}

TEST(StorageTable, PotentialIsTheIntegralOfConductivity) {
  // The Kirchhoff potential Phi(h) = integral of K dh (Kirchhoff transform; Haverkamp & Vauclin
  // 1979 use it for mean face conductivities, from memory) must match the integral of the model's
  // own K between any two heads in the table; its differences give the integral face conductivity.
  for (const auto& [name, model] : models()) {
    const StorageTable table(model, specific_storage);
    const double h_sat = table.saturation_head_cm();
    const std::vector<double> below{1e4, 1500.0, 330.0, 100.0, 47.3, 10.0, 2.0, 0.3, 0.02};
    for (std::size_t i = 0; i + 1 < below.size(); ++i) {
      const double a = h_sat - below[i], b = h_sat - below[i + 1];
      if (storage_of(model, a) <= table.dry_storage()) continue;  // beyond the resolving range
      const double expected = integral_of_conductivity(model, a, b);
      const double got = table.at(table.storage_at(b)).potential - table.at(table.storage_at(a)).potential;
      EXPECT_NEAR(got, expected, 1e-3 * expected + 1e-12) << name << " from " << a << " to " << b << " cm";
      EXPECT_NEAR(table.potential_at_head(b) - table.potential_at_head(a), expected, 1e-3 * expected + 1e-12)
          << name << " from " << a << " to " << b << " cm";
    }
    // Above the saturation head K = Ks, so Phi grows by Ks per cm of head.
    const double ks = soils::saturated_conductivity(model);
    EXPECT_NEAR(table.potential_at_head(h_sat + 5.0) - table.potential_at_head(h_sat), 5.0 * ks, 1e-9 * ks) << name;
  }
}

TEST(StorageTable, DriestStorageStillResolvesTheDryLimit) {
  // A sand at -15000 cm holds theta_r + 1e-24 in the model, which storage cannot resolve; the
  // table's linear dry continuation gives that head a storage within 1e-5 of theta_r.
  const soils::VanGenuchtenMualem sand8{0.045, 0.43, 0.145, 8.0, 500.0, 0.5};
  const StorageTable table(sand8, specific_storage);
  const double s = table.storage_at(-15000.0);
  EXPECT_NEAR(s, 0.045, 1e-5);
  EXPECT_NEAR(table.at(s).head_cm, -15000.0, 1e-6);
}

}  // namespace
}  // namespace wetfront::solver_tests
