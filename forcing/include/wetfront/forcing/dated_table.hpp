// A quantity given at dates and interpolated linearly between them (leaf area index, soil
// cover fraction, root depth). Before the first date the first value holds, after the last
// date the last value holds: give explicit entries at planting and harvest (e.g. LAI 0) for a
// bare soil outside the season.
#pragma once

#include <string>
#include <vector>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

struct DatedTable {
  std::string quantity;      // for messages, e.g. "leaf area index"
  std::vector<double> days;  // days since run start, strictly increasing
  std::vector<double> values;

  static DatedTable constant(std::string quantity, double value) { return {std::move(quantity), {0.0}, {value}}; }
  double at(double day) const;
};

// Throws base::InputError naming the quantity and entry when the table is empty, the
// sizes differ, days do not increase, or a value lies outside [lowest, highest].
void check_dated_table(const DatedTable& table, double lowest, double highest);

}  // namespace wetfront::forcing
