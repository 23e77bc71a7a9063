// The profiles of a run file, written as the run goes (chunked datasets along the unlimited
// `time` dimension at the root), and write_run on top of it.
#include "wetfront/profiles/run_file_stream.hpp"

#include <fmt/format.h>

#include <optional>
#include <stdexcept>

#include "cf_variables.hpp"
#include "hdf5_io.hpp"
#include "layout.hpp"
#include "run_file_parts.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/time_axis.hpp"

namespace wetfront::profiles {

namespace h5 = hdf5;

namespace {

h5::File create_disk_file(const std::filesystem::path& path) {
  h5::PropertyList fcpl(H5Pcreate(H5P_FILE_CREATE), "file creation property list");
  h5::check(H5Pset_link_creation_order(fcpl.id(), H5P_CRT_ORDER_TRACKED | H5P_CRT_ORDER_INDEXED),
            "setting link creation order");
  h5::check(H5Pset_attr_creation_order(fcpl.id(), H5P_CRT_ORDER_TRACKED | H5P_CRT_ORDER_INDEXED),
            "setting attribute creation order");
  h5::PropertyList fapl(H5Pcreate(H5P_FILE_ACCESS), "file access property list");
  h5::check(H5Pset_fclose_degree(fapl.id(), H5F_CLOSE_SEMI), "setting the file close degree");
  return h5::File(H5Fcreate(path.c_str(), H5F_ACC_EXCL, fcpl.id(), fapl.id()),
                  fmt::format("creating '{}'", path.string()));
}

RunFileError write_failure(const std::filesystem::path& path, std::string_view cause) {
  return RunFileError(fmt::format("cannot write run record '{}': {}", path.string(), cause));
}

}  // namespace

// The profile datasets at the root, in the order write_run has always written them: the time
// axis, the depth axes, the four cell fields, the face flux and the pond.
struct RunFileStream::OpenFile {
  OpenFile(const std::filesystem::path& temporary, const std::string& time_units, std::span<const double> cells,
           std::span<const double> faces)
      : file(create_disk_file(temporary)),
        time(file.id(), "time", 0, {time_units, "output time"}),
        cell_depth(
            cf::write_depth_axis(file.id(), "cell_depth", {cells.begin(), cells.end()}, "depth of the cell centre")),
        face_depth(cf::write_depth_axis(file.id(), "face_depth", {faces.begin(), faces.end()},
                                        "depth of the cell face (surface first)")) {
    cf::make_time_axis(time.dataset());
    for (const layout::ProfileField& field : layout::kCellFields) {
      cell_fields.emplace_back(file.id(), field.name, cells.size(), h5::Description{field.units, field.long_name});
      h5::attach_dimension_scale(cell_fields.back().dataset(), time.dataset(), 0);
      h5::attach_dimension_scale(cell_fields.back().dataset(), cell_depth, 1);
    }
    face_flux.emplace(file.id(), "face_flux", faces.size(),
                      h5::Description{"cm/d", "Darcy flux across the cell face (positive downward)"});
    h5::attach_dimension_scale(face_flux->dataset(), time.dataset(), 0);
    h5::attach_dimension_scale(face_flux->dataset(), face_depth, 1);
    ponded.emplace(file.id(), "ponded_depth", 0, h5::Description{"cm", "water held on the soil surface"});
    h5::attach_dimension_scale(ponded->dataset(), time.dataset(), 0);
  }

  void append(const solver::ProfileSnapshot& snapshot) {
    time.append({&snapshot.time_days, 1});
    for (std::size_t k = 0; k < cell_fields.size(); ++k) cell_fields[k].append(snapshot.*layout::kCellFields[k].member);
    face_flux->append(snapshot.face_flux_cm_per_d);
    ponded->append({&snapshot.ponded_depth_cm, 1});
  }

  void flush() {
    time.flush();
    for (h5::GrowingDataset& field : cell_fields) field.flush();
    face_flux->flush();
    ponded->flush();
  }

