// Site.sweep and Site.calibrate: the site file's [[adjustable]] parameters run many times on
// worker threads with the GIL released; a Python progress(done, planned) callback is called
// with the GIL taken again.
#include <mutex>

#include <pybind11/numpy.h>
#include <pybind11/stl.h>

#include "bindings.hpp"
#include "wetfront/site/parameter_study.hpp"

namespace wetfront::python {
namespace {

std::mutex progress_mutex;  // one callback at a time, in the order the runs finish

site::SeasonModel study_model(const Site& s) {
  return site::SeasonModel(s.setup, site::load_parameter_study(s.setup));
}

py::dict parameter_names(const site::SeasonModel& model) {
  py::dict d;
  std::vector<std::string> names, units;
  for (const auto& p : model.study().parameters) {
    names.push_back(p.range.name);
    units.push_back(p.range.unit);
  }
  d["parameters"] = names;
  d["units"] = units;
  return d;
}

py::dict scored_dict(const site::ScoredRun& run) {
  py::dict d;
  d["values"] = run.values;
  d["complete"] = run.complete;
  d["failure"] = run.failure;
  d["objective"] = run.objective;
  d["season_recharge"] = run.season_recharge_cm;
  d["visit_recharge"] = py::array_t<double>(py::cast(run.visit_recharge_cm));
  return d;
}

}  // namespace

ProgressRelay::~ProgressRelay() = default;

void ProgressRelay::operator()(std::size_t done, std::size_t planned) {
  if (callback_.is_none()) return;
  std::lock_guard lock(progress_mutex);
  py::gil_scoped_acquire gil;
  if (error_) return;
  try {
    callback_(done, planned);
  } catch (py::error_already_set& e) {
    error_ = std::make_unique<py::error_already_set>(std::move(e));
  }
}

void ProgressRelay::rethrow_if_failed() {
  if (error_) throw py::error_already_set(std::move(*error_));
}

void bind_studies(py::class_<Site>& site_class) {
  site_class.def(
         "sweep",
         [](const Site& s, std::size_t sample_size, std::uint64_t seed, bool full_grid, unsigned threads,
            py::object progress) {
           const site::SeasonModel model = study_model(s);
           site::SweepSettings settings;
           settings.sample_size = sample_size;
           settings.seed = seed;
           settings.full_grid = full_grid;
           settings.threads = threads;
           ProgressRelay relay(std::move(progress));
           site::SweepResult result;
           {
             py::gil_scoped_release release;
             result = site::run_sweep(model, settings, [&](std::size_t d, std::size_t p) { relay(d, p); });
           }
           relay.rethrow_if_failed();
           py::dict d = parameter_names(model);
           const std::size_t n = result.runs.size(), k = model.study().parameters.size();
           py::array_t<double> values({static_cast<py::ssize_t>(n), static_cast<py::ssize_t>(k)});
           py::array_t<double> objective(static_cast<py::ssize_t>(n)), recharge(static_cast<py::ssize_t>(n));
           py::array_t<bool> complete(static_cast<py::ssize_t>(n));
           auto v = values.mutable_unchecked<2>();
           for (std::size_t i = 0; i < n; ++i) {
             const auto& run = result.runs[i];
             const auto row = static_cast<py::ssize_t>(i);
             for (std::size_t j = 0; j < k; ++j) v(row, static_cast<py::ssize_t>(j)) = run.values.at(j);
             objective.mutable_at(row) = run.objective;
             recharge.mutable_at(row) = run.season_recharge_cm;
             complete.mutable_at(row) = run.complete;
           }
           d["method"] = result.method;
           d["values"] = values;
           d["objective"] = objective;
           d["season_recharge"] = recharge;
           d["complete"] = complete;
           d["ranking"] = py::array_t<std::size_t>(py::cast(result.ranking));
           return d;
         },
         py::arg("sample_size") = 50, py::arg("seed") = 1, py::arg("full_grid") = false, py::arg("threads") = 0,
         py::arg("progress") = py::none(),
         "Runs the site's [[adjustable]] parameters over a Latin hypercube sample (or the full grid); "
         "progress(done, planned) after each run.")
      .def(
          "calibrate",
          [](const Site& s, std::size_t band_runs, std::uint64_t seed, unsigned threads, py::object progress) {
            const site::SeasonModel model = study_model(s);
            site::CalibrationSettings settings;
            settings.band_runs = band_runs;
            settings.seed = seed;
            settings.threads = threads;
            ProgressRelay relay(std::move(progress));
            std::optional<site::CalibrationStudy> study;
            {
              py::gil_scoped_release release;
              study = site::run_calibration(model, settings, [&](std::size_t d, std::size_t p) { relay(d, p); });
            }
            relay.rethrow_if_failed();
            py::dict d = parameter_names(model);
            d["start"] = study->fit.start;
            d["best"] = study->fit.best;
            d["converged"] = study->fit.converged;
            d["stop_reason"] = study->fit.stop_reason;
            d["runs"] = study->fit.runs;
            d["warnings"] = study->fit.warnings;
            d["before"] = scored_dict(study->before);
            d["after"] = scored_dict(study->after);
            py::list band;
            for (const auto& b : study->band) band.append(py::make_tuple(b.low, b.median, b.high));
            d["recharge_band"] = band;  // season first, then per visit interval: (2.5 %, 50 %, 97.5 %)
            d["band_note"] = study->band_note;
            return d;
          },
          py::arg("band_runs") = 40, py::arg("seed") = 1, py::arg("threads") = 0, py::arg("progress") = py::none(),
          "Fits the site's [[adjustable]] parameters to the sensor readings; progress(done, planned) after each run.");
}

}  // namespace wetfront::python
