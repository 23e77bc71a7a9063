#include "wetfront/site/lab_analysis.hpp"

#include <cmath>

#include <fmt/format.h>

#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"
#include "wetfront/soils/core_samples.hpp"
#include "wetfront/soils/lab_csv.hpp"
#include "wetfront/soils/texture_classes.hpp"

namespace wetfront::site {
namespace {

struct NamedSeries {
  std::string label;
  std::vector<soils::RetentionPoint> points;
};

std::optional<double> fixed_residual(const std::string& text) {
  if (text.empty()) return std::nullopt;
  double value = 0.0;
  try {
    value = base::parse_number(text, "option --fix-residual");
  } catch (const base::InputError&) {
    value = base::parse_quantity(text, base::Dimension::water_content, "option --fix-residual");
  }
  if (!(value >= 0.0 && value < 1.0)) {
    throw base::InputError(
        fmt::format("option --fix-residual: a residual water content lies in [0, 1) cm3/cm3, got '{}'", text));
  }
  return value;
}

std::string with_error(double value, double error) {
  if (error == 0.0) return number(value) + " (fixed)";
  if (!std::isfinite(error)) return number(value);
  return fmt::format("{} ± {}", number(value), number(error, 2));
}

}  // namespace

RetentionReport analyse_retention(const RetentionInputs& inputs) {
  const bool from_points = !inputs.points_file.empty();
  const bool from_cores = !inputs.cores_file.empty() || !inputs.steps_file.empty();
  if (from_points == from_cores) {
    throw base::InputError(
        "give the retention data either as a points file or as --cores with --steps, not both or neither");
  }
  if (from_cores && (inputs.cores_file.empty() || inputs.steps_file.empty())) {
    throw base::InputError(
        "--cores and --steps go together: the steps give the masses, the cores the ring volume and dry mass");
  }

  RetentionReport report;
  std::vector<soils::RetentionSeries> series;
  std::vector<soils::CoreSample> cores;
  std::string source;
  if (from_points) {
    series = soils::read_retention_csv(inputs.points_file);
    source = inputs.points_file;
  } else {
    cores = soils::read_core_samples_csv(inputs.cores_file);
    const auto steps = soils::read_suction_steps_csv(inputs.steps_file);
    try {
      series = soils::retention_from_cores(cores, steps);
    } catch (const base::InputError& error) {
      throw base::InputError(inputs.steps_file, 0, "sample", error.what());
    }
    source = inputs.steps_file;
  }
  if (series.empty()) throw base::InputError(source, 0, "", "the file holds no retention points");

  std::vector<NamedSeries> fits_to_run;
  for (const auto& s : series) {
    if (!inputs.sample.empty() && s.sample != inputs.sample) continue;
    fits_to_run.push_back({s.sample.empty() ? std::string("all points") : "sample " + s.sample, s.points});
  }
  if (fits_to_run.empty()) {
    std::string names;
    for (const auto& s : series) names += (names.empty() ? "'" : ", '") + s.sample + "'";
    throw base::InputError(source, 0, "sample",
                           fmt::format("no sample named '{}'; the file has {}", inputs.sample, names));
  }
  if (fits_to_run.size() > 1) {
    NamedSeries pooled{"all samples pooled", {}};
    for (const auto& s : fits_to_run) pooled.points.insert(pooled.points.end(), s.points.begin(), s.points.end());
    fits_to_run.push_back(pooled);
  }

  soils::RetentionFitOptions options;
  options.fixed_residual_water_content = fixed_residual(inputs.fix_residual);

  ReportTable fits;
  fits.title = "van Genuchten (1980) retention fits, m = 1 - 1/n (Levenberg-Marquardt least squares)";
  fits.headers = {"fit",          "points", "theta_r [cm3/cm3]", "theta_s [cm3/cm3]",
                  "alpha [1/cm]", "n [-]",  "RMSE [cm3/cm3]",    "R2 [-]",
                  "solver stop"};
  std::vector<soils::RetentionFit> results;
  for (std::size_t i = 0; i < fits_to_run.size(); ++i) {
    const NamedSeries& s = fits_to_run[i];
    soils::RetentionFit fit;
    try {
      soils::RetentionFitOptions these = options;
      // The pooled set mixes samples: the order rule holds within each sample only.
      these.one_sample = !(fits_to_run.size() > 1 && i + 1 == fits_to_run.size());
      fit = soils::fit_van_genuchten_retention(s.points, these);
    } catch (const base::InputError& error) {
      throw base::InputError(source, 0, "", fmt::format("{}: {}", s.label, error.what()));
    }
    const auto& p = fit.parameters;
    fits.add_row({s.label, fmt::format("{}", fit.point_count), number(p.residual_water_content),
                  number(p.saturated_water_content), number(p.alpha_per_cm), number(p.n), number(fit.rmse, 3),
                  number(fit.r_squared, 4), std::string(studies::describe(fit.stop_reason))});
    for (const auto& note : fit.notes) report.warnings.push_back(fmt::format("{}: {}: {}", source, s.label, note));
    if (!fit.converged()) {
      report.warnings.push_back(
          fmt::format("{}: fit of {} did not converge ({})", source, s.label, studies::describe(fit.stop_reason)));
    }
    results.push_back(fit);
  }

  const soils::RetentionFit& chosen = results.back();
  const NamedSeries& chosen_series = fits_to_run.back();
  const auto& p = chosen.parameters;
  const auto& e = chosen.standard_errors;
  ReportTable detail;
  detail.title = fmt::format("Parameters used ({}), with standard errors", chosen_series.label);
  detail.headers = {"parameter", "value", "unit"};
  detail.add_row(
      {"residual water content theta_r", with_error(p.residual_water_content, e.residual_water_content), "cm3/cm3"});
  detail.add_row(
      {"saturated water content theta_s", with_error(p.saturated_water_content, e.saturated_water_content), "cm3/cm3"});
  detail.add_row({"alpha", with_error(p.alpha_per_cm, e.alpha_per_cm), "1/cm"});
  detail.add_row({"n", with_error(p.n, e.n), "-"});
  if (!chosen.covariance_note.empty()) report.warnings.push_back(source + ": " + chosen.covariance_note);

  // theta_s against the porosity of the cores (weighed data only).
  if (!cores.empty()) {
    for (const auto& core : cores) {
      if (!inputs.sample.empty() && core.name != inputs.sample) continue;
      const auto props = soils::core_properties(core);
      const auto check =
          soils::check_against_porosity(p.saturated_water_content, soils::porosity(props.dry_bulk_density_g_per_cm3));
      if (!check.message.empty())
        report.warnings.push_back(fmt::format("{}: core '{}': {}", inputs.cores_file, core.name, check.message));
    }
  }

  report.tables = {detail, fits};
  report.chosen = p;
  report.provenance = fmt::format("van Genuchten retention fit of {} ({}, {} points, RMSE {} cm3/cm3{})", source,
                                  chosen_series.label, chosen.point_count, number(chosen.rmse, 3),
                                  options.fixed_residual_water_content ? ", theta_r held fixed" : "");
  return report;
}

std::vector<ReportTable> core_tables(const std::string& cores_file, const std::string& steps_file) {
  const auto cores = soils::read_core_samples_csv(cores_file);
  ReportTable table;
  table.title = fmt::format("Ring samples of {} (particle density {} g/cm3 for porosity, common practice)", cores_file,
                            soils::kMineralParticleDensity_g_per_cm3);
  table.headers = {"sample", "water content [cm3/cm3]", "water content [g/g]", "dry bulk density [g/cm3]",
                   "porosity [cm3/cm3]"};
  for (const auto& core : cores) {
    const auto p = soils::core_properties(core);
    table.add_row({core.name, number(p.volumetric_water_content), number(p.gravimetric_water_content_g_per_g),
                   number(p.dry_bulk_density_g_per_cm3), number(soils::porosity(p.dry_bulk_density_g_per_cm3))});
  }
  std::vector<ReportTable> tables = {table};
  if (!steps_file.empty()) {
    std::vector<soils::RetentionSeries> series;
    try {
      series = soils::retention_from_cores(cores, soils::read_suction_steps_csv(steps_file));
    } catch (const base::InputError& error) {
      throw base::InputError(steps_file, 0, "sample", error.what());
    }
    ReportTable points;
    points.title = fmt::format("Retention points from the suction steps of {}", steps_file);
    points.headers = {"sample", "suction [cm]", "suction [kPa]", "water content [cm3/cm3]"};
    for (const auto& s : series) {
      for (const auto& point : s.points) {
        points.add_row({s.sample, number(point.suction_cm),
                        number(point.suction_cm / base::kCentimetresOfWaterPerKilopascal),
                        number(point.water_content)});
      }
    }
    tables.push_back(points);
  }
  return tables;
}

ReportTable texture_table(const std::string& name) {
  ReportTable table;
  table.title = "Class-average parameters, Carsel & Parrish (1988); pore connectivity l = 0.5 (Mualem 1976)";
  table.headers = {"texture class", "theta_r [cm3/cm3]", "theta_s [cm3/cm3]", "alpha [1/cm]", "n [-]", "Ks [cm/d]"};
  auto add = [&](std::string_view class_name, const soils::VanGenuchtenMualem& p) {
    table.add_row({std::string(class_name), number(p.residual_water_content), number(p.saturated_water_content),
                   number(p.alpha_per_cm), number(p.n), number(p.saturated_conductivity_cm_per_d)});
  };
  if (name.empty()) {
    for (const auto& c : soils::texture_classes()) add(c.name, c.parameters);
  } else {
    try {
      add(name, soils::texture_class_parameters(name));
    } catch (const base::InputError& error) {
      throw base::InputError(fmt::format("texture class: {}", error.what()));
    }
  }
  return table;
}

}  // namespace wetfront::site
