// CSV readers for laboratory data; the column layout is described in lab_csv.hpp.
#include "wetfront/soils/lab_csv.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <map>
#include <optional>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "wetfront/base/csv_table.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"

namespace wetfront::soils {

namespace {

// Every lab-file problem is an input error at a line and column of the file.
base::InputError lab_error(const std::string& source, int line, std::string column, const std::string& problem) {
  return base::InputError(source, static_cast<std::size_t>(std::max(line, 0)), std::move(column), problem);
}

struct ColumnSpec {
  std::string name;
  bool required;
  std::string unit_hint;  // for "expected a number in ..." messages
};

// A parsed table: the header's column positions and the data rows with their line numbers.
class Table {
 public:
  Table(std::istream& in, std::string source, const std::vector<ColumnSpec>& accepted) : source_(std::move(source)) {
    const base::CsvTable csv = base::CsvTable::parse(in, source_);
    for (std::size_t c = 0; c < csv.column_count(); ++c) header_.push_back(csv.column(c).header);
    header_line_ = static_cast<int>(csv.header_line());
    check_header(accepted);
    for (std::size_t r = 0; r < csv.row_count(); ++r) {
      Row row{static_cast<int>(csv.line_of(r)), {}};
      for (std::size_t c = 0; c < csv.column_count(); ++c) row.fields.push_back(csv.text(r, c));
      rows_.push_back(std::move(row));
    }
    if (rows_.empty()) throw lab_error(source_, header_line_, "", "the header is not followed by any data rows");
  }

  bool has(std::string_view column) const { return std::find(header_.begin(), header_.end(), column) != header_.end(); }
  const std::string& source() const { return source_; }

  struct Row {
    int line;
    std::vector<std::string> fields;
  };
  const std::vector<Row>& rows() const { return rows_; }

  std::string text(const Row& row, std::string_view column) const { return row.fields[index(column)]; }

  double number(const Row& row, std::string_view column, std::string_view unit) const {
    const std::string& s = row.fields[index(column)];
    const auto value = base::to_number(s);
    if (!value)
      throw lab_error(source_, row.line, std::string(column),
                      fmt::format("expected a number in {}, got '{}'", unit, s));
    return *value;
  }

 private:
  void check_header(const std::vector<ColumnSpec>& accepted) {
    const int line_number = header_line_;
    std::vector<std::string> names;
    for (const auto& a : accepted) names.push_back(a.name);
    for (std::size_t i = 0; i < header_.size(); ++i) {
      const auto& h = header_[i];
      if (std::find(names.begin(), names.end(), h) == names.end())
        throw lab_error(source_, line_number, h,
                        fmt::format("is not a known column; accepted columns are: {}", fmt::join(names, ", ")));
    }
    for (const auto& a : accepted)
      if (a.required && !has(a.name))
        throw lab_error(source_, line_number, a.name,
                        fmt::format("is missing from the header (expected {})", a.unit_hint));
  }

  std::size_t index(std::string_view column) const {
    return static_cast<std::size_t>(std::find(header_.begin(), header_.end(), column) - header_.begin());
  }

