// A dataset that grows along an unlimited first dimension, written a chunk at a time.
#include <fmt/format.h>

#include <algorithm>

#include "hdf5_io.hpp"

namespace wetfront::profiles::hdf5 {

namespace {

// One-dimensional series (times, the pond) are short rows: 1024 values (8 KiB) per chunk keeps a
// short run's file small.
constexpr hsize_t kSeriesChunk = 1024;

}  // namespace

GrowingDataset::GrowingDataset(hid_t parent, std::string_view name, std::size_t columns, Description about)
    : width_(std::max<std::size_t>(columns, 1)),
      chunk_rows_(columns == 0 ? kSeriesChunk : std::max<hsize_t>(kChunkValues / columns, 1)) {
  const int rank = columns == 0 ? 1 : 2;
  const hsize_t dims[2] = {0, columns};
  const hsize_t max_dims[2] = {H5S_UNLIMITED, columns};
  const hsize_t chunk[2] = {chunk_rows_, columns};
  Dataspace space(H5Screate_simple(rank, dims, max_dims),
                  fmt::format("creating the dataspace of {}", child_path(parent, name)));
  dataset_ = create_dataset(parent, name, H5T_IEEE_F64LE, space,
                            std::span<const hsize_t>(chunk, static_cast<std::size_t>(rank)));
  describe(parent, name, about);
  held_.reserve(chunk_rows_ * width_);
}

void GrowingDataset::append(std::span<const double> row) {
  if (row.size() != width_)
    throw Error(fmt::format("dataset {}: {} values in a row of {}", object_path(dataset_.id()), row.size(), width_));
  held_.insert(held_.end(), row.begin(), row.end());
  if (held_.size() == chunk_rows_ * width_) flush();
}

void GrowingDataset::flush() {
  if (held_.empty()) return;
  const std::string path = object_path(dataset_.id());
  const hsize_t rows = held_.size() / width_;
  const hsize_t extent[2] = {written_ + rows, width_};
  check(H5Dset_extent(dataset_.id(), extent), fmt::format("extending dataset {}", path));
  Dataspace file_space(H5Dget_space(dataset_.id()), fmt::format("reading the shape of {}", path));
  const int rank = H5Sget_simple_extent_ndims(file_space.id());
  const hsize_t start[2] = {written_, 0};
  const hsize_t count[2] = {rows, width_};
  check(H5Sselect_hyperslab(file_space.id(), H5S_SELECT_SET, start, nullptr, count, nullptr),
        fmt::format("selecting rows of {}", path));
  Dataspace memory_space(H5Screate_simple(rank, count, nullptr), "creating a dataspace");
  check(H5Dwrite(dataset_.id(), H5T_NATIVE_DOUBLE, memory_space.id(), file_space.id(), H5P_DEFAULT, held_.data()),
        fmt::format("writing dataset {}", path));
  written_ += rows;
  held_.clear();
}

}  // namespace wetfront::profiles::hdf5
