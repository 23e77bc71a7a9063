#include "wetfront/forcing/csv_readers.hpp"

#include <algorithm>
#include <array>
#include <chrono>

#include <fmt/format.h>

#include "csv_text.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::forcing {

namespace {

// A calendar date only (no time of day) in `column`.
date::sys_days calendar_day(const csv::Table& t, const csv::Row& r, std::size_t column) {
  const base::TimePoint tp = csv::time(t, r, column);
  const auto day = date::floor<date::days>(tp);
  if (r.fields[column].size() != 10 || tp != day)
    throw base::InputError(t.file, r.line, t.header[column],
                           fmt::format("'{}' has a time of day; expected a calendar date YYYY-MM-DD (use start and end "
                                       "columns for intervals that do not run midnight to midnight)",
                                       r.fields[column]));
  return day;
}

}  // namespace

DepthSeries read_depth_series_csv(const std::filesystem::path& file, std::string_view quantity,
                                  base::TimePoint run_start) {
  const csv::Table t = csv::read(file);
  const std::string mm = fmt::format("{}_mm", quantity);
  const std::string cm = fmt::format("{}_cm", quantity);
  const std::array<std::string_view, 2> depth_names{mm, cm};
  const auto [unit_index, depth_col] = t.one_of(depth_names, fmt::format("the {} depth per interval", quantity));
  const double to_cm = unit_index == 0 ? 0.1 : 1.0;

  const bool has_date = t.column("date").has_value();
  const bool has_interval = t.column("start").has_value() || t.column("end").has_value();
  if (has_date == has_interval)
    throw base::InputError(
        t.file, t.header_line, "",
        "expected either a 'date' column (one row per day) or 'start' and 'end' columns (any interval), "
        "not both and not neither");

  DepthSeries s;
  s.quantity = std::string(quantity);
  s.source_file = t.file;
  s.run_start = run_start;
  if (has_date) {
    const std::size_t date_col = *t.column("date");
    for (const auto& r : t.rows) {
      const auto day = calendar_day(t, r, date_col);
      const double start = base::days_since(run_start, base::TimePoint{day});
      const auto depth = csv::optional_number(t, r, depth_col);
      s.intervals.push_back({start, start + 1.0, depth ? std::optional<double>(*depth * to_cm) : std::nullopt, r.line});
    }
  } else {
    const std::size_t start_col = t.required_column("start", "the start of each interval");
    const std::size_t end_col = t.required_column("end", "the end of each interval");
    for (const auto& r : t.rows) {
      const double start = base::days_since(run_start, csv::time(t, r, start_col));
      const double end = base::days_since(run_start, csv::time(t, r, end_col));
      const auto depth = csv::optional_number(t, r, depth_col);
      s.intervals.push_back({start, end, depth ? std::optional<double>(*depth * to_cm) : std::nullopt, r.line});
    }
  }
  for (const auto& iv : s.intervals) {
    if (iv.depth_cm && *iv.depth_cm < 0)
      throw base::InputError(t.file, iv.source_line, t.header[depth_col],
                             fmt::format("negative depth {:g}; expected a depth >= 0", *iv.depth_cm / to_cm));
    // Hard range: kMaxWaterInputPerDay_cm in any day (more for a longer interval).
    const double limit_cm = kMaxWaterInputPerDay_cm * std::max(1.0, iv.end_day - iv.start_day);
    if (iv.depth_cm && !(*iv.depth_cm <= limit_cm))
      throw base::InputError(
          t.file, iv.source_line, t.header[depth_col],
          fmt::format("{:g} {} in one interval is beyond any {} on record ({} mm in a day is the hard limit); check "
                      "the unit in the header and the number",
                      *iv.depth_cm / to_cm, to_cm == 1.0 ? "cm" : "mm", quantity, kMaxWaterInputPerDay_cm * 10));
  }
  check_depth_series(s);
  return s;
}

std::vector<PanReading> read_pan_readings_csv(const std::filesystem::path& file, base::TimePoint run_start) {
  const csv::Table t = csv::read(file);
  const std::size_t time_col = t.required_column("time", "the time of each reading");
  const std::array<std::string_view, 2> level_names{"level_mm", "level_cm"};
  const auto [level_unit, level_col] = t.one_of(level_names, "the water level above the pan floor");
  const std::array<std::string_view, 2> rain_names{"rain_mm", "rain_cm"};
  const auto [rain_unit, rain_col] = t.one_of(rain_names, "the rain caught since the previous reading");
  const auto event_col = t.column("event");
  const double level_to_mm = level_unit == 0 ? 1.0 : 10.0;
  const double rain_to_mm = rain_unit == 0 ? 1.0 : 10.0;

  std::vector<PanReading> readings;
  for (const auto& r : t.rows) {
    PanReading p;
    p.source_line = r.line;
    p.time_day = base::days_since(run_start, csv::time(t, r, time_col));
    p.level_mm = csv::number(t, r, level_col) * level_to_mm;
    if (event_col) {
      const std::string& e = r.fields[*event_col];
      if (e.empty() || e == "reading")
        p.kind = PanReadingKind::reading;
      else if (e == "before_refill")
        p.kind = PanReadingKind::before_refill;
      else if (e == "after_refill")
        p.kind = PanReadingKind::after_refill;
      else
        throw base::InputError(
            t.file, r.line, "event",
            fmt::format("'{}' is not an event; expected empty, 'reading', 'before_refill' or 'after_refill'", e));
    }
    const auto rain = csv::optional_number(t, r, rain_col);
    // A row after before_refill is checked as the refill's partner first (pan_intervals_from_readings
    // says what is wrong with it), not for its rain.
    const bool opens_only = readings.empty() || p.kind == PanReadingKind::after_refill ||
                            readings.back().kind == PanReadingKind::before_refill;
    if (!rain && !opens_only)
      throw base::InputError(t.file, r.line, t.header[rain_col],
                             "empty rain; expected the rain caught since the previous reading (0 when none fell)");
    p.rain_since_previous_mm = rain.value_or(0.0) * rain_to_mm;
    readings.push_back(p);
  }
  return readings;
}

DatedTable read_dated_table_csv(const std::filesystem::path& file, std::string quantity,
                                std::span<const ValueColumn> accepted, base::TimePoint run_start) {
  const csv::Table t = csv::read(file);
  const std::size_t date_col = t.required_column("date", fmt::format("the date of each {} entry", quantity));
  std::vector<std::string_view> names;
  for (const auto& a : accepted) names.push_back(a.name);
  const auto [which, value_col] = t.one_of(names, quantity);
  DatedTable table;
  table.quantity = std::move(quantity);
  for (const auto& r : t.rows) {
    const double day = base::days_since(run_start, csv::time(t, r, date_col));
    if (!table.days.empty() && !(day > table.days.back()))
      throw base::InputError(t.file, r.line, "date", "date is not after the previous entry; expected increasing dates");
    table.days.push_back(day);
    table.values.push_back(csv::number(t, r, value_col) * accepted[which].to_table_unit);
  }
  if (table.days.empty()) throw base::InputError(t.file, t.header_line, "", "no entries; expected at least one row");
  return table;
}

}  // namespace wetfront::forcing
