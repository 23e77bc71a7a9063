// The report sections about field data: sensors against the model (with the Darcy estimate),
// the water-table-fluctuation estimate and the stored water over the probe depths. Printed by
// `wetfront run` and again by `show`.
#pragma once

#include <string>

#include "wetfront/site/sensor_check.hpp"

namespace wetfront::cli {

// "Sensors against the model": metrics per sensor and pooled, readings left out and why, and
// the Darcy estimates beside the model's drainage.
std::string sensor_section(const site::SensorCheck& sensors);

// "Recharge from the water table": the water-table-fluctuation estimate per visit interval
// summed beside the model's drainage, with the reasons to consider where they differ.
std::string water_table_section(const site::WaterTableCheck& water_table);

// "Stored water over the probe depths": observed against simulated storage between the
// shallowest and the deepest depth, or a note that the comparison needs two depths.
std::string storage_section(const site::StorageCheck& storage);

}  // namespace wetfront::cli
