// Writes a StudyRecord as HDF5 (layout in docs/hdf5-layout.md, "Parameter study files").
#include <fmt/format.h>

#include <map>

#include "hdf5_io.hpp"
#include "layout.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/study_file.hpp"
#include "wetfront/profiles/time_axis.hpp"

namespace wetfront::profiles {
namespace {

namespace h5 = hdf5;

// CF standard name and calendar on a column of times (units "days since ...").
void set_time_attributes(hid_t group, const StudyColumn& column) {
  if (column.units.rfind("days since ", 0) != 0) return;
  h5::set_text_attribute(group, column.name, "standard_name", "time");
  h5::set_text_attribute(group, column.name, "calendar", "standard");
}

h5::Dataset write_axis(hid_t group, const StudyColumn& axis) {
  h5::Dataset dataset = h5::write_vector(group, axis.name, axis.values, {axis.units, axis.long_name});
  set_time_attributes(group, axis);
  h5::make_coordinate(dataset);
  return dataset;
}

void write_table(hid_t file, const StudyTable& table, const std::string& time_units) {
  h5::Group group = h5::create_group(file, table.group);
  StudyColumn axis = table.axis;
  if (axis.units == "days since run start") axis.units = time_units;
  const h5::Dataset axis_dataset = write_axis(group.id(), axis);
  for (const StudyColumn& column : table.columns) {
    if (column.values.size() != axis.values.size())
      throw std::invalid_argument(fmt::format("{}/{} has {} values for {} rows", table.group, column.name,
                                              column.values.size(), axis.values.size()));
    const std::string& units = column.units == "days since run start" ? time_units : column.units;
    const h5::Dataset dataset = h5::write_vector(group.id(), column.name, column.values, {units, column.long_name});
    h5::attach_dimension_scale(dataset, axis_dataset, 0);
  }
  for (const StudyTextColumn& column : table.texts) {
    const h5::Dataset dataset = h5::write_texts(group.id(), column.name, column.values, {"", column.long_name});
    h5::attach_dimension_scale(dataset, axis_dataset, 0);
  }
  std::map<std::string, h5::Dataset> column_axes;
  for (const StudyMatrix& matrix : table.matrices) {
    StudyColumn second = matrix.column_axis;
    if (second.units == "days since run start") second.units = time_units;
    if (matrix.values.size() != axis.values.size() * second.values.size())
      throw std::invalid_argument(fmt::format("{}/{} has {} values for {} x {}", table.group, matrix.name,
                                              matrix.values.size(), axis.values.size(), second.values.size()));
    // A square matrix over the table's own axis (a covariance) uses that axis twice.
    if (second.name != axis.name && !column_axes.count(second.name))
      column_axes.emplace(second.name, write_axis(group.id(), second));
    const h5::Dataset& second_dataset = second.name == axis.name ? axis_dataset : column_axes.at(second.name);
    const h5::Dataset dataset = h5::write_matrix(group.id(), matrix.name, axis.values.size(), second.values.size(),
                                                 matrix.values, {matrix.units, matrix.long_name});
    h5::attach_dimension_scale(dataset, axis_dataset, 0);
    h5::attach_dimension_scale(dataset, second_dataset, 1);
  }
}

// Pressure head and water content of one run against its own time and depth axes.
void write_study_run(hid_t runs, const StudyRun& study_run, const std::string& time_units) {
  h5::Group group = h5::create_group(runs, study_run.name);
  h5::set_text_attribute(group.id(), ".", "description", study_run.description);
  for (const auto& [name, value] : study_run.values) h5::set_double_attribute(group.id(), ".", name, value);
  const solver::ColumnRun& run = study_run.run;
  std::vector<double> times;
  for (const auto& snapshot : run.profiles) times.push_back(snapshot.time_days);
  const h5::Dataset time = h5::write_vector(group.id(), "time", times, {time_units, "output time"});
  h5::set_text_attribute(group.id(), "time", "standard_name", "time");
  h5::set_text_attribute(group.id(), "time", "calendar", "standard");
  h5::set_text_attribute(group.id(), "time", "axis", "T");
  h5::make_coordinate(time);
  const h5::Dataset depth = h5::write_vector(group.id(), "cell_depth", run.cell_depths_cm,
                                             {"cm", "depth of the cell centre below the soil surface"});
  h5::set_text_attribute(group.id(), "cell_depth", "standard_name", "depth");
  h5::set_text_attribute(group.id(), "cell_depth", "positive", "down");
  h5::set_text_attribute(group.id(), "cell_depth", "axis", "Z");
  h5::make_coordinate(depth);
  const auto matrix_of = [&](auto member) {
    std::vector<double> values;
    for (const auto& snapshot : run.profiles)
      values.insert(values.end(), (snapshot.*member).begin(), (snapshot.*member).end());
    return values;
  };
  const h5::Dataset head =
      h5::write_matrix(group.id(), "pressure_head", times.size(), run.cell_depths_cm.size(),
                       matrix_of(&solver::ProfileSnapshot::head_cm), {"cm", "pressure head (cm of water)"});
  const h5::Dataset content =
      h5::write_matrix(group.id(), "water_content", times.size(), run.cell_depths_cm.size(),
                       matrix_of(&solver::ProfileSnapshot::water_content), {"cm3/cm3", "volumetric water content"});
  for (const h5::Dataset* dataset : {&head, &content}) {
    h5::attach_dimension_scale(*dataset, time, 0);
    h5::attach_dimension_scale(*dataset, depth, 1);
  }
}

void write_contents(hid_t file, const StudyRecord& record) {
  h5::set_text_attribute(file, ".", "Conventions", kConventions);
  h5::set_text_attribute(file, ".", "title", fmt::format("wetfront {} of {}", record.study_kind, record.site_name));
  h5::set_text_attribute(file, ".", "source", fmt::format("wetfront {}", record.program_version));
  h5::set_identity_attributes(file, {kStudyFormat, kStudyFormatVersion, record.program_version, record.site_name,
                                     record.run_start_date, record.input_hash, record.run_id});
  h5::set_text_attribute(file, ".", "study_kind", record.study_kind);
  h5::set_text_attribute(file, ".", "sign_convention", layout::kSignConvention);
  for (const auto& [name, text] : record.notes) h5::set_text_attribute(file, ".", name, text);
  const std::string time_units = days_since_units(record.run_start_date);
  for (const StudyTable& table : record.tables) write_table(file, table, time_units);
  if (!record.runs.empty()) {
    h5::Group runs = h5::create_group(file, "runs");
    for (const StudyRun& run : record.runs) write_study_run(runs.id(), run, time_units);
  }
  h5::number_dimensions(file);
}

}  // namespace

void write_study(const std::filesystem::path& path, const StudyRecord& record) {
  h5::write_file(
      path, "parameter study file", [] {}, [&](hid_t file) { write_contents(file, record); });
}

}  // namespace wetfront::profiles
