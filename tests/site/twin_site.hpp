// A scratch copy of the demo site whose tensiometer readings are made by the model itself,
// from known parameter values, with or without Gaussian noise of known size: a twin
// experiment, where the right answer of a sweep or calibration is known by construction.
#pragma once

#include <cstdint>
#include <string>

#include "wetfront/site/adjustable_parameters.hpp"
#include "wetfront/site/parameter_runs.hpp"
#include "site_test_helpers.hpp"

namespace wetfront::site::testing {

// Replaces the [fit] and [[adjustable]] entries at the end of the scratch site's site.toml by
// `toml` (or appends it when there are none).
void add_study(const ScratchSite& site, const std::string& toml);

// The site and study as the commands load them, for a run ending on `end_date`.
SeasonModel load_model(const ScratchSite& site, const std::string& end_date);

// Replaces every tensiometer readings file by the model's heads under `truth` (plus noise of
// sd `noise_cm`, seeded), at the same reading times. Returns the number of readings written.
std::size_t write_twin_readings(const ScratchSite& site, const std::string& end_date,
                                const studies::ParameterSet& truth, double noise_cm, std::uint64_t seed);

}  // namespace wetfront::site::testing
