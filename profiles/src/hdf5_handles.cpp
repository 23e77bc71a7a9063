#include "wetfront/profiles/hdf5_handles.hpp"

#include <fmt/format.h>

namespace wetfront::profiles::hdf5 {

namespace {

// A file whose close fails (a full disk while a temporary run file is given up) stays half closed
// in HDF5 1.10, and the library's own clean-up at exit then crashes on it (H5F__close_cb). wetfront
// closes every file it opens itself, so that clean-up is switched off before the library starts.
[[maybe_unused]] const bool no_library_clean_up_at_exit = H5dont_atexit() >= 0;

// Walking upward starts at the function that detected the error, the most specific place.
herr_t keep_first_message(unsigned depth, const H5E_error2_t* entry, void* client_data) {
  auto* message = static_cast<std::string*>(client_data);
  if (depth == 0 && entry->desc != nullptr) *message = entry->desc;
  return 0;
}

// A failed write of the file driver spells out time, file, descriptor, buffer and offsets; the
// start and the system's own words say it ("file write failed: File too large").
std::string without_driver_details(const std::string& message) {
  const std::string mark = "error message = '";
  const std::size_t cause = message.find(mark);
  if (cause == std::string::npos) return message;
  const std::size_t start = cause + mark.size();
  const std::size_t end = message.find('\'', start);
  return fmt::format("{}: {}", message.substr(0, message.find(':')), message.substr(start, end - start));
}

}  // namespace

std::string library_message() {
  std::string message;
  H5Ewalk2(H5E_DEFAULT, H5E_WALK_UPWARD, keep_first_message, &message);
  return without_driver_details(message);
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
