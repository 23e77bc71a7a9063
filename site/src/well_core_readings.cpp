// Readings files of observation wells (depth to water over time) and of oven-dried core
// samples (water content by depth on visit days), converted to cm and volume fractions.
// Core masses go through the laboratory routine soils::core_properties:
//   theta = (wet - dry) / (rho_w V), rho_w = 1 g/cm3 (soils/core_samples.hpp).
#include <array>
#include <cmath>
#include <optional>
#include <stdexcept>
#include <utility>

#include <fmt/format.h>

#include "wetfront/base/csv_table.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/site/sensor_readings.hpp"
#include "wetfront/base/time_point.hpp"
#include "wetfront/soils/core_samples.hpp"

namespace wetfront::site {
namespace {

namespace obs = observations;

using UnitTable = std::array<std::pair<std::string_view, double>, 2>;
constexpr UnitTable kMassUnits = {{{"g", 1.0}, {"kg", 1000.0}}};   // to g
constexpr UnitTable kVolumeUnits = {{{"cm3", 1.0}, {"mL", 1.0}}};  // to cm3

// The factor of a column's unit from a short table, or an error at the header naming the choices.
double factor_of(const base::CsvTable& table, std::size_t column, const UnitTable& units, std::string_view example) {
  const std::string& unit = table.column(column).unit;
  for (const auto& [name, factor] : units) {
    if (unit == name) return factor;
  }
  throw base::InputError(table.path(), table.header_line(), table.column(column).name,
                         fmt::format("the column needs a unit in the header, one of {} or {} (e.g. '{}'); found '{}'",
                                     units[0].first, units[1].first, example, unit));
}

double length_factor(const base::CsvTable& table, std::size_t column, std::string_view example) {
  const auto factor = base::to_internal(base::Dimension::length, 1.0, table.column(column).unit);
  if (!factor) {
    throw base::InputError(
        table.path(), table.header_line(), table.column(column).name,
        fmt::format("the column needs a unit in the header, one of {} (e.g. '{}'); found '{}'",
                    base::accepted_units(base::Dimension::length), example, table.column(column).unit));
  }
  return *factor;
}

double day_at(const base::CsvTable& table, std::size_t row, std::size_t column, base::TimePoint run_start) {
  return base::days_since(run_start, table.timestamp(row, column));
}

SensorRecord start_record(const SensorSetup& setup, std::string_view quantity, std::string_view unit) {
  SensorRecord record;
  record.name = setup.name;
  record.kind = setup.kind;
  record.depth_cm = setup.depth_cm;
  record.quantity = quantity;
  record.unit = unit;
  record.file = setup.readings.string();
  record.series.name = setup.name;
  return record;
}

}  // namespace

SensorRecord read_well_levels(const SensorSetup& well, base::TimePoint run_start) {
  const base::CsvTable table = base::CsvTable::read(well.readings.string());
  SensorRecord record = start_record(well, kWaterTableDepth, "cm");
  const std::size_t time_col = table.require_column("time");
  const std::size_t depth_col = table.require_column("depth to water");
  const double factor = length_factor(table, depth_col, "depth to water [m]");
  if (table.row_count() == 0) throw base::InputError(table.path(), 0, "", "the file has a header but no readings");
  double previous_day = -1e300;
  for (std::size_t row = 0; row < table.row_count(); ++row) {
    const double day = day_at(table, row, time_col, run_start);
    if (!(day > previous_day)) throw table.error_at(row, time_col, "times must increase down the file");
    previous_day = day;
    const double depth_cm = table.number(row, depth_col) * factor;
    if (!(depth_cm >= 0)) {
      throw table.error_at(row, depth_col,
                           fmt::format("a depth to water below the ground surface is zero or more, got {} {}",
                                       table.text(row, depth_col), table.column(depth_col).unit));
    }
    record.series.observations.push_back({day, depth_cm, depth_cm, true});
    record.lines.push_back(table.line_of(row));
  }
  return record;
}

namespace {
// To the nearest 1e-6 cm (kCoreDepthStepCm): an integer count of steps divided by 1e6, which
// gives the double nearest the decimal depth.
double round_core_depth_cm(double depth_cm) { return std::round(depth_cm * 1e6) / 1e6; }
}  // namespace

SensorRecord read_core_samples(const SensorSetup& cores, base::TimePoint run_start, double column_depth_cm) {
  const base::CsvTable table = base::CsvTable::read(cores.readings.string());
  SensorRecord record = start_record(cores, kWaterContent, "cm3/cm3");
  const std::size_t time_col = table.require_column("time");
  const std::size_t depth_col = table.require_column("depth");
  const double depth_factor = length_factor(table, depth_col, "depth [cm]");
  const auto content_col = table.find_column("water content");
  std::optional<double> content_factor;
  std::size_t wet_col = 0, dry_col = 0, volume_col = 0;
  std::optional<std::size_t> tare_col;
  double wet_factor = 1, dry_factor = 1, volume_factor = 1, tare_factor = 1;
  if (content_col) {
    content_factor = base::to_internal(base::Dimension::water_content, 1.0, table.column(*content_col).unit);
    if (!content_factor) {
      throw base::InputError(
          table.path(), table.header_line(), table.column(*content_col).name,
          fmt::format("the water content column needs a unit in the header, one of {} (e.g. 'water content [%]'); "
                      "found '{}'",
                      base::accepted_units(base::Dimension::water_content), table.column(*content_col).unit));
    }
  } else {
    if (!table.find_column("wet mass")) {
      throw base::InputError(
          table.path(), table.header_line(), "",
          "a core-samples file needs either a 'water content' column or the columns 'wet mass', 'dry mass' "
          "and 'ring volume' (e.g. 'wet mass [g]', 'dry mass [g]', 'ring volume [cm3]')");
    }
    wet_col = table.require_column("wet mass");
    dry_col = table.require_column("dry mass");
    volume_col = table.require_column("ring volume");
    tare_col = table.find_column("tare mass");
    wet_factor = factor_of(table, wet_col, kMassUnits, "wet mass [g]");
    dry_factor = factor_of(table, dry_col, kMassUnits, "dry mass [g]");
    volume_factor = factor_of(table, volume_col, kVolumeUnits, "ring volume [cm3]");
    if (tare_col) tare_factor = factor_of(table, *tare_col, kMassUnits, "tare mass [g]");
  }
  if (table.row_count() == 0) throw base::InputError(table.path(), 0, "", "the file has a header but no samples");
  double previous_day = -1e300;
  for (std::size_t row = 0; row < table.row_count(); ++row) {
    const double day = day_at(table, row, time_col, run_start);
    if (day < previous_day) throw table.error_at(row, time_col, "times must not decrease down the file");
    previous_day = day;
    // Rounded so that a depth given in m or mm matches the same depth of a probe (0.55 m x 100
    // is 55.00000000000001 cm in binary floating point).
    const double depth_cm = round_core_depth_cm(table.number(row, depth_col) * depth_factor);
    if (!(depth_cm > 0)) {
      throw table.error_at(row, depth_col,
                           fmt::format("a core depth below the surface is greater than zero, got {} {}",
                                       table.text(row, depth_col), table.column(depth_col).unit));
    }
    if (depth_cm > column_depth_cm) {
      throw table.error_at(row, depth_col,
                           fmt::format("a core depth must lie within the soil column (0 to {} cm), got {} {}",
                                       column_depth_cm, table.text(row, depth_col), table.column(depth_col).unit));
    }
    double theta = 0;
    if (content_col) {
      theta = table.number(row, *content_col) * *content_factor;
      if (!(theta >= 0 && theta <= 1)) {
        throw table.error_at(row, *content_col,
                             fmt::format("a water content must lie between 0 and 100 %, got {} {}",
                                         table.text(row, *content_col), table.column(*content_col).unit));
      }
    } else {
      soils::CoreSample core;
      core.name = fmt::format("line {}", table.line_of(row));
      core.ring_volume_cm3 = table.number(row, volume_col) * volume_factor;
      core.tare_mass_g = tare_col ? table.number(row, *tare_col) * tare_factor : 0.0;
      core.wet_mass_g = table.number(row, wet_col) * wet_factor;
      core.oven_dry_mass_g = table.number(row, dry_col) * dry_factor;
      // The ring and the tare are checked against their own columns; the wet mass after them
      // (soils::core_properties).
      if (!(core.ring_volume_cm3 > 0)) {
        throw table.error_at(row, volume_col,
                             fmt::format("a ring volume is greater than zero, got {} {}", table.text(row, volume_col),
                                         table.column(volume_col).unit));
      }
      if (tare_col && !(core.tare_mass_g >= 0)) {
        throw table.error_at(row, *tare_col,
                             fmt::format("a tare mass is zero or more, got {} {}", table.text(row, *tare_col),
                                         table.column(*tare_col).unit));
      }
      if (!(core.oven_dry_mass_g > core.tare_mass_g)) {
        throw table.error_at(
            row, dry_col,
            tare_col ? fmt::format("the dry mass ({} g) must exceed the tare mass ({} g): the ring holds no soil",
                                   core.oven_dry_mass_g, core.tare_mass_g)
                     : fmt::format("a dry mass is greater than zero, got {} {}", table.text(row, dry_col),
                                   table.column(dry_col).unit));
      }
      try {
        theta = soils::core_properties(core).volumetric_water_content;
      } catch (const base::InputError& error) {
        throw table.error_at(row, wet_col,
                             fmt::format("the masses and volume give no water content: {}", error.what()));
      }
    }
    record.series.observations.push_back({day, depth_cm, theta, true});
    record.lines.push_back(table.line_of(row));
  }
  return record;
}

}  // namespace wetfront::site