  h5::File file;
  h5::GrowingDataset time;
  h5::Dataset cell_depth, face_depth;
  std::vector<h5::GrowingDataset> cell_fields;
  std::optional<h5::GrowingDataset> face_flux, ponded;
};

RunFileStream::RunFileStream(const std::filesystem::path& path, const std::string& run_start_date,
                             std::span<const double> cell_depths_cm, std::span<const double> face_depths_cm)
    : path_(path), staged_(path), cells_(cell_depths_cm.size()) {
  if (path.filename().empty()) throw write_failure(path, "the path names no file");
  if (face_depths_cm.size() != cells_ + 1)
    throw write_failure(path, fmt::format("{} cells but {} faces", cells_, face_depths_cm.size()));
  h5::QuietErrors quiet;
  try {
    file_ = std::make_unique<OpenFile>(staged_.temporary(), days_since_units(run_start_date), cell_depths_cm,
                                       face_depths_cm);
  } catch (const std::exception& error) {
    file_.reset();
    throw write_failure(path, error.what());
  }
  write_step("temporary run file begun");
}

RunFileStream::~RunFileStream() {
  h5::QuietErrors quiet;
  file_.reset();  // closed before StagedFile removes the uncommitted temporary file
}

void RunFileStream::append(const solver::ProfileSnapshot& snapshot) {
  if (!file_) throw write_failure(path_, "the run file is already finished");
  const auto require_size = [&](const std::vector<double>& values, std::size_t expected, std::string_view field) {
    if (values.size() != expected)
      throw write_failure(path_, fmt::format("profile {} (day {}): {} has {} values, expected {}", appended_,
                                             snapshot.time_days, field, values.size(), expected));
  };
  for (const layout::ProfileField& field : layout::kCellFields)
    require_size(snapshot.*field.member, cells_, field.name);
  require_size(snapshot.face_flux_cm_per_d, cells_ + 1, "face_flux");
  if (appended_ > 0 && !(snapshot.time_days > last_time_days_))
    throw write_failure(path_, fmt::format("profile {} at day {} does not follow day {}", appended_, snapshot.time_days,
                                           last_time_days_));
  h5::QuietErrors quiet;
  try {
    file_->append(snapshot);
  } catch (const std::exception& error) {
    throw write_failure(path_, error.what());
  }
  ++appended_;
  last_time_days_ = snapshot.time_days;
}

void RunFileStream::finish(const RunRecord& record) {
  if (!file_) throw write_failure(path_, "the run file is already finished");
  const std::vector<solver::CumulativeBalance>& balances = record.run.balances;
  try {
    check_record(record);
    if (record.run.cell_depths_cm.size() != cells_)
      throw std::invalid_argument(
          fmt::format("the record has {} cells, the profiles written {}", record.run.cell_depths_cm.size(), cells_));
    if (balances.size() != appended_ || (appended_ > 0 && balances.back().time_days != last_time_days_))
      throw std::invalid_argument(fmt::format("{} balance rows for {} profiles written", balances.size(), appended_));
  } catch (const std::invalid_argument& error) {
    throw write_failure(path_, error.what());
  }
  h5::QuietErrors quiet;
  try {
    file_->flush();
    write_record_parts(file_->file.id(), record);
    h5::File file = std::move(file_->file);
    file_.reset();  // the datasets close first: the file's close degree allows no open objects
    file.close("closing the run file");
    staged_.written();
  } catch (const std::exception& error) {
    file_.reset();
    throw write_failure(path_, error.what());
  }
}

void RunFileStream::commit() {
  try {
    staged_.commit();
  } catch (const std::exception& error) {
    throw write_failure(path_, error.what());
  }
}

void write_run(const std::filesystem::path& path, const RunRecord& record) {
  try {
    check_record(record);
  } catch (const std::invalid_argument& error) {
    throw write_failure(path, error.what());
  }
  RunFileStream stream(path, record.run_start_date, record.run.cell_depths_cm, record.run.face_depths_cm);
  for (const solver::ProfileSnapshot& snapshot : record.run.profiles) stream.append(snapshot);
  stream.finish(record);
  stream.commit();
}

}  // namespace wetfront::profiles
