// The report sections about field data: sensors against the model (with the Darcy estimate),
// the water-table-fluctuation estimate, the stored water over the probe depths, and the fit
// metrics as a table for NAME-sensors.csv. Printed by `wetfront run` and again by `show`.
#pragma once

#include <string>

#include <fmt/format.h>

#include "wetfront/site/report_table.hpp"
#include "wetfront/site/sensor_check.hpp"

namespace wetfront::cli {

inline constexpr double kMmPerCm = 10.0;

// An amount in cm as mm with one decimal.
inline std::string mm(double cm) { return fmt::format("{:.1f}", cm * kMmPerCm); }

// "20-80 cm": the depths the stored water spans.
inline std::string depth_range(const site::StorageCheck& storage) {
  return fmt::format("{}-{} cm", site::number(storage.depths_cm.front()), site::number(storage.depths_cm.back()));
}

// "Sensors against the model": metrics per sensor and pooled, readings left out and why, and
// the Darcy estimates beside the model's drainage.
std::string sensor_section(const site::SensorCheck& sensors);

// "Recharge from the water table": the water-table-fluctuation estimate per visit interval
// summed beside the model's drainage, with the reasons to consider where they differ.
std::string water_table_section(const site::WaterTableCheck& water_table);

// "Stored water over the probe depths": observed against simulated storage between the
// shallowest and the deepest depth, or a note that the comparison needs two depths.
std::string storage_section(const site::StorageCheck& storage);

// The fit metrics per sensor and pooled, one row each, with units in the headers.
site::ReportTable sensor_metrics_table(const site::SensorCheck& sensors);

}  // namespace wetfront::cli
