// Whether an HDF5 file on disk is one wetfront wrote (run record or study file), and the
// switch that keeps the HDF5 library from printing its own error stack.
#include <hdf5.h>

#include <string>

#include "hdf5_io.hpp"
#include "wetfront/profiles/file_save.hpp"

namespace wetfront::profiles {

bool is_wetfront_hdf5(const std::filesystem::path& path) {
  try {
    hdf5::QuietErrors quiet;
    if (H5Fis_hdf5(path.c_str()) <= 0) return false;
    hdf5::File file = hdf5::open_file_read_only(path.string());
    if (!hdf5::has_attribute(file.id(), ".", "record_format")) return false;
    return hdf5::get_text_attribute(file.id(), ".", "record_format").rfind("wetfront", 0) == 0;
  } catch (...) {
    return false;
  }
}

void silence_hdf5_error_printing() { H5Eset_auto2(H5E_DEFAULT, nullptr, nullptr); }

}  // namespace wetfront::profiles
