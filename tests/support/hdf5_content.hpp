// What a reader sees in an HDF5 file, as lines of text, to compare files written by different
// code: every group and dataset by path (name order), each dataset's type class, shape and values
// (17 significant digits), every attribute's value, and for each dimension the path of the
// dimension scales attached to it. Storage details (chunks, filters, maximum shapes, addresses) are
// left out. Attributes named in `skipped` are listed without their value.
#pragma once

#include <hdf5.h>
#include <hdf5_hl.h>

#include <algorithm>
#include <cstring>
#include <filesystem>
#include <set>
#include <string>
#include <vector>

#include <fmt/format.h>

namespace wetfront::testing {

namespace hdf5_content_detail {

inline std::string name_of(hid_t object) {
  const ssize_t length = H5Iget_name(object, nullptr, 0);
  std::string name(static_cast<std::size_t>(std::max<ssize_t>(length, 0)) + 1, '\0');
  H5Iget_name(object, name.data(), name.size());
  name.resize(static_cast<std::size_t>(std::max<ssize_t>(length, 0)));
  return name;
}

// Numbers as doubles, text as text; other types (references, compounds) by their class only.
inline std::string values_text(hid_t type, hid_t space, bool attribute, hid_t object) {
  const hssize_t count = H5Sget_simple_extent_npoints(space);
  const H5T_class_t type_class = H5Tget_class(type);
  std::string text;
  if (type_class == H5T_INTEGER || type_class == H5T_FLOAT) {
    std::vector<double> values(static_cast<std::size_t>(count));
    if (count > 0 && (attribute ? H5Aread(object, H5T_NATIVE_DOUBLE, values.data())
                                : H5Dread(object, H5T_NATIVE_DOUBLE, H5S_ALL, H5S_ALL, H5P_DEFAULT, values.data())) < 0)
      return " (unreadable)";
    for (double v : values) text += fmt::format(" {:.17g}", v);
  } else if (type_class == H5T_STRING) {
    const bool variable = H5Tis_variable_str(type) > 0;
    const std::size_t size = H5Tget_size(type);
    hid_t memory = H5Tcopy(H5T_C_S1);
    H5Tset_size(memory, variable ? H5T_VARIABLE : size);
    H5Tset_cset(memory, H5Tget_cset(type));  // the library converts no text between ASCII and UTF-8
    const auto read = [&](void* buffer) {
      return attribute ? H5Aread(object, memory, buffer)
                       : H5Dread(object, memory, H5S_ALL, H5S_ALL, H5P_DEFAULT, buffer);
    };
    if (variable) {
      std::vector<char*> pointers(static_cast<std::size_t>(count), nullptr);
      if (count > 0 && read(pointers.data()) < 0) text = " (unreadable)";
      for (char* p : pointers) text += fmt::format(" '{}'", p ? p : "");
      if (count > 0) H5Dvlen_reclaim(memory, space, H5P_DEFAULT, pointers.data());
    } else {
      std::vector<char> buffer(static_cast<std::size_t>(count) * size);
      if (count > 0 && read(buffer.data()) < 0) text = " (unreadable)";
      for (hssize_t i = 0; i < count; ++i) {
        const char* start = buffer.data() + static_cast<std::size_t>(i) * size;
        text += fmt::format(" '{}'", std::string(start, strnlen(start, size)));
      }
    }
    H5Tclose(memory);
  } else {
    text = fmt::format(" (type class {})", static_cast<int>(type_class));
  }
  return text;
}

inline std::string shape_text(hid_t space) {
  const int rank = H5Sget_simple_extent_ndims(space);
  std::vector<hsize_t> dims(static_cast<std::size_t>(std::max(rank, 0)));
  if (rank > 0) H5Sget_simple_extent_dims(space, dims.data(), nullptr);
  return fmt::format("[{}]", fmt::join(dims, " x "));
}

struct Listing {
  std::vector<std::string> lines;
  std::set<std::string> skipped;
};

inline herr_t list_attribute(hid_t object, const char* name, const H5A_info_t*, void* data) {
  auto* listing = static_cast<Listing*>(data);
  const std::string owner = name_of(object);
  const std::string attribute_name(name);
  if (attribute_name == "DIMENSION_LIST" || attribute_name == "REFERENCE_LIST") return 0;  // as scales below
  if (listing->skipped.count(attribute_name) > 0) {
    listing->lines.push_back(fmt::format("{} @{} (not compared)", owner, attribute_name));
    return 0;
  }
  const hid_t attribute = H5Aopen(object, name, H5P_DEFAULT);
  const hid_t type = H5Aget_type(attribute);
  const hid_t space = H5Aget_space(attribute);
  listing->lines.push_back(fmt::format("{} @{}{}", owner, attribute_name, values_text(type, space, true, attribute)));
  H5Sclose(space);
  H5Tclose(type);
  H5Aclose(attribute);
  return 0;
}

inline herr_t list_scale(hid_t, unsigned dimension, hid_t scale, void* data) {
  static_cast<std::vector<std::string>*>(data)->push_back(fmt::format("{}:{}", dimension, name_of(scale)));
  return 0;
}

inline void list_object(hid_t file, const std::string& path, Listing& listing) {
  const hid_t object = H5Oopen(file, path.c_str(), H5P_DEFAULT);
  H5O_info_t info;
  H5Oget_info2(object, &info, H5O_INFO_BASIC);
  if (info.type == H5O_TYPE_DATASET) {
    const hid_t type = H5Dget_type(object);
    const hid_t space = H5Dget_space(object);
    listing.lines.push_back(fmt::format("{} class {} shape {}:{}", path, static_cast<int>(H5Tget_class(type)),
                                        shape_text(space), values_text(type, space, false, object)));
    std::vector<std::string> scales;
    for (int d = 0; d < H5Sget_simple_extent_ndims(space); ++d)
      if (H5DSget_num_scales(object, static_cast<unsigned>(d)) > 0)
        H5DSiterate_scales(object, static_cast<unsigned>(d), nullptr, list_scale, &scales);
    listing.lines.push_back(fmt::format("{} dimensions {}", path, fmt::join(scales, " ")));
    H5Sclose(space);
    H5Tclose(type);
  } else {
    listing.lines.push_back(fmt::format("{} group", path));
  }
  hsize_t index = 0;
  H5Aiterate2(object, H5_INDEX_NAME, H5_ITER_INC, &index, list_attribute, &listing);
  H5Oclose(object);
}

inline herr_t collect_path(hid_t, const char* name, const H5L_info_t*, void* data) {
  static_cast<std::vector<std::string>*>(data)->push_back(std::string("/") + name);
  return 0;
}

}  // namespace hdf5_content_detail

inline std::vector<std::string> hdf5_content(const std::filesystem::path& path,
                                             const std::set<std::string>& skipped = {}) {
  namespace detail = hdf5_content_detail;
  detail::Listing listing{{}, skipped};
  H5E_auto2_t printer = nullptr;
  void* printer_data = nullptr;
  H5Eget_auto2(H5E_DEFAULT, &printer, &printer_data);
  H5Eset_auto2(H5E_DEFAULT, nullptr, nullptr);  // a failed read shows as "(unreadable)" in the listing
  const hid_t file = H5Fopen(path.c_str(), H5F_ACC_RDONLY, H5P_DEFAULT);
  if (file < 0) {
    H5Eset_auto2(H5E_DEFAULT, printer, printer_data);
    return {"cannot open " + path.string()};
  }
  std::vector<std::string> paths{"/"};
  H5Lvisit(file, H5_INDEX_NAME, H5_ITER_INC, detail::collect_path, &paths);
  for (const std::string& object : paths) detail::list_object(file, object, listing);
  H5Fclose(file);
  H5Eset_auto2(H5E_DEFAULT, printer, printer_data);
  return listing.lines;
}

}  // namespace wetfront::testing
