// Readers for the CSV files of field records (columns and units in docs/forcing.md).
//
// General form: comma-separated, first non-comment line is the header, lines starting with
// '#' and blank lines are skipped, spaces around fields are ignored, columns not named here
// are ignored. Every error is an base::InputError naming the file, line and column and saying what
// was expected.
#pragma once

#include <filesystem>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "wetfront/forcing/dated_table.hpp"
#include "wetfront/forcing/depth_series.hpp"
#include "wetfront/forcing/pan_gauge.hpp"
#include "wetfront/base/time_point.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

// Depth per interval of `quantity` ("rain", "irrigation", "pan_evaporation"): columns
//   date, <quantity>_mm | <quantity>_cm              one row per calendar day
//   start, end, <quantity>_mm | <quantity>_cm        any interval, date or date-time
// An empty depth cell marks a missing record.
// Hard limit of a rain or irrigation depth: 200 cm (2000 mm) per day of the interval, above the
// largest one-day rain on record (about 1800 mm, from memory); read_depth_series_csv refuses more.
inline constexpr double kMaxWaterInputPerDay_cm = 200.0;
DepthSeries read_depth_series_csv(const std::filesystem::path& file, std::string_view quantity,
                                  base::TimePoint run_start);

// Hook-gauge readings of a Class A pan: columns
//   time, level_mm | level_cm, rain_mm | rain_cm, event
// event is empty or "reading", "before_refill", "after_refill".
std::vector<PanReading> read_pan_readings_csv(const std::filesystem::path& file, base::TimePoint run_start);

// A dated table: columns `date` and one value column from `accepted_columns`, each with the
// factor that converts it to the table's unit (e.g. {"root_depth_cm", 1}, {"root_depth_mm", 0.1}).
struct ValueColumn {
  std::string_view name;
  double to_table_unit = 1.0;
};
DatedTable read_dated_table_csv(const std::filesystem::path& file, std::string quantity,
                                std::span<const ValueColumn> accepted_columns, base::TimePoint run_start);

}  // namespace wetfront::forcing
