// The sensors against the model after a run: fit metrics per sensor and pooled per quantity,
// and per visit interval the Darcy estimate from a tensiometer pair and the water-table-
// fluctuation estimate from a well beside the model's drainage at the recharge plane.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/sensor_readings.hpp"
#include "wetfront/site/simulated_profiles.hpp"
#include "wetfront/observations/fit_metrics.hpp"
#include "wetfront/profiles/run_record.hpp"

namespace wetfront::site {

struct SensorFitRow {
  std::string name;  // sensor name, or "all tensiometers" / "all probes" when pooled
  std::string kind;
  double depth_cm = 0;   // NaN for a pooled row
  std::string quantity;  // "pressure head" or "water content"
  std::string unit;      // "cm" or "cm3/cm3"
  observations::FitMetrics metrics;
  // Each left-out reading counts once: outside the run first, then outside the depths.
  int beyond_working_limit = 0;  // left out: tensiometer beyond its working limit
  int outside_run = 0;           // left out: before the start or after the end reached
  int outside_depth = 0;         // left out: above the shallowest or below the deepest cell centre
};

// One visit interval of a recharge estimate from field data beside the model's drainage.
struct EstimateInterval {
  double start_day = 0;
  double end_day = 0;
  double model_cm = 0;                // drainage at the recharge plane over the interval
  std::optional<double> estimate_cm;  // empty when a visit has no usable reading
  std::string missing;                // why there is no estimate
  bool disagree = false;
  double ratio = 0;
  std::vector<std::string> reasons;
  // Water-table fluctuation only: the depth of the water table below the surface (positive
  // down) read at the interval's ends.
  std::optional<double> start_depth_cm, end_depth_cm;
};
using DarcyInterval = EstimateInterval;

struct DarcyCheck {
  std::string upper_name, lower_name;
  double upper_depth_cm = 0, lower_depth_cm = 0;
  std::string soil_note;  // which layer's hydraulic model gives K
  std::vector<EstimateInterval> intervals;
};

// Water-table fluctuation (Healy & Cook 2002) from an observation well, per visit interval.
struct WaterTableCheck {
  std::string well;
  double specific_yield = 0;
  double recession_cm_per_d = 0;
  std::string specific_yield_note;
  std::vector<EstimateInterval> intervals;
};

// Water stored between the shallowest and the deepest probe at each visit, from the probe
// readings and from the model at the same depths and times (trapezoid over the probe depths).
struct StorageVisit {
  double day = 0;
  std::optional<double> observed_cm;   // empty when a depth has no reading within the window
  std::optional<double> simulated_cm;  // empty with observed_cm, or outside the run reached
};

struct StorageInterval {
  double start_day = 0;
  double end_day = 0;
  std::optional<double> observed_change_cm;  // end minus start; positive when water was gained
  std::optional<double> simulated_change_cm;
};

struct StorageCheck {
  std::vector<double> depths_cm;         // distinct probe depths (or core depths without two probe depths), increasing
  std::vector<std::string> probe_names;  // probes at these depths, then core-sample entries with readings at them
  std::vector<StorageVisit> visits;      // the run start and every visit
  std::vector<StorageInterval> intervals;  // one per visit interval
  bool usable() const { return depths_cm.size() >= 2; }
};

struct SensorCheck {
  std::vector<SensorFitRow> sensors;  // one per sensor, in site-file order
  std::vector<SensorFitRow> pooled;   // per quantity present
  std::optional<DarcyCheck> darcy;
  std::optional<WaterTableCheck> water_table;
  std::optional<StorageCheck> storage;  // set by check_sensors
};

// Readings nearer than this to an interval's end visit are taken as read at the visit.
inline constexpr double kVisitReadingWindowDays = 1.0;
// The factor and the amount below which two recharge estimates count as agreeing.
inline constexpr double kAgreementFactor = 2.0;
inline constexpr double kNegligibleRechargeCm = 0.01;  // 0.1 mm

// One source of water contents for the stored water: a probe at its depth, or one core
// sampling depth of a core-samples entry.
struct StorageSource {
  std::string name;  // the probe or the core-samples entry
  bool core = false;
  double depth_cm = 0;
};

// The one rule for the stored-water depths, used by `run` (from the readings) and `show` (from
// the run file): the distinct probe depths; the distinct core depths instead when the probes
// give fewer than two and the cores two or more. Fills depths_cm and, as sources, the probes
// and then the core entries with a depth among them (each name once, in the order given).
void choose_storage_depths(const std::vector<StorageSource>& sources, StorageCheck& check);

// The stored-water comparison alone (check_sensors calls it). The depths are those of the
// probes; at a visit where no probe at a depth has a reading, core samples taken at that depth
// stand in. Without probes at two depths the core depths are used. With fewer than two depths
// only depths_cm and probe_names are filled.
StorageCheck check_storage(const std::vector<SensorRecord>& readings, const profiles::RunRecord& record);

SensorCheck check_sensors(const Season& season, const std::vector<SensorRecord>& readings,
                          const profiles::RunRecord& record);
// The same with the simulated values given (gathered as the run went when the record keeps no
// profiles).
SensorCheck check_sensors(const Season& season, const std::vector<SensorRecord>& readings,
                          const profiles::RunRecord& record, const SensorProfiles& simulated);

// Per visit interval the water-table-fluctuation estimate from the first observation well,
// or nothing without a well.
std::optional<WaterTableCheck> check_water_table(const Season& season, const std::vector<SensorRecord>& readings,
                                                 const profiles::RunRecord& record);

// The reliable reading of `r` within kVisitReadingWindowDays of `day`, the nearest one.
const observations::Observation* reading_near(const SensorRecord& r, double day);

// Flags an interval whose estimate differs from the model's drainage (kAgreementFactor,
// kNegligibleRechargeCm) and fills its reasons.
void compare_with_model(EstimateInterval& interval);

// The readings beside the simulated values, and the metrics, for the run file.
profiles::SensorComparisonRecord comparison_record(const SensorCheck& check, const std::vector<SensorRecord>& readings,
                                                   const solver::ColumnRun& run);
profiles::SensorComparisonRecord comparison_record(const SensorCheck& check, const std::vector<SensorRecord>& readings,
                                                   const SensorProfiles& simulated);

// Puts the Darcy and water-table estimates and the stored water into the record (its
// optionals stay empty for the checks the site does not have). field_check_record.cpp.
void store_field_checks(const SensorCheck& check, profiles::RunRecord& record);

// Everything `run` reported about the sensors, back from a run file: metrics, Darcy and
// water-table estimates (agreement recomputed from the stored amounts), stored water.
SensorCheck check_from_record(const profiles::RunRecord& record);

}  // namespace wetfront::site
