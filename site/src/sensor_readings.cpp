#include "wetfront/site/sensor_readings.hpp"

#include <optional>
#include <stdexcept>

#include <fmt/format.h>

#include "wetfront/base/csv_table.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/time_point.hpp"
#include "wetfront/observations/tensiometer.hpp"
#include "wetfront/observations/water_content.hpp"

namespace wetfront::site {
namespace {

namespace obs = observations;

// A tension in the unit of its column; empty for a unit that is not a pressure.
std::optional<obs::Tension> tension_in(const std::string& unit, double value) {
  if (unit == "kPa" || unit == "cbar" || unit == "centibar") return obs::Tension{value, obs::TensionUnit::kilopascal};
  if (unit == "hPa" || unit == "mbar") return obs::Tension{value, obs::TensionUnit::millibar};
  if (unit == "cm") return obs::Tension{value, obs::TensionUnit::cm_of_water};
  if (unit == "mm") return obs::Tension{value / 10.0, obs::TensionUnit::cm_of_water};
  if (unit == "m") return obs::Tension{value * 100.0, obs::TensionUnit::cm_of_water};
  return std::nullopt;
}

SensorRecord read_one(const SensorSetup& sensor, base::TimePoint run_start, double column_depth_cm) {
  if (sensor.kind == kObservationWell) return read_well_levels(sensor, run_start);
  if (sensor.kind == kCoreSamples) return read_core_samples(sensor, run_start, column_depth_cm);
  const base::CsvTable table = base::CsvTable::read(sensor.readings.string());
  SensorRecord record;
  record.name = sensor.name;
  record.kind = sensor.kind;
  record.depth_cm = sensor.depth_cm;
  record.file = sensor.readings.string();
  record.series.name = sensor.name;
  const std::size_t time_col = table.require_column("time");
  const bool tensiometer = sensor.kind == "tensiometer";

  std::size_t value_col = 0;
  bool permittivity = false;
  if (tensiometer) {
    record.quantity = "pressure head";
    record.unit = "cm";
    record.working_limit_kpa = sensor.working_limit_kpa;
    value_col = table.require_column("tension");
    const std::string& unit = table.column(value_col).unit;
    if (!tension_in(unit, 1.0)) {
      throw base::InputError(
          table.path(), table.header_line(), table.column(value_col).name,
          fmt::format("the tension column needs a unit in the header, one of kPa, cbar, centibar, hPa, mbar, mm, cm, m "
                      "(e.g. 'tension [kPa]'); found '{}'",
                      unit));
    }
  } else {
    record.quantity = "water content";
    record.unit = "cm3/cm3";
    if (const auto column = table.find_column("permittivity")) {
      value_col = *column;
      permittivity = true;
    } else {
      value_col = table.require_column("water content");
      if (!base::to_internal(base::Dimension::water_content, 1.0, table.column(value_col).unit)) {
        throw base::InputError(
            table.path(), table.header_line(), table.column(value_col).name,
            fmt::format("the water content column needs a unit in the header, one of {} (e.g. 'water content [%]'); "
                        "found '{}'",
                        base::accepted_units(base::Dimension::water_content), table.column(value_col).unit));
      }
    }
  }
  if (table.row_count() == 0) throw base::InputError(table.path(), 0, "", "the file has a header but no readings");

  const obs::TensiometerInstallation installation{
      sensor.depth_cm,
      sensor.gauge_height_cm ? obs::ReadingPoint::gauge_above_ground : obs::ReadingPoint::transducer_at_cup,
      sensor.gauge_height_cm.value_or(0.0)};
  double previous_day = -1e300;
  for (std::size_t row = 0; row < table.row_count(); ++row) {
    const double day = base::days_since(run_start, table.timestamp(row, time_col));
    if (!(day > previous_day)) throw table.error_at(row, time_col, "times must increase down the file");
    previous_day = day;
    const double raw = table.number(row, value_col);
    obs::Observation observation{day, sensor.depth_cm, 0.0, true};
    if (tensiometer) {
      const obs::Tension tension = *tension_in(table.column(value_col).unit, raw);
      observation.value = obs::cup_pressure_head_cm(installation, tension);
      observation.reliable = obs::within_working_limit(tension, obs::WorkingLimit{sensor.working_limit_kpa});
      if (!observation.reliable) ++record.beyond_working_limit;
    } else if (permittivity) {
      try {
        observation.value = obs::topp_water_content(raw);
      } catch (const std::exception& error) {
        throw table.error_at(row, value_col, error.what());
      }
    } else {
      observation.value = raw * *base::to_internal(base::Dimension::water_content, 1.0, table.column(value_col).unit);
      if (!(observation.value >= 0 && observation.value <= 1)) {
        throw table.error_at(
            row, value_col,
            fmt::format("a water content must lie between 0 and 100 %, got {} {}", raw, table.column(value_col).unit));
      }
    }
    record.series.observations.push_back(observation);
    record.lines.push_back(table.line_of(row));
  }
  return record;
}

}  // namespace

std::vector<SensorRecord> read_sensor_readings(const SiteSetup& site) {
  std::vector<SensorRecord> records;
  const double column_depth_cm = site.layers.empty() ? 0.0 : site.layers.back().bottom_depth_cm;
  for (const auto& sensor : site.sensors) records.push_back(read_one(sensor, site.run_start, column_depth_cm));
  return records;
}

}  // namespace wetfront::site
