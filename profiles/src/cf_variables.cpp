#include "cf_variables.hpp"

namespace wetfront::profiles::cf {

namespace h5 = hdf5;

void set_depth_attributes(const h5::Dataset& depth) {
  h5::set_text_attribute(depth.id(), ".", "standard_name", "depth");
  h5::set_text_attribute(depth.id(), ".", "positive", "down");
}

namespace {

void set_time_attributes(const h5::Dataset& times) {
  h5::set_text_attribute(times.id(), ".", "standard_name", "time");
  h5::set_text_attribute(times.id(), ".", "calendar", "standard");
}

}  // namespace

h5::Dataset write_times(hid_t parent, std::string_view name, const std::vector<double>& days, const std::string& units,
                        std::string_view long_name) {
  h5::Dataset times = h5::write_vector(parent, name, days, {units, long_name});
  set_time_attributes(times);
  return times;
}

void make_time_axis(const h5::Dataset& times) {
  set_time_attributes(times);
  h5::set_text_attribute(times.id(), ".", "axis", "T");
  h5::make_coordinate(times);
}

h5::Dataset write_time_axis(hid_t parent, std::string_view name, const std::vector<double>& days,
                            const std::string& units, std::string_view long_name) {
  h5::Dataset axis = h5::write_vector(parent, name, days, {units, long_name});
  make_time_axis(axis);
  return axis;
}

h5::Dataset write_depth_axis(hid_t parent, std::string_view name, const std::vector<double>& depths_cm,
                             std::string_view long_name) {
  h5::Dataset axis = h5::write_vector(parent, name, depths_cm, {"cm", long_name});
  set_depth_attributes(axis);
  h5::set_text_attribute(axis.id(), ".", "axis", "Z");
  h5::make_coordinate(axis);
  return axis;
}

}  // namespace wetfront::profiles::cf
