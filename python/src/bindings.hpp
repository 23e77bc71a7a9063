// The pieces of the Python module, one file each: the site object (site_object.cpp), the run
// results as numpy arrays (result_arrays.cpp), the sweep and calibration (studies.cpp).
// Units are the library's: cm, days, cm of water; times are days since the run start.
#pragma once

#include <memory>

#include <pybind11/pybind11.h>

#include "wetfront/site/run_season.hpp"
#include "wetfront/site/site_file.hpp"

namespace wetfront::python {

namespace py = pybind11;

// The Python site object: a loaded site file, changed in place by the script.
struct Site {
  site::SiteSetup setup;
};

// The result of one season, kept whole; the arrays are made when asked for.
struct Result {
  site::SeasonResult season;
};

py::class_<Site> bind_site(py::module_& m);  // Site and load_site
void bind_result(py::module_& m);
void bind_studies(py::class_<Site>& site_class);  // Site.sweep, Site.calibrate

// A Python progress callback(done, planned) called from any thread while the GIL is released:
// it takes the GIL for the call. A Python exception stops further calls and is raised by
// rethrow_if_failed() once the work is over (with the GIL held).
class ProgressRelay {
 public:
  explicit ProgressRelay(py::object callback) : callback_(std::move(callback)) {}
  ~ProgressRelay();
  void operator()(std::size_t done, std::size_t planned);
  void rethrow_if_failed();

 private:
  py::object callback_;
  std::unique_ptr<py::error_already_set> error_;
};

}  // namespace wetfront::python
