#include "wetfront/site/field_readings.hpp"

#include <algorithm>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"

namespace wetfront::site {

std::vector<HeadReadings> group_readings(const base::CsvTable& table, const std::string& head_column,
                                         base::Dimension head_dimension) {
  const std::size_t head_col = table.require_column(head_column);
  const std::size_t time_col = table.require_column("time");
  const std::size_t level_col = table.require_column("water level");
  const std::size_t steady_col = table.require_column("steady");
  if (table.row_count() == 0) throw base::InputError(table.path(), 0, "", "the file has a header but no readings");

  std::vector<HeadReadings> groups;
  for (std::size_t row = 0; row < table.row_count(); ++row) {
    const double head = table.quantity(row, head_col, head_dimension);
    const double time = table.quantity(row, time_col, base::Dimension::time);
    const double level = table.quantity(row, level_col, base::Dimension::length);
    const bool steady = table.flag(row, steady_col);
    auto group = std::find_if(groups.begin(), groups.end(), [&](const HeadReadings& g) { return g.head_cm == head; });
    if (group == groups.end()) {
      groups.push_back({head, {}, {}, 0, row});
      group = std::prev(groups.end());
    }
    ++group->all_readings;
    if (steady) {
      group->steady_readings.push_back({time, level});
      group->steady_rows.push_back(row);
    }
  }
  std::sort(groups.begin(), groups.end(),
            [](const HeadReadings& a, const HeadReadings& b) { return a.head_cm < b.head_cm; });
  return groups;
}

std::vector<HeadOutflow> steady_outflows(const base::CsvTable& table, const std::vector<HeadReadings>& groups,
                                         double reservoir_area_cm2, const soils::SteadinessTolerances& tolerances) {
  const std::size_t time_col = table.require_column("time");
  std::vector<HeadOutflow> results;
  for (const auto& group : groups) {
    try {
      results.push_back({group.head_cm, soils::steady_outflow(group.steady_readings, reservoir_area_cm2, tolerances),
                         group.all_readings});
    } catch (const soils::InvalidReading& error) {
      throw table.error_at(group.steady_rows[error.reading_index()], time_col, error.what());
    } catch (const base::InputError& error) {
      throw base::InputError(
          table.path(), table.line_of(group.first_row), "steady",
          fmt::format("readings at head {} cm (from this line on): {}", group.head_cm, error.what()));
    }
  }
  return results;
}

}  // namespace wetfront::site
