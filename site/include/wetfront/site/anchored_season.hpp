// A season anchored on the readings of each visit: an ensemble of the season whose members'
// soil water is updated at every visit with readings by the ensemble Kalman filter
// (studies/ensemble_filter.hpp). docs/anchored-season.md states what the method assumes.
//
// Members: parameter sets drawn from the [[adjustable]] ranges (Latin hypercube,
// parameter_sampling.hpp), or around the values of a calibration file with the covariance of
// that fit, truncated to the ranges (parameter_uncertainty.hpp). Each member runs from one visit with readings to the
// next; there its forecast is compared with the visit's tensiometer, probe and core readings (the same readings and
// reading uncertainties as the [fit] objective, a reading belonging to the visit nearest to it within
// kVisitReadingWindowDays) and updated, and the next stretch restarts from the analysed heads.
//
// Localisation: a cell is updated only from readings within 2 x AnchorSettings::reach_cm of it,
// with weights falling smoothly with distance; the parameters (with --update-parameters) from
// every reading.
//
// Update variable: the pressure head of every cell as log10(1 cm + suction) (and, on request,
// the adjustable parameters on their search scale: state augmentation). Heads, not water
// contents: members whose soils differ hold different water at the same heads, and a water
// content update pushes each off its own retention curve (src/member_state.hpp says how that
// pumped water through the members). Analysed heads are held where the member's soil holds a
// water content strictly inside (theta_r, theta_s), so every member stays physical. The stored
// water an update adds or removes (and any pond the restart drops; with parameter updates also
// the change of the soil's water at the same heads) is the interval's own balance term
// `update_cm`; it never enters drainage.
#pragma once

#include <cstdint>
#include <filesystem>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "wetfront/site/parameter_runs.hpp"
#include "wetfront/site/sensor_check.hpp"

namespace wetfront::site {

struct AnchorSettings {
  std::size_t members = 64;
  std::uint64_t seed = 1;
  bool update_parameters = false;  // state augmentation with the adjustable parameters
  unsigned threads = 0;            // 0: all cores; results do not depend on it
  // Localisation: a cell's update from a reading fades with their distance apart and stops at
  // twice this (studies::gaspari_cohn); 0: every cell from every reading.
  double reach_cm = 30.0;
  // Empty: members from the [[adjustable]] ranges. Else a calibration file (`wetfront calibrate`)
  // of the same parameters: members around its values with its covariance.
  std::filesystem::path calibration_file{};
};

// One member over one visit interval, cm of water.
struct MemberInterval {
  double drainage_cm = 0;       // across the recharge plane, positive downward
  double net_inflow_cm = 0;     // water input - evaporation - runoff - transpiration - bottom flux
  double update_cm = 0;         // added by the update at the interval's start (negative: removed)
  double soil_change_cm = 0;    // part of update_cm: a parameter update's new soil holding other water at the
                                // same heads (0 without parameter updates)
  double storage_start_cm = 0;  // soil and pond at the start, before the update
  double storage_end_cm = 0;    // soil and pond at the end, before any update there
  double balance_error_cm = 0;  // (end - start) - net inflow - update
};

// One reading compared at a visit.
struct VisitReading {
  std::string sensor;
  std::string quantity;  // kPressureHead or kWaterContent
  double depth_cm = 0;
  double day = 0;          // when it was read
  double value = 0;        // cm or cm3/cm3
  double uncertainty = 0;  // sd of the reading error, same unit
  double forecast_mean = 0;
  double forecast_spread = 0;  // sd of the members' forecasts
  double analysis_mean = 0;    // the members' mean after the update, at the same place
};

struct VisitUpdate {
  double day = 0;
  std::string date;  // ISO 8601, as the site file gives it
  std::vector<VisitReading> readings;
  std::vector<double> stored_water_increment_cm;  // per member (dropped members: NaN)
  bool collapsed = false;                         // forecast spread far below the reading uncertainty
  bool outside = false;                           // innovations well outside spread and uncertainty together
};

struct AnchoredSeason {
  AnchorSettings settings;
  std::vector<double> interval_start_days, interval_end_days;
  std::vector<studies::ParameterSet> drawn_parameters;  // per member, as drawn
  std::vector<studies::ParameterSet> final_parameters;  // per member, after the last update
  std::vector<std::vector<MemberInterval>> members;     // [member][interval]
  std::vector<bool> member_complete;                    // false: the solver or an update failed
  std::vector<std::string> member_failures;             // why, per member (empty when complete)
  std::vector<VisitUpdate> visits;                      // visits with readings, in time order
  std::size_t readings_not_at_a_visit = 0;              // readings no visit lies near: not used
  std::vector<double> free_run_drainage_cm;             // the site's own values, per interval
  std::optional<DarcyCheck> darcy;                      // of the free run's readings, per interval
  std::optional<WaterTableCheck> water_table;
  std::vector<std::string> warnings;            // collapse, innovations outside the spread
  std::vector<std::string> interval_end_dates;  // ISO 8601, for reports
  std::string input_hash;                       // of the site file and its records
};

// The mean and central 90 % band (5th and 95th percentiles, studies::percentile) of values over
// members; NaN for no values. The bands of an interval take the complete members' values.
struct EnsembleBand {
  double mean = 0, lower = 0, upper = 0;
};
EnsembleBand ensemble_band(const std::vector<double>& values);
EnsembleBand drainage_band(const AnchoredSeason& season, std::size_t interval);
EnsembleBand update_band(const AnchoredSeason& season, std::size_t interval);
EnsembleBand soil_change_band(const AnchoredSeason& season, std::size_t interval);

// Runs the anchored season of the site. Throws base::InputError naming the site file for no
// adjustable parameters, fewer than two members, or fewer than two members left complete, for
// records the season cannot use, and naming the calibration file for one that does not fit. progress(done, planned)
// counts member stretches.
AnchoredSeason run_anchored_season(const SiteSetup& site, const ParameterStudy& study, const AnchorSettings& settings,
                                   const std::string& program_version,
                                   const std::function<void(std::size_t, std::size_t)>& progress = {});

}  // namespace wetfront::site
