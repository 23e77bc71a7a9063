// Variables with the CF attributes a reader needs to recognise times and depths
// (CF-1.10 sections 4.3 and 4.4): standard names, calendar, positive direction, axis.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "hdf5_io.hpp"

namespace wetfront::profiles::cf {

// standard_name "depth" and positive "down" on a depth below the soil surface.
void set_depth_attributes(const hdf5::Dataset& depth);

// Days since the run start (`units` from days_since_units): standard_name "time", standard calendar.
hdf5::Dataset write_times(hid_t parent, std::string_view name, const std::vector<double>& days,
                          const std::string& units, std::string_view long_name);

// Makes `times` (with its units and long name) the time coordinate variable of the dimension of
// its own name: standard name, calendar, `axis`.
void make_time_axis(const hdf5::Dataset& times);

// The same as coordinate variables (the dimension of the variable's own name), with `axis`.
hdf5::Dataset write_time_axis(hid_t parent, std::string_view name, const std::vector<double>& days,
                              const std::string& units, std::string_view long_name);
hdf5::Dataset write_depth_axis(hid_t parent, std::string_view name, const std::vector<double>& depths_cm,
                               std::string_view long_name);

}  // namespace wetfront::profiles::cf
