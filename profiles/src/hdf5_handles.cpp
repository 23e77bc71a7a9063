#include "wetfront/profiles/hdf5_handles.hpp"

#include <fmt/format.h>

namespace wetfront::profiles::hdf5 {

namespace {

// Walking upward starts at the function that detected the error, the most specific place.
herr_t keep_first_message(unsigned depth, const H5E_error2_t* entry, void* client_data) {
  auto* message = static_cast<std::string*>(client_data);
  if (depth == 0 && entry->desc != nullptr) *message = entry->desc;
  return 0;
}

}  // namespace

std::string library_message() {
  std::string message;
  H5Ewalk2(H5E_DEFAULT, H5E_WALK_UPWARD, keep_first_message, &message);
  return message;
}

std::string failure_text(std::string_view what) {
  const std::string detail = library_message();
  if (detail.empty()) return std::string(what);
  return fmt::format("{} (HDF5: {})", what, detail);
}

void check(herr_t status, std::string_view what) {
  if (status < 0) throw Error(failure_text(what));
}

QuietErrors::QuietErrors() {
  H5Eget_auto2(H5E_DEFAULT, &previous_function_, &previous_data_);
  H5Eset_auto2(H5E_DEFAULT, nullptr, nullptr);
}

QuietErrors::~QuietErrors() { H5Eset_auto2(H5E_DEFAULT, previous_function_, previous_data_); }

}  // namespace wetfront::profiles::hdf5
