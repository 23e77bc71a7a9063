// Bad [[adjustable]] and [fit] entries: refused with the file, the line of the offending key
// and what was expected; through the program, exit code 1 and no output file. The limits named
// in the messages are the site file's own (docs/site-file.md); no outside values.
#include <gtest/gtest.h>

#include <algorithm>
#include <filesystem>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "twin_site.hpp"

namespace wetfront::site {
namespace {

using testing::ScratchSite;

struct BadStudy {
  std::string name;
  std::string toml;         // appended to the demo site file
  std::string blamed_line;  // text of the line the message must point at
  std::vector<std::string> fragments;
};

std::string entry(const std::string& body) { return "[[adjustable]]\n" + body; }

std::vector<BadStudy> bad_studies() {
  const std::string ks_range = "range = [\"5 cm/d\", \"80 cm/d\"]\n";
  return {
      {"unknown parameter",
       entry("parameter = \"saturated_conductivty\"\nlayer = \"loam subsoil\"\n" + ks_range),
       "parameter = \"saturated_conductivty\"",
       {"cannot be adjusted", "did you mean 'saturated_conductivity'"}},
      {"soil parameter without a layer",
       entry("parameter = \"alpha\"\nrange = [\"0.01 1/cm\", \"0.1 1/cm\"]\n"),
       "parameter = \"alpha\"",
       {"say which layer"}},
      {"unknown layer",
       entry("parameter = \"alpha\"\nlayer = \"clay\"\nrange = [\"0.01 1/cm\", \"0.1 1/cm\"]\n"),
       "layer = \"clay\"",
       {"no layer is named 'clay'", "loam subsoil"}},
      {"parameter the model lacks",
       entry("parameter = \"bubbling_head\"\nlayer = \"loam subsoil\"\nrange = [\"-50 cm\", \"-5 cm\"]\n"),
       "parameter = \"bubbling_head\"",
       {"has no parameter 'bubbling_head'", "saturated_conductivity"}},
      {"range without units",
       entry("parameter = \"saturated_conductivity\"\nlayer = \"loam subsoil\"\nrange = [5, 80]\n"),
       "range = [5, 80]",
       {"cm/d"}},
      {"reversed range",
       entry("parameter = \"saturated_conductivity\"\nlayer = \"loam subsoil\"\nrange = [\"80 cm/d\", \"5 cm/d\"]\n"),
       "range = [\"80 cm/d\", \"5 cm/d\"]",
       {"lower to a higher value"}},
      {"log range through zero",
       entry("parameter = \"n\"\nlayer = \"loam subsoil\"\nrange = [0, 2]\nscale = \"log\"\n"),
       "range = [0, 2]",
       {"log scale needs a range above zero"}},
      {"site value outside the range",
       entry("parameter = \"n\"\nlayer = \"loam subsoil\"\nrange = [1.6, 2]\n"),
       "range = [1.6, 2]",
       {"site's value 1.5", "outside the range"}},
      {"one end only",
       entry("parameter = \"n\"\nlayer = \"loam subsoil\"\nrange = [1.6]\n"),
       "range = [1.6]",
       {"needs two values"}},
      {"unknown scale",
       entry("parameter = \"n\"\nlayer = \"loam subsoil\"\nrange = [1.2, 2]\nscale = \"logarithmic\"\n"),
       "scale = \"logarithmic\"",
       {"linear", "log"}},
      {"grid of one point",
       entry("parameter = \"n\"\nlayer = \"loam subsoil\"\nrange = [1.2, 2]\ngrid_points = 1\n"),
       "grid_points = 1",
       {"whole number from 2"}},
      {"site parameter with a layer",
       entry("parameter = \"kc_mid\"\nlayer = \"loam subsoil\"\nrange = [1, 1.3]\n"),
       "layer = \"loam subsoil\"",
       {"belongs to the whole site"}},
      {"same parameter twice",
       entry("parameter = \"kc_mid\"\nrange = [1, 1.3]\n") + entry("parameter = \"kc_mid\"\nrange = [0.9, 1.3]\n"),
       "parameter = \"kc_mid\"",
       {"already adjustable (line"}},
      {"unknown key in an entry",
       entry("parameter = \"kc_mid\"\nrange = [1, 1.3]\nsteps = 4\n"),
       "steps = 4",
       {"steps"}},
      {"range end the site cannot take",
       entry("parameter = \"pan_coefficient\"\nrange = [0.5, 1.5]\n"),
       "range = [0.5, 1.5]",
       {"upper end 1.5", "at most 1.2"}},
      {"water content range beyond saturation",
       entry("parameter = \"residual_water_content\"\nlayer = \"loam subsoil\"\nrange = [\"1 %\", \"50 %\"]\n"),
       "range = [\"1 %\", \"50 %\"]",
       {"upper end 0.5", "loam subsoil"}},
      {"head uncertainty without unit",
       "[fit]\nhead_uncertainty = 10\n",
       "head_uncertainty = 10",
       {"fit.head_uncertainty", "cm"}},
      {"negative head uncertainty",
       "[fit]\nhead_uncertainty = \"-3 cm\"\n",
       "head_uncertainty = \"-3 cm\"",
       {"must be positive"}},
  };
}

std::size_t line_of(const std::string& text, const std::string& fragment) {
  // The last occurrence: the appended study comes after anything like it in the demo.
  const auto at = text.rfind(fragment);
  return 1 + static_cast<std::size_t>(std::count(text.begin(), text.begin() + static_cast<long>(at), '\n'));
}

TEST(AdjustableInput, LoaderNamesFileLineAndWhatWasExpected) {
  for (const auto& c : bad_studies()) {
    ScratchSite site("adjustable");
    testing::add_study(site, c.toml);
    const std::size_t line = line_of(site.read("site.toml"), c.blamed_line);
    try {
      (void)load_parameter_study(load_site_file(site.site_file()));
      ADD_FAILURE() << c.name << ": accepted";
    } catch (const base::InputError& error) {
      const std::string message = error.what();
      EXPECT_NE(message.find(fmt::format("site.toml:{}:", line)), std::string::npos) << c.name << ": " << message;
      for (const auto& fragment : c.fragments)
        EXPECT_NE(message.find(fragment), std::string::npos)
            << c.name << ": expected '" << fragment << "' in: " << message;
    }
  }
}

TEST(AdjustableInput, ProgramExitsWithOneAndWritesNothing) {
  ScratchSite site("adjustable-program");
  testing::add_study(site, bad_studies().front().toml);
  for (const std::string command : {"sweep", "calibrate"}) {
    const auto result =
        testing::run_program(fmt::format("{} '{}' --quiet", command, site.site_file().string()), site.folder());
    EXPECT_EQ(result.exit_code, 1) << command;
    EXPECT_NE(result.err.find("saturated_conductivty"), std::string::npos) << result.err;
    for (const auto& entry : std::filesystem::directory_iterator(site.folder()))
      EXPECT_NE(entry.path().extension(), ".h5") << command << " left " << entry.path();
  }
}

TEST(AdjustableInput, ASiteWithoutAdjustableParametersIsRefusedByTheStudyCommands) {
  ScratchSite site("no-study");
  testing::add_study(site, "");  // removes the demo's own study
  const auto result = testing::run_program(fmt::format("sweep '{}' --quiet", site.site_file().string()), site.folder());
  EXPECT_EQ(result.exit_code, 1);
  EXPECT_NE(result.err.find("no [[adjustable]] entries"), std::string::npos) << result.err;
}

}  // namespace
}  // namespace wetfront::site
