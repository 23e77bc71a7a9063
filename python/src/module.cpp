// The module `wetfront`: InputError and the bindings of bindings.hpp.
#include <pybind11/pybind11.h>

#include "bindings.hpp"
#include "wetfront/base/input_error.hpp"

namespace py = pybind11;

PYBIND11_MODULE(wetfront, m) {
  m.doc() = "wetfront: water flow in the unsaturated zone of a soil column over a season (cm, days).";
  m.attr("__version__") = WETFRONT_VERSION;

  // Bad input: a subclass of ValueError with the file, line (0 when not on one line), key
  // (the column or key, "" when none) and problem (the message without the location).
  static py::exception<wetfront::base::InputError> input_error(m, "InputError", PyExc_ValueError);
  py::register_exception_translator([](std::exception_ptr p) {
    try {
      if (p) std::rethrow_exception(p);
    } catch (const wetfront::base::InputError& e) {
      py::object error = py::reinterpret_borrow<py::object>(input_error.ptr())(e.what());
      error.attr("file") = e.file();
      error.attr("line") = e.line();
      error.attr("key") = e.column();
      error.attr("problem") = e.problem();
      PyErr_SetObject(input_error.ptr(), error.ptr());
    }
  });

  auto site_class = wetfront::python::bind_site(m);
  wetfront::python::bind_result(m);
  wetfront::python::bind_studies(site_class);
}
