// Reads back what later studies need from a study file (layout in docs/hdf5-layout.md,
// "Parameter study files").
#include <fmt/format.h>

#include "hdf5_io.hpp"
#include "wetfront/profiles/run_file.hpp"
#include "wetfront/profiles/study_file.hpp"

namespace wetfront::profiles {

CalibratedParameters read_calibrated_parameters(const std::filesystem::path& path) {
  namespace h5 = hdf5;
  const auto failure = [&](std::string_view cause) {
    return RunFileError(fmt::format("cannot read calibration file '{}': {}", path.string(), cause));
  };
  std::error_code status;
  if (!std::filesystem::is_regular_file(path, status)) throw failure("no such file");
  h5::QuietErrors quiet;
  if (H5Fis_hdf5(path.c_str()) <= 0) throw failure("not an HDF5 file");
  try {
    h5::File file = h5::open_file_read_only(path.string());
    const auto root_text = [&](std::string_view name) {
      return h5::has_attribute(file.id(), ".", name) ? h5::get_text_attribute(file.id(), ".", name) : std::string();
    };
    if (root_text("record_format") != kStudyFormat) throw failure("not a wetfront study file");
    if (const std::string kind = root_text("study_kind"); kind != "calibration")
      throw failure(fmt::format("a study of kind '{}', not a calibration (`wetfront calibrate` writes one)", kind));
    CalibratedParameters calibrated;
    calibrated.input_hash = root_text("input_hash");
    calibrated.run_id = root_text("run_id");
    h5::Group parameters = h5::open_group(file.id(), "parameters");
    calibrated.names = h5::read_texts(parameters.id(), "name");
    const std::size_t n = calibrated.names.size();
    calibrated.search_values = h5::read_doubles_of_length(parameters.id(), "calibrated_search_value", n);
    if (h5::has_link(parameters.id(), "covariance")) {
      std::vector<std::size_t> dims;
      calibrated.covariance = h5::read_doubles(parameters.id(), "covariance", 2, dims);
      if (dims.size() != 2 || dims[0] != n || dims[1] != n)
        throw failure(fmt::format("/parameters/covariance is not {} x {}", n, n));
    }
    return calibrated;
  } catch (const RunFileError&) {
    throw;
  } catch (const std::exception& error) {
    throw failure(error.what());
  }
}

}  // namespace wetfront::profiles
