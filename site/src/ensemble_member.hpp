// One member of an anchored season (anchored_season.hpp): its parameter values, its season,
// and its soil water between stretches. A member runs one stretch at a time, from one visit
// with readings to the next; the analysis replaces its heads in between.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "wetfront/site/anchored_season.hpp"
#include "wetfront/site/season_setup.hpp"

namespace wetfront::site::detail {

struct EnsembleMember {
  studies::ParameterSet values;
  std::optional<Season> season;  // built from `values`; emptied when they change
  bool complete = true;
  std::string failure;
  std::vector<MemberInterval> intervals;  // one per visit interval, filled stretch by stretch
  // At the end of the last stretch run (the forecast), and what the analysis made of it.
  std::vector<double> heads_cm;       // per cell; empty before the first stretch
  std::vector<double> water_content;  // per cell, forecast
  double forecast_storage_cm = 0;     // soil and pond
  double soil_change_cm = 0;          // of the last analysis's new soil, booked with the next update
};

// What every member shares: the site, its study and its records.
struct EnsembleSite {
  const SiteSetup& site;
  const ParameterStudy& study;
  const FieldRecords& records;
};

// Builds the member's season if it has none; false (member failed, with the reason) when the
// values are not physical.
bool ensure_season(const EnsembleSite& shared, EnsembleMember& member);

// Runs the member from boundaries[first] to boundaries[last] (interval boundaries: run start,
// visits, run end), from its analysed heads (the season's initial state for the first stretch),
// and fills its intervals first..last-1. The first interval's update is the storage the restart
// starts from minus the forecast storage (soil and pond). A solver failure marks the member
// failed; nothing throws for it.
void run_stretch(const EnsembleSite& shared, EnsembleMember& member, const std::vector<double>& boundaries,
                 std::size_t first, std::size_t last);

}  // namespace wetfront::site::detail
