// Readers for laboratory data in CSV files. The header row names the columns, with the unit
// in the name; columns may come in any order. Blank lines and lines starting with '#' are
// skipped (base::CsvTable reads them). Every error is a base::InputError naming the file, the
// line and the column.
//
// Retention points:   suction_cm | suction_kPa, water_content        [, sample] [, note]
// Core samples:       sample, ring_volume_cm3, tare_mass_g, wet_mass_g, oven_dry_mass_g [, note]
// Suction steps:      sample, suction_cm | suction_kPa, wet_mass_g  [, note]
//   (one row per core and suction step; the oven-dry mass comes from the core-sample file)
#pragma once

#include <filesystem>
#include <istream>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "wetfront/soils/core_samples.hpp"
#include "wetfront/soils/retention_fit.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::soils {

// Retention points of one sample, in file order; `lines` gives each point's line number.
struct RetentionSeries {
  std::string sample;  // empty when the file has no sample column
  std::vector<RetentionPoint> points;
  std::vector<int> lines;
};

// One series per sample, in order of first appearance.
std::vector<RetentionSeries> read_retention_csv(const std::filesystem::path& file);
std::vector<RetentionSeries> parse_retention_csv(std::istream& in, std::string_view source_name);

// Core samples; sample names must be unique. Each row is checked with core_properties().
std::vector<CoreSample> read_core_samples_csv(const std::filesystem::path& file);
std::vector<CoreSample> parse_core_samples_csv(std::istream& in, std::string_view source_name);

struct SuctionStepSeries {
  std::string sample;
  std::vector<SuctionStep> steps;
  std::vector<int> lines;
};
std::vector<SuctionStepSeries> read_suction_steps_csv(const std::filesystem::path& file);
std::vector<SuctionStepSeries> parse_suction_steps_csv(std::istream& in, std::string_view source_name);

// Retention points for each sample with suction steps, from the matching core (by name).
// Throws base::InputError for steps of a sample that has no core.
std::vector<RetentionSeries> retention_from_cores(const std::vector<CoreSample>& cores,
                                                  const std::vector<SuctionStepSeries>& steps);

}  // namespace wetfront::soils
