#include "hdf5_io.hpp"

#include <H5DSpublic.h>
#include <H5LTpublic.h>
#include <fmt/format.h>

#include "wetfront/profiles/file_save.hpp"
#include "wetfront/profiles/run_file.hpp"

#include <algorithm>
#include <cstring>

namespace wetfront::profiles::hdf5 {

namespace {

std::string attribute_path(hid_t location, std::string_view object_name, std::string_view name) {
  const std::string object = object_name == "." ? object_path(location) : child_path(location, object_name);
  return fmt::format("attribute '{}' of {}", name, object);
}

PropertyList new_property_list(hid_t property_class, std::string_view what) {
  return PropertyList(H5Pcreate(property_class), what);
}

PropertyList ordered_dataset_properties() {
  PropertyList dcpl = new_property_list(H5P_DATASET_CREATE, "dataset creation property list");
  check(H5Pset_attr_creation_order(dcpl.id(), H5P_CRT_ORDER_TRACKED | H5P_CRT_ORDER_INDEXED),
        "setting attribute creation order");
  return dcpl;
}

Dataspace simple_space(std::span<const hsize_t> dims) {
  if (dims.empty()) return Dataspace(H5Screate(H5S_SCALAR), "creating a scalar dataspace");
  return Dataspace(H5Screate_simple(static_cast<int>(dims.size()), dims.data(), nullptr), "creating a dataspace");
}

Datatype variable_length_text_type() {
  Datatype type(H5Tcopy(H5T_C_S1), "copying the string datatype");
  check(H5Tset_size(type.id(), H5T_VARIABLE), "making a variable-length string type");
  check(H5Tset_cset(type.id(), H5T_CSET_UTF8), "setting UTF-8 on a string type");
  return type;
}

Dataset open_dataset(hid_t parent, std::string_view name) {
  const std::string path = child_path(parent, name);
  if (H5Lexists(parent, std::string(name).c_str(), H5P_DEFAULT) <= 0)
    throw Error(fmt::format("missing dataset {}", path));
  return Dataset(H5Dopen2(parent, std::string(name).c_str(), H5P_DEFAULT), fmt::format("opening dataset {}", path));
}

// Shape of a dataset, after checking its rank.
std::vector<std::size_t> checked_shape(const Dataset& dataset, int expected_rank) {
  const std::string path = object_path(dataset.id());
  Dataspace space(H5Dget_space(dataset.id()), fmt::format("reading the shape of {}", path));
  const int rank = H5Sget_simple_extent_ndims(space.id());
  check(rank, fmt::format("reading the rank of {}", path));
  if (rank != expected_rank)
    throw Error(fmt::format("dataset {} has {} dimension(s), expected {}", path, rank, expected_rank));
  std::vector<hsize_t> dims(static_cast<std::size_t>(rank));
  if (rank > 0) check(H5Sget_simple_extent_dims(space.id(), dims.data(), nullptr), "reading dimensions");
  return {dims.begin(), dims.end()};
}

void require_numeric(hid_t type, const std::string& what) {
  const H5T_class_t type_class = H5Tget_class(type);
  if (type_class != H5T_FLOAT && type_class != H5T_INTEGER) throw Error(fmt::format("{} is not numeric", what));
}

std::size_t element_count(const std::vector<std::size_t>& dims) {
  std::size_t count = 1;
  for (std::size_t d : dims) count *= d;
  return count;
}

Attribute open_attribute(hid_t location, std::string_view object_name, std::string_view name) {
  const std::string what = attribute_path(location, object_name, name);
  if (!has_attribute(location, object_name, name)) throw Error(fmt::format("missing {}", what));
  return Attribute(
      H5Aopen_by_name(location, std::string(object_name).c_str(), std::string(name).c_str(), H5P_DEFAULT, H5P_DEFAULT),
      fmt::format("opening {}", what));
}

void require_single_value(const Attribute& attribute, const std::string& what) {
  Dataspace space(H5Aget_space(attribute.id()), fmt::format("reading the shape of {}", what));
  if (H5Sget_simple_extent_npoints(space.id()) != 1) throw Error(fmt::format("{} is not a single value", what));
}

}  // namespace

Dataset create_dataset(hid_t parent, std::string_view name, hid_t file_type, const Dataspace& space,
                       std::span<const hsize_t> chunk) {
  PropertyList dcpl = ordered_dataset_properties();
  if (!chunk.empty()) {
    check(H5Pset_chunk(dcpl.id(), static_cast<int>(chunk.size()), chunk.data()), "setting the chunk shape");
    if (chunk.size() == 2 && H5Zfilter_avail(H5Z_FILTER_DEFLATE) > 0) {
      check(H5Pset_shuffle(dcpl.id()), "setting the shuffle filter");
      check(H5Pset_deflate(dcpl.id(), 4), "setting the deflate filter");
    }
  }
  const std::string name_text(name);
  return Dataset(H5Dcreate2(parent, name_text.c_str(), file_type, space.id(), H5P_DEFAULT, dcpl.id(), H5P_DEFAULT),
                 fmt::format("creating dataset {}", child_path(parent, name)));
}

void describe(hid_t parent, std::string_view name, Description about) {
  if (!about.units.empty()) set_text_attribute(parent, name, "units", about.units);
  set_text_attribute(parent, name, "long_name", about.long_name);
}

std::string child_path(hid_t parent, std::string_view name) {
  std::string base = object_path(parent);
  if (base.empty() || base.back() != '/') base += '/';
  return base + std::string(name);
}

std::string object_path(hid_t object) {
  const ssize_t length = H5Iget_name(object, nullptr, 0);
  if (length <= 0) return "?";
  std::string name(static_cast<std::size_t>(length) + 1, '\0');
  H5Iget_name(object, name.data(), name.size());
  name.resize(static_cast<std::size_t>(length));
  return name;
}

File create_memory_file(const std::string& name) {
  PropertyList fcpl = new_property_list(H5P_FILE_CREATE, "file creation property list");
  check(H5Pset_link_creation_order(fcpl.id(), H5P_CRT_ORDER_TRACKED | H5P_CRT_ORDER_INDEXED),
        "setting link creation order");
  check(H5Pset_attr_creation_order(fcpl.id(), H5P_CRT_ORDER_TRACKED | H5P_CRT_ORDER_INDEXED),
        "setting attribute creation order");
  PropertyList fapl = new_property_list(H5P_FILE_ACCESS, "file access property list");
  check(H5Pset_fclose_degree(fapl.id(), H5F_CLOSE_SEMI), "setting the file close degree");
  // Grows in 1 MiB steps; nothing is written to disk by the library.
  check(H5Pset_fapl_core(fapl.id(), 1 << 20, 0), "selecting the in-memory file driver");
  return File(H5Fcreate(name.c_str(), H5F_ACC_TRUNC, fcpl.id(), fapl.id()),
              fmt::format("creating in-memory file for '{}'", name));
}

std::vector<char> file_image(const File& file) {
  check(H5Fflush(file.id(), H5F_SCOPE_GLOBAL), "flushing the in-memory file");
  const ssize_t size = H5Fget_file_image(file.id(), nullptr, 0);
  check(size < 0 ? -1 : 0, "measuring the file image");
  std::vector<char> image(static_cast<std::size_t>(size));
  check(H5Fget_file_image(file.id(), image.data(), image.size()) < 0 ? -1 : 0, "copying the file image");
  return image;
}

std::vector<char> build_in_memory(const std::string& name, const std::function<void(hid_t)>& write) {
  QuietErrors quiet;
  File file = create_memory_file(name);
  write(file.id());
  std::vector<char> image = file_image(file);
  file.close("closing the in-memory file");
  return image;
}

void write_file(const std::filesystem::path& path, std::string_view what, const std::function<void()>& check,
                const std::function<void(hid_t)>& write) {
  const auto failure = [&](std::string_view cause) {
    return RunFileError(fmt::format("cannot write {} '{}': {}", what, path.string(), cause));
  };
  if (path.filename().empty()) throw failure("the path names no file");
  try {
    check();
  } catch (const std::invalid_argument& error) {
    throw failure(error.what());
  }
  // The file is built in memory, so the HDF5 library never meets a disk error; the bytes
  // then go to a temporary name in the target directory, which is renamed (atomically on
  // POSIX file systems) only when they are all on the disk.
  std::vector<char> image;
  try {
    image = build_in_memory(path.string(), write);
  } catch (const std::exception& error) {
    throw failure(error.what());
  }
  try {
    save_file_image(path, image);
  } catch (const std::exception& error) {
    throw failure(error.what());
  }
}

File open_file_read_only(const std::string& path) {
  PropertyList fapl = new_property_list(H5P_FILE_ACCESS, "file access property list");
  check(H5Pset_fclose_degree(fapl.id(), H5F_CLOSE_SEMI), "setting the file close degree");
  return File(H5Fopen(path.c_str(), H5F_ACC_RDONLY, fapl.id()), fmt::format("opening file '{}'", path));
}

Group create_group(hid_t parent, std::string_view name) {
  PropertyList gcpl = new_property_list(H5P_GROUP_CREATE, "group creation property list");
  check(H5Pset_link_creation_order(gcpl.id(), H5P_CRT_ORDER_TRACKED | H5P_CRT_ORDER_INDEXED),
        "setting link creation order");
  check(H5Pset_attr_creation_order(gcpl.id(), H5P_CRT_ORDER_TRACKED | H5P_CRT_ORDER_INDEXED),
        "setting attribute creation order");
  return Group(H5Gcreate2(parent, std::string(name).c_str(), H5P_DEFAULT, gcpl.id(), H5P_DEFAULT),
               fmt::format("creating group {}", child_path(parent, name)));
}

Group open_group(hid_t parent, std::string_view name) {
  const std::string path = child_path(parent, name);
  if (!has_link(parent, name)) throw Error(fmt::format("missing group {}", path));
  return Group(H5Gopen2(parent, std::string(name).c_str(), H5P_DEFAULT), fmt::format("opening group {}", path));
}

bool has_link(hid_t parent, std::string_view name) {
  const htri_t exists = H5Lexists(parent, std::string(name).c_str(), H5P_DEFAULT);
  check(exists, fmt::format("looking for {}", child_path(parent, name)));
  return exists > 0;
}

namespace {

// A one-dimensional dataset of `file_type` on disk, written from `values` in `memory_type`.
template <class T>
Dataset write_one_dimensional(hid_t parent, std::string_view name, std::span<const T> values, hid_t file_type,
                              hid_t memory_type, const Description& about) {
  const hsize_t dims[1] = {values.size()};
  Dataspace space = simple_space(dims);
  Dataset dataset = create_dataset(parent, name, file_type, space);
  if (!values.empty())
    check(H5Dwrite(dataset.id(), memory_type, H5S_ALL, H5S_ALL, H5P_DEFAULT, values.data()),
          fmt::format("writing dataset {}", child_path(parent, name)));
  describe(parent, name, about);
  return dataset;
}

// A scalar dataset of `file_type` on disk, written from `value` in `memory_type`.
Dataset write_scalar(hid_t parent, std::string_view name, hid_t file_type, hid_t memory_type, const void* value,
                     const Description& about) {
  Dataspace space = simple_space({});
  Dataset dataset = create_dataset(parent, name, file_type, space);
  check(H5Dwrite(dataset.id(), memory_type, H5S_ALL, H5S_ALL, H5P_DEFAULT, value),
        fmt::format("writing dataset {}", child_path(parent, name)));
  describe(parent, name, about);
  return dataset;
}

}  // namespace

Dataset write_vector(hid_t parent, std::string_view name, std::span<const double> values, Description about) {
  return write_one_dimensional(parent, name, values, H5T_IEEE_F64LE, H5T_NATIVE_DOUBLE, about);
}

Dataset write_matrix(hid_t parent, std::string_view name, std::size_t rows, std::size_t columns,
                     std::span<const double> values, Description about) {
  if (values.size() != rows * columns)
    throw Error(fmt::format("dataset {}: {} values for a {} x {} matrix", child_path(parent, name), values.size(), rows,
                            columns));
  const hsize_t dims[2] = {rows, columns};
  Dataspace space = simple_space(dims);
  // Chunks of whole rows (one output time each), about 128 KiB; an empty matrix is not chunked.
  const bool chunked = rows > 0 && columns > 0;
  const hsize_t chunk[2] = {chunked ? std::clamp<hsize_t>(kChunkValues / columns, 1, rows) : 0, columns};
  Dataset dataset =
      create_dataset(parent, name, H5T_IEEE_F64LE, space, std::span<const hsize_t>(chunk, chunked ? 2 : 0));
  if (!values.empty())
    check(H5Dwrite(dataset.id(), H5T_NATIVE_DOUBLE, H5S_ALL, H5S_ALL, H5P_DEFAULT, values.data()),
          fmt::format("writing dataset {}", child_path(parent, name)));
  describe(parent, name, about);
  return dataset;
}

Dataset write_integers(hid_t parent, std::string_view name, std::span<const std::int64_t> values, Description about) {
  return write_one_dimensional(parent, name, values, H5T_STD_I64LE, H5T_NATIVE_INT64, about);
}

Dataset write_integer_scalar(hid_t parent, std::string_view name, std::int64_t value, Description about) {
  return write_scalar(parent, name, H5T_STD_I64LE, H5T_NATIVE_INT64, &value, about);
}

Dataset write_texts(hid_t parent, std::string_view name, const std::vector<std::string>& values, Description about) {
  const hsize_t dims[1] = {values.size()};
  Dataspace space = simple_space(dims);
  Datatype type = variable_length_text_type();
  Dataset dataset = create_dataset(parent, name, type.id(), space);
  if (!values.empty()) {
    std::vector<const char*> pointers;
    pointers.reserve(values.size());
    for (const std::string& value : values) pointers.push_back(value.c_str());
    check(H5Dwrite(dataset.id(), type.id(), H5S_ALL, H5S_ALL, H5P_DEFAULT, pointers.data()),
          fmt::format("writing dataset {}", child_path(parent, name)));
  }
  describe(parent, name, about);
  return dataset;
}

Dataset write_double_scalar(hid_t parent, std::string_view name, double value, Description about) {
  return write_scalar(parent, name, H5T_IEEE_F64LE, H5T_NATIVE_DOUBLE, &value, about);
}

Dataset write_text_scalar(hid_t parent, std::string_view name, const std::string& value, std::string_view long_name) {
  Dataspace space = simple_space({});
  Datatype type = variable_length_text_type();
  Dataset dataset = create_dataset(parent, name, type.id(), space);
  const char* pointer = value.c_str();
  check(H5Dwrite(dataset.id(), type.id(), H5S_ALL, H5S_ALL, H5P_DEFAULT, &pointer),
        fmt::format("writing dataset {}", child_path(parent, name)));
  describe(parent, name, {"", long_name});
  return dataset;
}

namespace {

// The last component of an HDF5 path.
std::string base_name(const std::string& path) {
  const std::size_t slash = path.rfind('/');
  return slash == std::string::npos ? path : path.substr(slash + 1);
}

// The group part of an HDF5 path, ending in '/'.
std::string group_part(const std::string& path) {
  const std::size_t slash = path.rfind('/');
  return slash == std::string::npos ? "/" : path.substr(0, slash + 1);
}

// netCDF-C's name for a dimension that is not a variable (nc4internal.h, DIM_WITHOUT_VARIABLE),
// followed by the length in ten places, as the library writes it.
constexpr std::string_view kDimensionWithoutVariable = "This is a netCDF dimension but not a netCDF variable.";

}  // namespace

void make_coordinate(const Dataset& scale) {
  const std::string path = object_path(scale.id());
  check(H5DSset_scale(scale.id(), base_name(path).c_str()), fmt::format("making {} a dimension scale", path));
}

Dataset make_named_dimension(hid_t parent, std::string_view name, std::size_t length) {
  const hsize_t dims[1] = {length};
  Dataspace space = simple_space(dims);
  Dataset dataset = create_dataset(parent, name, H5T_IEEE_F32BE, space);
  const std::string scale_name = fmt::format("{}{:>10}", kDimensionWithoutVariable, length);
  check(H5DSset_scale(dataset.id(), scale_name.c_str()),
        fmt::format("making {} a dimension", child_path(parent, name)));
  return dataset;
}

void attach_dimension_scale(const Dataset& dataset, const Dataset& scale, unsigned dimension) {
  const std::string dataset_path = object_path(dataset.id());
  const std::string scale_group = group_part(object_path(scale.id()));
  if (dataset_path.compare(0, scale_group.size(), scale_group) != 0)
    throw Error(
        fmt::format("dimension {} is not visible from {} (netCDF-4 allows only scales in the same or an "
                    "ancestor group)",
                    object_path(scale.id()), dataset_path));
  check(H5DSattach_scale(dataset.id(), scale.id(), dimension),
        fmt::format("attaching dimension scale {} to dimension {} of {}", object_path(scale.id()), dimension,
                    object_path(dataset.id())));
}

namespace {

// A group's members in creation order, datasets and groups apart.
struct Members {
  std::vector<std::string> datasets, groups;
};

herr_t sort_member(hid_t group, const char* name, const H5L_info_t*, void* data) {
  auto* members = static_cast<Members*>(data);
  H5O_info_t info;
  if (H5Oget_info_by_name2(group, name, &info, H5O_INFO_BASIC, H5P_DEFAULT) < 0) return -1;
  if (info.type == H5O_TYPE_GROUP) members->groups.emplace_back(name);
  if (info.type == H5O_TYPE_DATASET) members->datasets.emplace_back(name);
  return 0;
}

// A group's own datasets first, then its groups: the order in which netCDF-C reads them
// (libhdf5/hdf5open.c, rec_read_metadata).
void number_in_group(hid_t group, int& next) {
  Members members;
  check(H5Literate(group, H5_INDEX_CRT_ORDER, H5_ITER_INC, nullptr, sort_member, &members),
        fmt::format("listing {}", object_path(group)));
  for (const std::string& name : members.datasets) {
    Dataset dataset(H5Dopen2(group, name.c_str(), H5P_DEFAULT), fmt::format("opening {}", child_path(group, name)));
    const htri_t scale = H5DSis_scale(dataset.id());
    check(scale, fmt::format("checking {}", object_path(dataset.id())));
    if (scale > 0) set_int_attribute(dataset.id(), ".", "_Netcdf4Dimid", next++);
  }
  for (const std::string& name : members.groups) {
    Group child(H5Gopen2(group, name.c_str(), H5P_DEFAULT), fmt::format("opening {}", child_path(group, name)));
    number_in_group(child.id(), next);
  }
}

}  // namespace

void number_dimensions(hid_t file) {
  int next = 0;
  number_in_group(file, next);
}

void set_text_attribute(hid_t location, std::string_view object_name, std::string_view name, std::string_view value) {
  check(H5LTset_attribute_string(location, std::string(object_name).c_str(), std::string(name).c_str(),
                                 std::string(value).c_str()),
        fmt::format("writing {}", attribute_path(location, object_name, name)));
}

void set_double_attribute(hid_t location, std::string_view object_name, std::string_view name, double value) {
  check(H5LTset_attribute_double(location, std::string(object_name).c_str(), std::string(name).c_str(), &value, 1),
        fmt::format("writing {}", attribute_path(location, object_name, name)));
}

void set_int_attribute(hid_t location, std::string_view object_name, std::string_view name, int value) {
  check(H5LTset_attribute_int(location, std::string(object_name).c_str(), std::string(name).c_str(), &value, 1),
        fmt::format("writing {}", attribute_path(location, object_name, name)));
}

bool has_attribute(hid_t location, std::string_view object_name, std::string_view name) {
  const htri_t exists =
      H5Aexists_by_name(location, std::string(object_name).c_str(), std::string(name).c_str(), H5P_DEFAULT);
  check(exists, fmt::format("looking for {}", attribute_path(location, object_name, name)));
  return exists > 0;
}

std::string get_text_attribute(hid_t location, std::string_view object_name, std::string_view name) {
  const std::string what = attribute_path(location, object_name, name);
  Attribute attribute = open_attribute(location, object_name, name);
  Datatype file_type(H5Aget_type(attribute.id()), fmt::format("reading the type of {}", what));
  if (H5Tget_class(file_type.id()) != H5T_STRING) throw Error(fmt::format("{} is not text", what));
  require_single_value(attribute, what);
  const htri_t variable = H5Tis_variable_str(file_type.id());
  check(variable, fmt::format("reading the type of {}", what));
  if (variable > 0) {
    Datatype memory_type = variable_length_text_type();
    char* text = nullptr;
    check(H5Aread(attribute.id(), memory_type.id(), &text), fmt::format("reading {}", what));
    std::string value = text != nullptr ? std::string(text) : std::string();
    H5free_memory(text);
    return value;
  }
  const std::size_t size = H5Tget_size(file_type.id());
  Datatype memory_type(H5Tcopy(H5T_C_S1), "copying the string datatype");
  check(H5Tset_size(memory_type.id(), size), "sizing a string type");
  std::string buffer(size, '\0');
  check(H5Aread(attribute.id(), memory_type.id(), buffer.data()), fmt::format("reading {}", what));
  buffer.resize(strnlen(buffer.data(), size));
  return buffer;
}

double get_double_attribute(hid_t location, std::string_view object_name, std::string_view name) {
  const std::string what = attribute_path(location, object_name, name);
  Attribute attribute = open_attribute(location, object_name, name);
  Datatype file_type(H5Aget_type(attribute.id()), fmt::format("reading the type of {}", what));
  require_numeric(file_type.id(), what);
  require_single_value(attribute, what);
  double value = 0;
  check(H5Aread(attribute.id(), H5T_NATIVE_DOUBLE, &value), fmt::format("reading {}", what));
  return value;
}

int get_int_attribute(hid_t location, std::string_view object_name, std::string_view name) {
  const std::string what = attribute_path(location, object_name, name);
  Attribute attribute = open_attribute(location, object_name, name);
  Datatype file_type(H5Aget_type(attribute.id()), fmt::format("reading the type of {}", what));
  if (H5Tget_class(file_type.id()) != H5T_INTEGER) throw Error(fmt::format("{} is not an integer", what));
  require_single_value(attribute, what);
  int value = 0;
  check(H5Aread(attribute.id(), H5T_NATIVE_INT, &value), fmt::format("reading {}", what));
  return value;
}

std::vector<double> read_doubles(hid_t parent, std::string_view name, int expected_rank,
                                 std::vector<std::size_t>& dims) {
  Dataset dataset = open_dataset(parent, name);
  const std::string path = object_path(dataset.id());
  Datatype file_type(H5Dget_type(dataset.id()), fmt::format("reading the type of {}", path));
  require_numeric(file_type.id(), fmt::format("dataset {}", path));
  dims = checked_shape(dataset, expected_rank);
  std::vector<double> values(element_count(dims));
  if (!values.empty())
    check(H5Dread(dataset.id(), H5T_NATIVE_DOUBLE, H5S_ALL, H5S_ALL, H5P_DEFAULT, values.data()),
          fmt::format("reading dataset {}", path));
  return values;
}

std::vector<std::int64_t> read_integers(hid_t parent, std::string_view name, int expected_rank,
                                        std::vector<std::size_t>& dims) {
  Dataset dataset = open_dataset(parent, name);
  const std::string path = object_path(dataset.id());
  Datatype file_type(H5Dget_type(dataset.id()), fmt::format("reading the type of {}", path));
  if (H5Tget_class(file_type.id()) != H5T_INTEGER) throw Error(fmt::format("dataset {} is not integer", path));
  dims = checked_shape(dataset, expected_rank);
  std::vector<std::int64_t> values(element_count(dims));
  if (!values.empty())
    check(H5Dread(dataset.id(), H5T_NATIVE_INT64, H5S_ALL, H5S_ALL, H5P_DEFAULT, values.data()),
          fmt::format("reading dataset {}", path));
  return values;
}

namespace {

// Text of a dataset of rank 1, or of rank 0 (one value).
std::vector<std::string> read_texts_of_rank(hid_t parent, std::string_view name, int rank) {
  Dataset dataset = open_dataset(parent, name);
  const std::string path = object_path(dataset.id());
  Datatype file_type(H5Dget_type(dataset.id()), fmt::format("reading the type of {}", path));
  if (H5Tget_class(file_type.id()) != H5T_STRING) throw Error(fmt::format("dataset {} is not text", path));
  const std::vector<std::size_t> shape = checked_shape(dataset, rank);
  const std::size_t count = shape.empty() ? 1 : shape[0];
  std::vector<std::string> values;
  if (count == 0) return values;
  values.reserve(count);
  const htri_t variable = H5Tis_variable_str(file_type.id());
  check(variable, fmt::format("reading the type of {}", path));
  if (variable > 0) {
    Datatype memory_type = variable_length_text_type();
    std::vector<char*> pointers(count, nullptr);
    check(H5Dread(dataset.id(), memory_type.id(), H5S_ALL, H5S_ALL, H5P_DEFAULT, pointers.data()),
          fmt::format("reading dataset {}", path));
    for (const char* text : pointers) values.emplace_back(text != nullptr ? text : "");
    Dataspace space(H5Dget_space(dataset.id()), "reading a dataspace");
    check(H5Dvlen_reclaim(memory_type.id(), space.id(), H5P_DEFAULT, pointers.data()),
          fmt::format("freeing text read from {}", path));
    return values;
  }
  const std::size_t size = H5Tget_size(file_type.id());
  Datatype memory_type(H5Tcopy(H5T_C_S1), "copying the string datatype");
  check(H5Tset_size(memory_type.id(), size), "sizing a string type");
  std::vector<char> buffer(count * size, '\0');
  check(H5Dread(dataset.id(), memory_type.id(), H5S_ALL, H5S_ALL, H5P_DEFAULT, buffer.data()),
        fmt::format("reading dataset {}", path));
  for (std::size_t i = 0; i < count; ++i) {
    const char* start = buffer.data() + i * size;
    values.emplace_back(start, strnlen(start, size));
  }
  return values;
}

}  // namespace

std::vector<std::string> read_texts(hid_t parent, std::string_view name) { return read_texts_of_rank(parent, name, 1); }

std::string read_text_scalar(hid_t parent, std::string_view name) {
  return read_texts_of_rank(parent, name, 0).front();
}

double read_double_scalar(hid_t parent, std::string_view name) {
  std::vector<std::size_t> dims;
  return read_doubles(parent, name, 0, dims).front();
}

namespace {

void require_entries(hid_t parent, std::string_view name, std::size_t entries, std::size_t length) {
  if (entries != length)
    throw Error(fmt::format("dataset {} has {} entries, expected {}", child_path(parent, name), entries, length));
}

}  // namespace

std::vector<double> read_doubles_of_length(hid_t parent, std::string_view name, std::size_t length) {
  std::vector<std::size_t> dims;
  std::vector<double> values = read_doubles(parent, name, 1, dims);
  require_entries(parent, name, values.size(), length);
  return values;
}

std::vector<std::string> read_texts_of_length(hid_t parent, std::string_view name, std::size_t length) {
  std::vector<std::string> values = read_texts(parent, name);
  require_entries(parent, name, values.size(), length);
  return values;
}

void set_identity_attributes(hid_t file, const FileIdentity& identity) {
  set_text_attribute(file, ".", "record_format", identity.format);
  set_int_attribute(file, ".", "record_format_version", identity.version);
  set_text_attribute(file, ".", "program_version", identity.program_version);
  set_text_attribute(file, ".", "site_name", identity.site_name);
  set_text_attribute(file, ".", "run_start_date", identity.run_start_date);
  set_text_attribute(file, ".", "input_hash", identity.input_hash);
  if (!identity.run_id.empty()) set_text_attribute(file, ".", "run_id", identity.run_id);
}

}  // namespace wetfront::profiles::hdf5
