// A thin RAII layer over HDF5 1.10 C identifiers.
//
// Every HDF5 object (file, group, dataset, dataspace, datatype, attribute, property list) is
// an integer identifier that must be closed with its own close function. Handle<Close> owns
// one identifier, closes it once, and refuses to be built from a failed call (negative id).
// Return codes of the C API go through check(), which throws hdf5::Error carrying the
// innermost message from the HDF5 error stack.
#pragma once

#include <hdf5.h>

#include <stdexcept>
#include <string>
#include <string_view>
#include <utility>

namespace wetfront::profiles::hdf5 {

class Error : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

// Most specific message on this thread's HDF5 error stack, or "" when the stack is empty.
std::string library_message();

// "<what>" followed by the library message, if any.
std::string failure_text(std::string_view what);

// Throws Error(failure_text(what)) when status is negative.
void check(herr_t status, std::string_view what);

// Turns off HDF5's automatic printing of its error stack to stderr for the lifetime of the
// guard (errors become exceptions instead) and restores the previous handler afterwards.
class QuietErrors {
 public:
  QuietErrors();
  ~QuietErrors();
  QuietErrors(const QuietErrors&) = delete;
  QuietErrors& operator=(const QuietErrors&) = delete;

 private:
  H5E_auto2_t previous_function_ = nullptr;
  void* previous_data_ = nullptr;
};

template <herr_t (*CloseFunction)(hid_t)>
class Handle {
 public:
  Handle() = default;
  // Takes ownership of id. A negative id means the call that produced it failed: throws
  // Error naming `what`.
  Handle(hid_t id, std::string_view what) : id_(id) {
    if (id_ < 0) throw Error(failure_text(what));
  }
  ~Handle() {
    if (id_ >= 0) CloseFunction(id_);
  }
  Handle(const Handle&) = delete;
  Handle& operator=(const Handle&) = delete;
  Handle(Handle&& other) noexcept : id_(std::exchange(other.id_, H5I_INVALID_HID)) {}
  Handle& operator=(Handle&& other) noexcept {
    if (this != &other) {
      if (id_ >= 0) CloseFunction(id_);
      id_ = std::exchange(other.id_, H5I_INVALID_HID);
    }
    return *this;
  }

  hid_t id() const { return id_; }
  bool is_open() const { return id_ >= 0; }

  // Closes now and reports failure (a file close is where buffered data reaches the disk).
  void close(std::string_view what) {
    const hid_t id = std::exchange(id_, H5I_INVALID_HID);
    if (id >= 0) check(CloseFunction(id), what);
  }

 private:
  hid_t id_ = H5I_INVALID_HID;
};

using File = Handle<H5Fclose>;
using Group = Handle<H5Gclose>;
using Dataset = Handle<H5Dclose>;
using Dataspace = Handle<H5Sclose>;
using Datatype = Handle<H5Tclose>;
using Attribute = Handle<H5Aclose>;
using PropertyList = Handle<H5Pclose>;

}  // namespace wetfront::profiles::hdf5
