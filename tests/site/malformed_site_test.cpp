// Malformed site files and field records: each must be refused with a message that names the
// file and line (and the key, for the site file), both by the loader and through the program,
// which must exit with code 1 and leave no output file behind.
#include <gtest/gtest.h>

#include <optional>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/site_file.hpp"
#include "site_test_helpers.hpp"

namespace wetfront::site {
namespace {

using testing::ProgramResult;
using testing::ScratchSite;

struct Edit {
  std::string file;  // "site.toml" or a CSV of the demo
  std::string from;
  std::string to;
};

struct MalformedCase {
  std::string name;
  std::vector<Edit> edits;
  std::string blamed_file;             // file the message must name
  std::vector<std::string> fragments;  // further text the message must contain
  std::optional<std::size_t> line;     // expected line; default: the line of the last edit
  bool line_known = true;              // false: the problem is not on one line (missing file)
};

MalformedCase make(std::string name, std::vector<Edit> edits, std::string blamed_file,
                   std::vector<std::string> fragments, std::optional<std::size_t> line = std::nullopt,
                   bool line_known = true) {
  MalformedCase c;
  c.name = std::move(name);
  c.edits = std::move(edits);
  c.blamed_file = std::move(blamed_file);
  c.fragments = std::move(fragments);
  c.line = line;
  c.line_known = line_known;
  return c;
}

std::vector<MalformedCase> malformed_cases() {
  return {
      make("wrong unit", {{"site.toml", "bottom = \"40 cm\"", "bottom = \"40 kg\""}}, "site.toml",
           {"layers[1].bottom", "unit 'kg' is not accepted", "mm, cm or m"}),
      make("bare number", {{"site.toml", "plane_depth = \"150 cm\"", "plane_depth = 150"}}, "site.toml",
           {"recharge.plane_depth", "bare number", "mm, cm or m"}),
      make("number string without unit", {{"site.toml", "plane_depth = \"150 cm\"", "plane_depth = \"150\""}},
           "site.toml", {"recharge.plane_depth", "has no unit", "mm, cm or m"}),
      make("bare number for a conductivity",
           {{"site.toml", "saturated_conductivity = \"20 cm/d\"", "saturated_conductivity = 20"}}, "site.toml",
           {"layers[2].saturated_conductivity", "bare number", "cm/d"}),
      make("negative rain", {{"rain.csv", "2025-04-10,", "2025-04-10,-3.0\n#"}}, "rain.csv", {"rain"}),
      make("rain dates out of order", {{"rain.csv", "2025-04-10,", "2025-04-08,"}}, "rain.csv", {}),
      make("unreadable rain row", {{"rain.csv", "2025-04-12,", "2025-04-12,lots\n#"}}, "rain.csv", {"lots"}),
      make("overlapping layers", {{"site.toml", "top = \"40 cm\"", "top = \"35 cm\""}}, "site.toml",
           {"layers[2].top", "overlaps"}),
      make("gap between layers", {{"site.toml", "top = \"40 cm\"", "top = \"45 cm\""}}, "site.toml",
           {"layers[2].top", "gap between layers"}),
      make("first layer below the surface", {{"site.toml", "top = \"0 cm\"", "top = \"5 cm\""}}, "site.toml",
           {"layers[1].top", "surface"}),
      make("sensor below the column", {{"site.toml", "depth = \"120 cm\"", "depth = \"300 cm\""}}, "site.toml",
           {"sensors[4].depth", "not inside the column"}),
      // theta_r is the value out of its usual range, so the message points at its key (issue 12).
      make("theta_r above theta_s", {{"site.toml", "residual_water_content = 0.08", "residual_water_content = 0.45"}},
           "site.toml", {"layers[2].residual_water_content", "not below the saturated water content 0.42"}, 35),
      make("n not above one", {{"site.toml", "n = 1.5", "n = 1.0"}}, "site.toml", {"layers[2]", "n"}, 30),
      make("water content above one", {{"site.toml", "residual_water_content = 0.08", "residual_water_content = 8"}},
           "site.toml", {"layers[2].residual_water_content", "volume fraction"}),
      make("unknown key with a near miss", {{"site.toml", "plane_depth = \"150 cm\"", "plane_dept = \"150 cm\""}},
           "site.toml",
           {"unknown key 'recharge.plane_dept'", "did you mean 'plane_depth'?", "Allowed here: plane_depth"}),
      make("unknown table with a near miss", {{"site.toml", "[weather]", "[wether]"}}, "site.toml",
           {"unknown key 'wether'", "did you mean 'weather'?"}),
      make("unknown texture class", {{"site.toml", "texture = \"sandy loam\"", "texture = \"sandy lom\""}}, "site.toml",
           {"layers[1].texture", "sandy loam"}),
      make("run not covered by the rain record", {{"site.toml", "end = \"2025-10-18\"", "end = \"2025-12-31\""}},
           "rain.csv", {}, std::nullopt, false),
      make("missing rain file", {{"site.toml", "rain = \"rain.csv\"", "rain = \"no-such-rain.csv\""}}, "site.toml",
           {"weather.rain", "not found"}),
      make("missing sensor readings", {{"site.toml", "readings = \"probe-20cm.csv\"", "readings = \"probe.csv\""}},
           "site.toml", {"sensors[5].readings", "not found"}),
      make("not a date", {{"site.toml", "start = \"2025-04-01\"", "start = \"2025-13-01\""}}, "site.toml",
           {"run.start", "not a date"}),
      make("end before start", {{"site.toml", "end = \"2025-10-18\"", "end = \"2025-03-01\""}}, "site.toml",
           {"run.end", "must end after it starts"}),
      make("visit outside the run", {{"site.toml", "\"2025-10-14\"]", "\"2025-11-14\"]"}}, "site.toml",
           {"run.visits", "outside the run"}),
      make("visits out of order", {{"site.toml", "\"2025-04-15\", \"2025-04-22\"", "\"2025-04-22\", \"2025-04-15\""}},
           "site.toml", {"run.visits", "not later"}),
      make("TOML syntax error", {{"site.toml", "name = \"maize\"", "name = \"maize"}}, "site.toml", {"not valid TOML"}),
      make("missing required key", {{"site.toml", "planting = \"2025-04-25\"\n", ""}}, "site.toml",
           {"missing key 'crop.planting'"}, 74),
      make("unknown choice",
           {{"site.toml", "kind = \"water table\"             # the water", "kind = \"fixed\" # the water"}},
           "site.toml", {"bottom.kind", "'fixed' is not one of"}),
      make("crop coefficient out of range", {{"site.toml", "kc_mid = 1.2", "kc_mid = 2.5"}}, "site.toml", {"crop"}, 74),
      make("recharge plane below the column", {{"site.toml", "plane_depth = \"150 cm\"", "plane_depth = \"3 m\""}},
           "site.toml", {"recharge.plane_depth", "not inside the column"}),
      make("leaf area dates not increasing",
           {{"site.toml", "\"2025-05-25\", \"2025-07-09\"", "\"2025-07-09\", \"2025-05-25\""}}, "site.toml",
           {"crop.leaf_area_index.dates", "must increase"}),
      make("wind speed without unit", {{"site.toml", "wind_speed = \"2.5 m/s\"", "wind_speed = \"2.5\""}}, "site.toml",
           {"pan.wind_speed", "no unit", "m/s"}),
      make("texture and model together",
           {{"site.toml", "texture = \"sandy loam\" ", "model = \"gardner\"\ntexture = \"sandy loam\" "}}, "site.toml",
           {"layers[1].model", "not both"}),
      make("negative pan level", {{"pan-readings.csv", "2025-04-09T08:00,", "2025-04-09T08:00,-1"}}, "pan-readings.csv",
           {}),
      make("parameter beside a texture class",
           {{"site.toml", "texture = \"sandy loam\" ", "n = 1.3\ntexture = \"sandy loam\" "}}, "site.toml",
           {"unknown key 'layers[1].n'. Allowed here: name, top, bottom, note, texture"}),
      make("parameter of another model", {{"site.toml", "n = 1.5", "n = 1.5\nbubbling_head = \"-20 cm\""}}, "site.toml",
           {"unknown key 'layers[2].bubbling_head'. Allowed here:"}, 39),
      make("sensor name used twice", {{"site.toml", "name = \"T60\"", "name = \"T30\""}}, "site.toml",
           {"sensors[2].name", "used twice"}),
  };
}

// The message names the blamed file, the line (as "file:line"), and the fragments.
void expect_message(const MalformedCase& c, std::size_t edit_line, const std::string& message) {
  EXPECT_NE(message.find(c.blamed_file), std::string::npos) << c.name << ": " << message;
  if (c.line_known) {
    const std::size_t line = c.line.value_or(edit_line);
    if (c.blamed_file == "site.toml") {
      EXPECT_NE(message.find(fmt::format("site.toml:{}:", line)), std::string::npos) << c.name << ": " << message;
    } else {
      EXPECT_NE(message.find(fmt::format("{}:", c.blamed_file)), std::string::npos) << c.name << ": " << message;
    }
  }
  for (const auto& fragment : c.fragments) {
    EXPECT_NE(message.find(fragment), std::string::npos) << c.name << ": expected '" << fragment << "' in: " << message;
  }
}

TEST(MalformedSite, CasesAreDistinctAndEachChangesTheSite) {
  const auto cases = malformed_cases();
  for (std::size_t i = 0; i < cases.size(); ++i) {
    EXPECT_FALSE(cases[i].edits.empty()) << cases[i].name;
    for (const auto& edit : cases[i].edits) EXPECT_NE(edit.from, edit.to) << cases[i].name;
    for (std::size_t j = 0; j < i; ++j) EXPECT_NE(cases[i].name, cases[j].name);
  }
}

// Every kind of file the loader reads is blamed by at least one case: the site file, a daily
// record and the pan readings.
TEST(MalformedSite, CasesReachTheSiteFileAndItsRecords) {
  for (const std::string file : {"site.toml", "rain.csv", "pan-readings.csv"}) {
    bool blamed = false;
    for (const auto& c : malformed_cases()) blamed = blamed || c.blamed_file == file;
    EXPECT_TRUE(blamed) << "no malformed case blames " << file;
  }
}

TEST(MalformedSite, LoaderNamesFileLineAndKey) {
  for (const auto& c : malformed_cases()) {
    ScratchSite site("loader");
    std::size_t line = 0;
    for (const auto& edit : c.edits) line = site.replace(edit.file, edit.from, edit.to);
    try {
      (void)prepare_season(load_site_file(site.site_file()));
      ADD_FAILURE() << c.name << ": accepted";
    } catch (const base::InputError& error) {
      expect_message(c, line, error.what());
    }
  }
}

// For CSV errors the forcing reader reports the line; check it is the edited one.
TEST(MalformedSite, CsvErrorsNameTheEditedLine) {
  ScratchSite site("csvline");
  const std::size_t line = site.replace("rain.csv", "2025-04-12,", "2025-04-12,lots\n#");
  try {
    (void)prepare_season(load_site_file(site.site_file()));
    FAIL() << "accepted";
  } catch (const base::InputError& error) {
    EXPECT_NE(std::string(error.what()).find(fmt::format("rain.csv:{}", line)), std::string::npos) << error.what();
  }
}

TEST(MalformedSite, MissingSiteFileIsNamed) {
  try {
    (void)load_site_file("/nonexistent/folder/site.toml");
    FAIL() << "accepted";
  } catch (const base::InputError& error) {
    EXPECT_NE(std::string(error.what()).find("/nonexistent/folder/site.toml"), std::string::npos) << error.what();
  }
}

TEST(MalformedSite, ProgramExitsWithOneAndLeavesNoOutput) {
  for (const auto& c : malformed_cases()) {
    ScratchSite site("program");
    std::size_t line = 0;
    for (const auto& edit : c.edits) line = site.replace(edit.file, edit.from, edit.to);
    const auto out = site.folder() / "out.h5";
    const ProgramResult result = testing::run_site(site, out, "--quiet");
    EXPECT_EQ(result.exit_code, 1) << c.name << ": " << result.err;
    EXPECT_NE(result.err.find("error: "), std::string::npos) << c.name;
    expect_message(c, line, result.err);
    for (const auto& entry : std::filesystem::directory_iterator(site.folder())) {
      const std::string name = entry.path().filename().string();
      EXPECT_EQ(name.find(".h5"), std::string::npos) << c.name << ": left " << name;
      EXPECT_EQ(name.find("-visits"), std::string::npos) << c.name << ": left " << name;
    }
  }
}

TEST(MalformedSite, ProgramRefusesAMissingSiteFile) {
  ScratchSite site("nofile");
  const ProgramResult result =
      testing::run_program(fmt::format("run '{}' --quiet", (site.folder() / "absent.toml").string()), site.folder());
  EXPECT_EQ(result.exit_code, 1);
  EXPECT_NE(result.err.find("absent.toml"), std::string::npos) << result.err;
  EXPECT_FALSE(std::filesystem::exists(site.folder() / "absent.h5"));
}

}  // namespace
}  // namespace wetfront::site
