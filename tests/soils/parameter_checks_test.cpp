// Physical range checks on hydraulic parameters.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <cmath>
#include <string>

#include "wetfront/soils/parameter_checks.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace ws = wetfront::soils;

namespace {
std::string error_of(const ws::HydraulicModel& m) {
  try {
    ws::check_hydraulic_model(m, "topsoil");
  } catch (const wetfront::base::InputError& e) {
    return e.what();
  }
  return "no error";
}
}  // namespace

TEST(ParameterChecks, TextureDefaultsPass) {
  for (const auto& c : ws::texture_classes()) EXPECT_NO_THROW(ws::check_hydraulic_model(c.parameters, c.name));
  EXPECT_NO_THROW(ws::check_hydraulic_model(ws::BrooksCorey{0.05, 0.4, -20, 0.4, 50}, "b"));
  EXPECT_NO_THROW(ws::check_hydraulic_model(ws::GardnerExponential{0.02, 0.38, 0.05, 30}, "g"));
}

TEST(ParameterChecks, EachOutOfRangeFieldIsNamed) {
  auto loam = ws::texture_class_parameters("loam");
  auto bad = loam;
  bad.n = 0.9;
  EXPECT_NE(error_of(bad).find("soil 'topsoil': n = 0.9"), std::string::npos) << error_of(bad);
  bad = loam;
  bad.alpha_per_cm = 0.0;
  EXPECT_NE(error_of(bad).find("alpha"), std::string::npos);
  bad = loam;
  bad.saturated_water_content = 0.05;  // below theta_r 0.078
  EXPECT_NE(error_of(bad).find("saturated water content"), std::string::npos);
  bad = loam;
  bad.residual_water_content = -0.01;
  EXPECT_NE(error_of(bad).find("residual water content"), std::string::npos);
  bad = loam;
  bad.saturated_conductivity_cm_per_d = std::nan("");
  EXPECT_NE(error_of(bad).find("saturated conductivity"), std::string::npos);
  bad = loam;
  bad.pore_connectivity = INFINITY;
  EXPECT_NE(error_of(bad).find("pore connectivity"), std::string::npos);
  EXPECT_NE(error_of(ws::VanGenuchtenAirEntry{loam, 1.0}).find("air-entry head"), std::string::npos);
  EXPECT_NE(error_of(ws::BrooksCorey{0.05, 0.4, 20, 0.4, 50}).find("bubbling head"), std::string::npos);
  EXPECT_NE(error_of(ws::BrooksCorey{0.05, 0.4, -20, 0.0, 50}).find("pore-size index"), std::string::npos);
  EXPECT_NE(error_of(ws::GardnerExponential{0.02, 0.38, -0.05, 30}).find("sorptive number"), std::string::npos);
}