  std::string source_;
  std::vector<std::string> header_;
  int header_line_ = 0;
  std::vector<Row> rows_;
};

// `parse` (one of the parse_*_csv functions) on the contents of `file`, which it names in errors.
template <class Parse>
auto parse_file(const std::filesystem::path& file, Parse parse) {
  std::error_code error;
  if (std::filesystem::is_directory(file, error))
    throw base::InputError(file.string(), 0, "", "is a folder, not a CSV file; give the name of a file");
  std::ifstream in(file);
  if (!in) throw base::InputError(file.string(), 0, "", "cannot open the file for reading");
  return parse(in, file.string());
}

// Suction in cm from whichever of suction_cm / suction_kPa the table has (exactly one).
struct SuctionColumn {
  std::string name;
  double to_cm;
  std::string unit;
};
SuctionColumn suction_column(const Table& t, int first_line) {
  const bool cm = t.has("suction_cm"), kpa = t.has("suction_kPa");
  if (cm && kpa)
    throw lab_error(t.source(), first_line, "suction_kPa", "give suction either in cm or in kPa, not both");
  if (!cm && !kpa)
    throw lab_error(t.source(), first_line, "suction_cm",
                    "is missing from the header (give suction_cm, or suction_kPa)");
  return cm ? SuctionColumn{"suction_cm", 1.0, "cm of water"}
            : SuctionColumn{"suction_kPa", base::kCentimetresOfWaterPerKilopascal, "kPa"};
}

double suction_cm(const Table& t, const Table::Row& row, const SuctionColumn& c) {
  const double v = t.number(row, c.name, c.unit);
  if (v < 0.0)
    throw lab_error(
        t.source(), row.line, c.name,
        fmt::format("suction {} must be >= 0 (suction is the positive value of a negative pressure head)", v));
  return v * c.to_cm;
}

const std::vector<ColumnSpec> kRetentionColumns{{"suction_cm", false, "suction in cm of water"},
                                                {"suction_kPa", false, "suction in kPa"},
                                                {"water_content", true, "volumetric water content, cm3/cm3"},
                                                {"sample", false, "sample label"},
                                                {"note", false, "free text"}};
const std::vector<ColumnSpec> kCoreColumns{{"sample", true, "sample label"},
                                           {"ring_volume_cm3", true, "ring volume in cm3"},
                                           {"tare_mass_g", true, "empty ring mass in g"},
                                           {"wet_mass_g", true, "ring plus moist soil in g"},
                                           {"oven_dry_mass_g", true, "ring plus oven-dry soil in g"},
                                           {"note", false, "free text"}};
const std::vector<ColumnSpec> kStepColumns{{"sample", true, "sample label"},
                                           {"suction_cm", false, "suction in cm of water"},
                                           {"suction_kPa", false, "suction in kPa"},
                                           {"wet_mass_g", true, "ring plus moist soil in g at equilibrium"},
                                           {"note", false, "free text"}};

template <class Series>
Series& series_for(std::vector<Series>& all, const std::string& sample) {
  for (auto& s : all)
    if (s.sample == sample) return s;
  all.push_back(Series{});
  all.back().sample = sample;
  return all.back();
}

}  // namespace

std::vector<RetentionSeries> parse_retention_csv(std::istream& in, std::string_view source_name) {
  const Table t(in, std::string(source_name), kRetentionColumns);
  const auto suction = suction_column(t, t.rows().front().line);
  const bool has_sample = t.has("sample");
  std::vector<RetentionSeries> out;
  for (const auto& row : t.rows()) {
    const double s = suction_cm(t, row, suction);
    const double theta = t.number(row, "water_content", "cm3/cm3");
    if (!(theta > 0.0 && theta < 1.0))
      throw lab_error(t.source(), row.line, "water_content",
                      fmt::format("{} is outside (0, 1); give a volume fraction (cm3/cm3), not percent", theta));
    auto& series = series_for(out, has_sample ? t.text(row, "sample") : std::string());
    series.points.push_back({s, theta});
    series.lines.push_back(row.line);
  }
  return out;
}

std::vector<RetentionSeries> read_retention_csv(const std::filesystem::path& file) {
  return parse_file(file, parse_retention_csv);
}

std::vector<CoreSample> parse_core_samples_csv(std::istream& in, std::string_view source_name) {
  const Table t(in, std::string(source_name), kCoreColumns);
  std::vector<CoreSample> out;
  std::map<std::string, int> first_line;
  for (const auto& row : t.rows()) {
    CoreSample c;
    c.name = t.text(row, "sample");
    if (c.name.empty()) throw lab_error(t.source(), row.line, "sample", "the sample label is empty");
    if (const auto [it, fresh] = first_line.emplace(c.name, row.line); !fresh)
      throw lab_error(t.source(), row.line, "sample",
                      fmt::format("sample '{}' already appears on line {}", c.name, it->second));
    c.ring_volume_cm3 = t.number(row, "ring_volume_cm3", "cm3");
    c.tare_mass_g = t.number(row, "tare_mass_g", "g");
    c.wet_mass_g = t.number(row, "wet_mass_g", "g");
    c.oven_dry_mass_g = t.number(row, "oven_dry_mass_g", "g");
    try {
      (void)core_properties(c);
    } catch (const base::InputError& e) {
      throw lab_error(t.source(), row.line, "", e.what());
    }
    out.push_back(std::move(c));
  }
  return out;
}

std::vector<CoreSample> read_core_samples_csv(const std::filesystem::path& file) {
  return parse_file(file, parse_core_samples_csv);
}

std::vector<SuctionStepSeries> parse_suction_steps_csv(std::istream& in, std::string_view source_name) {
  const Table t(in, std::string(source_name), kStepColumns);
  const auto suction = suction_column(t, t.rows().front().line);
  std::vector<SuctionStepSeries> out;
  for (const auto& row : t.rows()) {
    const std::string sample = t.text(row, "sample");
    if (sample.empty()) throw lab_error(t.source(), row.line, "sample", "the sample label is empty");
    auto& series = series_for(out, sample);
    series.steps.push_back({suction_cm(t, row, suction), t.number(row, "wet_mass_g", "g")});
    series.lines.push_back(row.line);
  }
  return out;
}

std::vector<SuctionStepSeries> read_suction_steps_csv(const std::filesystem::path& file) {
  return parse_file(file, parse_suction_steps_csv);
}

std::vector<RetentionSeries> retention_from_cores(const std::vector<CoreSample>& cores,
                                                  const std::vector<SuctionStepSeries>& steps) {
  std::vector<RetentionSeries> out;
  for (const auto& s : steps) {
    const auto core = std::find_if(cores.begin(), cores.end(), [&](const CoreSample& c) { return c.name == s.sample; });
    if (core == cores.end())
      throw base::InputError(
          fmt::format("suction steps are given for sample '{}' but no core sample has that name", s.sample));
    out.push_back({s.sample, retention_points_from_core(*core, s.steps), s.lines});
  }
  return out;
}

}  // namespace wetfront::soils
