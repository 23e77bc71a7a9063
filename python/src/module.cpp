// The module `wetfront`: InputError and the bindings of bindings.hpp.
#include <string>

#include <pybind11/pybind11.h>

#include "bindings.hpp"
#include "wetfront/base/input_error.hpp"

namespace py = pybind11;

namespace {

// The key an error is about: the column of a CSV error, or for a site-file error the key its
// message starts with ("key 'layers[2].n': ..."); "" when there is none.
std::string error_key(const wetfront::base::InputError& e) {
  if (!e.column().empty()) return e.column();
  const std::string& problem = e.problem();
  const std::string lead = "key '";
  if (problem.rfind(lead, 0) != 0) return "";
  const auto end = problem.find('\'', lead.size());
  return end == std::string::npos ? "" : problem.substr(lead.size(), end - lead.size());
}

}  // namespace

PYBIND11_MODULE(wetfront, m) {
  m.doc() = "wetfront: water flow in the unsaturated zone of a soil column over a season (cm, days).";
  m.attr("__version__") = WETFRONT_VERSION;

  // Bad input: a subclass of ValueError with the file, line (0 when not on one line), key
  // (the CSV column or site-file key, "" when none) and problem (the message without the location).
  static py::exception<wetfront::base::InputError> input_error(m, "InputError", PyExc_ValueError);
  py::register_exception_translator([](std::exception_ptr p) {
    try {
      if (p) std::rethrow_exception(p);
    } catch (const wetfront::base::InputError& e) {
      py::object error = py::reinterpret_borrow<py::object>(input_error.ptr())(e.what());
      error.attr("file") = e.file();
      error.attr("line") = e.line();
      error.attr("key") = error_key(e);
      error.attr("problem") = e.problem();
      PyErr_SetObject(input_error.ptr(), error.ptr());
    }
  });

  auto site_class = wetfront::python::bind_site(m);
  wetfront::python::bind_result(m);
  wetfront::python::bind_studies(site_class);
}
