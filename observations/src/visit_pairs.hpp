// Walking a record of visits interval by interval.
#pragma once

#include <span>
#include <string_view>
#include <vector>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"

namespace wetfront::observations::detail {

// row(from, to) for each pair of consecutive visits, in order. Throws base::InputError when the
// visit days do not increase ("<what> visits out of order").
template <class Row, class Visit, class MakeRow>
std::vector<Row> rows_between_visits(std::span<const Visit> visits, std::string_view what, MakeRow row) {
  std::vector<Row> rows;
  for (std::size_t i = 1; i < visits.size(); ++i) {
    const Visit& from = visits[i - 1];
    const Visit& to = visits[i];
    if (!(to.day > from.day))
      throw base::InputError(fmt::format("{} visits out of order: day {} follows day {}", what, to.day, from.day));
    rows.push_back(row(from, to));
  }
  return rows;
}

}  // namespace wetfront::observations::detail
