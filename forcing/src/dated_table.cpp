#include "wetfront/forcing/dated_table.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

double DatedTable::at(double day) const {
  if (day <= days.front()) return values.front();
  if (day >= days.back()) return values.back();
  const auto hi = static_cast<std::size_t>(std::upper_bound(days.begin(), days.end(), day) - days.begin());
  const std::size_t lo = hi - 1;
  const double w = (day - days[lo]) / (days[hi] - days[lo]);
  return values[lo] + w * (values[hi] - values[lo]);
}

void check_dated_table(const DatedTable& t, double lowest, double highest) {
  if (t.days.empty()) throw base::InputError(fmt::format("{} table: no entries; expected at least one", t.quantity));
  if (t.days.size() != t.values.size())
    throw base::InputError(fmt::format("{} table: {} dates but {} values", t.quantity, t.days.size(), t.values.size()));
  for (std::size_t i = 0; i < t.days.size(); ++i) {
    if (!std::isfinite(t.days[i]) || (i > 0 && !(t.days[i] > t.days[i - 1])))
      throw base::InputError(
          fmt::format("{} table, entry {}: day {:g} does not come after the previous entry; expected increasing dates",
                      t.quantity, i + 1, t.days[i]));
    if (!(t.values[i] >= lowest && t.values[i] <= highest))
      throw base::InputError(fmt::format("{} table, entry {}: value {:g}; expected {:g} to {:g}", t.quantity, i + 1,
                                         t.values[i], lowest, highest));
  }
}

}  // namespace wetfront::forcing
