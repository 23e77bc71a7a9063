// Dataset and attribute helpers on top of the RAII handles: the few shapes a run record
// needs (1-D and 2-D doubles, 1-D text, integer scalars, text and number attributes,
// dimension scales). Names passed in are relative to the parent; messages name the object.
#pragma once

#include <cstdint>
#include <filesystem>
#include <functional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "wetfront/profiles/hdf5_handles.hpp"

namespace wetfront::profiles::hdf5 {

// Files and groups keep link and attribute creation order, so listings follow the order in
// which things were written.
// A file that lives in memory only (core driver without a backing store); `name` is used
// in messages. Its bytes come out with file_image().
File create_memory_file(const std::string& name);
// The complete bytes of an open file, as they would be on disk (flushes first).
std::vector<char> file_image(const File& file);
// A whole file built in memory by `write` (given the file's id), with HDF5's own error printing
// turned off; its bytes, ready to be saved. Throws Error (or what `write` throws).
std::vector<char> build_in_memory(const std::string& name, const std::function<void(hid_t)>& write);
// Writes a wetfront file: `check` the record (std::invalid_argument when it is inconsistent),
// build the file in memory with `write`, then save it under `path` (file_save.hpp: a temporary
// name renamed when complete). Every failure throws RunFileError "cannot write <what> '<path>':
// <cause>".
void write_file(const std::filesystem::path& path, std::string_view what, const std::function<void()>& check,
                const std::function<void(hid_t)>& write);
File open_file_read_only(const std::string& path);
Group create_group(hid_t parent, std::string_view name);
Group open_group(hid_t parent, std::string_view name);
bool has_link(hid_t parent, std::string_view name);

// Every dataset is written with its `long_name` attribute and, unless `units` is empty (text),
// its `units` attribute (UDUNITS-2 text; "1" for a dimensionless number).
struct Description {
  std::string_view units;
  std::string_view long_name;
};

// Values per chunk of a dataset stored in chunks of whole rows (128 KiB of doubles).
inline constexpr hsize_t kChunkValues = 16384;

// A dataset of `file_type` and `space` with its attributes in creation order; `chunk` (rows, and
// columns for two dimensions) empty for contiguous storage. Chunked two-dimensional data is
// shuffled and deflated when the library has zlib.
Dataset create_dataset(hid_t parent, std::string_view name, hid_t file_type, const Dataspace& space,
                       std::span<const hsize_t> chunk = {});
// Sets `units` (unless empty) and `long_name` on the dataset `name` in `parent`.
void describe(hid_t parent, std::string_view name, Description about);

Dataset write_vector(hid_t parent, std::string_view name, std::span<const double> values, Description about);
// Row-major rows x columns.
Dataset write_matrix(hid_t parent, std::string_view name, std::size_t rows, std::size_t columns,
                     std::span<const double> values, Description about);
Dataset write_integers(hid_t parent, std::string_view name, std::span<const std::int64_t> values, Description about);
Dataset write_integer_scalar(hid_t parent, std::string_view name, std::int64_t value, Description about);
Dataset write_texts(hid_t parent, std::string_view name, const std::vector<std::string>& values, Description about);

Dataset write_double_scalar(hid_t parent, std::string_view name, double value, Description about);
Dataset write_text_scalar(hid_t parent, std::string_view name, const std::string& value, std::string_view long_name);

// A dataset of doubles that grows along its first dimension, which is unlimited (netCDF's
// unlimited dimension): rows of `columns` values, or single values when `columns` is 0. Rows are
// held until a chunk is full and then written as one block, so memory stays at one chunk.
class GrowingDataset {
 public:
  GrowingDataset(hid_t parent, std::string_view name, std::size_t columns, Description about);
  // `columns` values (one when columns is 0).
  void append(std::span<const double> row);
  // Writes the rows held (called before the file is closed).
  void flush();
  const Dataset& dataset() const { return dataset_; }

 private:
  Dataset dataset_;
  std::size_t width_;
  hsize_t chunk_rows_;
  hsize_t written_ = 0;
  std::vector<double> held_;
};

// The netCDF-4 data model on HDF5 (docs/hdf5-layout.md, "netCDF-4 and CF"): a dimension is a
// dimension scale; a coordinate variable is a one-dimensional scale whose NAME is its own dataset
// name; a dimension without values is a scale named by netCDF's fixed phrase and its length.
// A dataset may only attach to a scale in its own group or an ancestor group.
// make_coordinate: `scale` (one-dimensional) becomes the coordinate variable of the dimension
// that carries its dataset name.
void make_coordinate(const Dataset& scale);
// A dimension `name` of `length` without values (netCDF's "dimension but not a variable").
Dataset make_named_dimension(hid_t parent, std::string_view name, std::size_t length);
// H5DSattach_scale to dimension `dimension` of `dataset`; throws unless the scale is in the
// dataset's group or an ancestor group.
void attach_dimension_scale(const Dataset& dataset, const Dataset& scale, unsigned dimension);
// Gives every dimension scale of the file its `_Netcdf4Dimid`, counting in the order the
// netCDF-C library meets them (a group's own datasets in creation order, then its groups).
// Called once, after everything is written.
void number_dimensions(hid_t file);

// Attributes on the object `object_name` relative to `location` ("." for the location itself).
void set_text_attribute(hid_t location, std::string_view object_name, std::string_view name, std::string_view value);
void set_double_attribute(hid_t location, std::string_view object_name, std::string_view name, double value);
void set_int_attribute(hid_t location, std::string_view object_name, std::string_view name, int value);
bool has_attribute(hid_t location, std::string_view object_name, std::string_view name);
// Reads fixed-length and variable-length text attributes alike.
std::string get_text_attribute(hid_t location, std::string_view object_name, std::string_view name);
double get_double_attribute(hid_t location, std::string_view object_name, std::string_view name);
int get_int_attribute(hid_t location, std::string_view object_name, std::string_view name);

// Reads a dataset of any numeric type as doubles; `dims` receives the shape. Throws unless
// the rank equals expected_rank.
std::vector<double> read_doubles(hid_t parent, std::string_view name, int expected_rank,
                                 std::vector<std::size_t>& dims);
std::vector<std::int64_t> read_integers(hid_t parent, std::string_view name, int expected_rank,
                                        std::vector<std::size_t>& dims);
std::vector<std::string> read_texts(hid_t parent, std::string_view name);
// A dataset of rank 0 (one value).
std::string read_text_scalar(hid_t parent, std::string_view name);
double read_double_scalar(hid_t parent, std::string_view name);

// A one-dimensional dataset that must hold exactly `length` entries; throws Error otherwise.
std::vector<double> read_doubles_of_length(hid_t parent, std::string_view name, std::size_t length);
std::vector<std::string> read_texts_of_length(hid_t parent, std::string_view name, std::size_t length);

// What a wetfront file is and where it came from, as attributes of `file`: record_format,
// record_format_version, program_version, site_name, run_start_date, input_hash, and run_id
// when it is not empty (the identity every file of one run's output set carries).
struct FileIdentity {
  std::string_view format;
  int version = 0;
  std::string_view program_version, site_name, run_start_date, input_hash;
  std::string_view run_id = {};
};
void set_identity_attributes(hid_t file, const FileIdentity& identity);

// Full HDF5 path of an object, for messages.
std::string object_path(hid_t object);
// Full HDF5 path of `name` in the group `parent`.
std::string child_path(hid_t parent, std::string_view name);

}  // namespace wetfront::profiles::hdf5
