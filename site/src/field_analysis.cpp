#include "wetfront/site/field_analysis.hpp"

#include <fmt/format.h>

#include "wetfront/base/csv_table.hpp"
#include "wetfront/site/field_readings.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/quantity.hpp"
#include "wetfront/soils/tension_infiltrometer.hpp"
#include "wetfront/soils/well_permeameter.hpp"

namespace wetfront::site {
namespace {

constexpr double minutes_per_day = 1440.0;

double positive_option(const std::string& text, base::Dimension dimension, const std::string& option) {
  if (text.empty()) throw base::InputError(fmt::format("option {} is required", option));
  const double value = base::parse_quantity(text, dimension, "option " + option);
  if (!(value > 0.0)) throw base::InputError(fmt::format("option {}: must be positive, got '{}'", option, text));
  return value;
}

ReportTable outflow_table(const std::string& head_header, const std::vector<HeadOutflow>& outflows) {
  ReportTable table;
  table.title = "Steady outflow from the reservoir (least-squares line through the readings marked steady)";
  table.headers = {head_header,       "readings used", "fall rate [cm/min]", "outflow [cm3/min]",
                   "outflow [cm3/d]", "drift [%]",     "scatter [%]",        "steady"};
  for (const auto& h : outflows) {
    table.add_row({number(h.head_cm), fmt::format("{} of {}", h.outflow.reading_count, h.all_readings),
                   number(h.outflow.level_fall_rate_cm_per_d / minutes_per_day),
                   number(soils::cm3_per_d_to_cm3_per_min(h.outflow.outflow_cm3_per_d)),
                   number(h.outflow.outflow_cm3_per_d, 6), percent(h.outflow.relative_drift),
                   percent(h.outflow.relative_scatter), h.outflow.steady ? "yes" : "NO"});
  }
  return table;
}

void add_steadiness_warnings(const std::string& file, const std::string& head_name,
                             const std::vector<HeadOutflow>& outflows, std::vector<std::string>& warnings) {
  for (const auto& h : outflows) {
    if (!h.outflow.steady) {
      warnings.push_back(fmt::format("{}: flow at {} {} cm may not be steady: {}", file, head_name, number(h.head_cm),
                                     h.outflow.steadiness_note));
    }
  }
}

}  // namespace

FieldReport analyse_permeameter(const PermeameterInputs& inputs) {
  const double well_radius = positive_option(inputs.well_radius, base::Dimension::length, "--well-radius");
  const double reservoir_area = positive_option(inputs.reservoir_area, base::Dimension::area, "--reservoir-area");
  soils::WellSoilCategory category;
  try {
    category = soils::parse_category(inputs.soil_category);
  } catch (const base::InputError& error) {
    throw base::InputError(fmt::format("option --soil: {}", error.what()));
  }

  const base::CsvTable table = base::CsvTable::read(inputs.file);
  const auto groups = group_readings(table, "water depth", base::Dimension::length);
  for (const auto& g : groups) {
    if (!(g.head_cm > 0.0)) {
      throw table.error_at(g.first_row, table.require_column("water depth"),
                           fmt::format("the depth of water in the well must be positive, got {} cm", g.head_cm));
    }
  }
  if (groups.size() > 2) {
    std::string depths;
    for (const auto& g : groups) depths += (depths.empty() ? "" : ", ") + number(g.head_cm);
    throw base::InputError(
        table.path(), 0, "water depth",
        fmt::format("give readings at one or two water depths; found {} ({} cm)", groups.size(), depths));
  }
  const auto outflows = steady_outflows(table, groups, reservoir_area, inputs.tolerances);

  FieldReport report;
  add_steadiness_warnings(inputs.file, "water depth", outflows, report.warnings);
  report.tables.push_back(outflow_table("water depth [cm]", outflows));

  ReportTable results;
  results.title = fmt::format(
      "Field-saturated conductivity (Reynolds & Elrick 1985; shape factor of Zhang et al. 1998; well radius {} cm; "
      "soil category {}: {})",
      number(well_radius), soils::category_name(category), soils::category_description(category));
  results.headers = {"analysis", "Kfs [cm/d]", "Kfs [cm/h]", "matric flux potential [cm2/d]", "alpha* [1/cm]"};
  auto add = [&](const soils::WellResult& r) {
    results.add_row({r.method, number(r.field_saturated_conductivity_cm_per_d),
                     number(r.field_saturated_conductivity_cm_per_d / 24.0), number(r.matric_flux_potential_cm2_per_d),
                     number(r.sorptive_number_per_cm)});
  };

  std::vector<soils::WellResult> singles;
  for (const auto& h : outflows) {
    singles.push_back(soils::single_head_analysis({h.head_cm, h.outflow.outflow_cm3_per_d}, well_radius, category));
    add(singles.back());
  }
  soils::WellResult chosen = singles.front();
  if (singles.size() == 2 && inputs.single_head_only) {
    chosen.field_saturated_conductivity_cm_per_d =
        0.5 * (singles[0].field_saturated_conductivity_cm_per_d + singles[1].field_saturated_conductivity_cm_per_d);
    chosen.matric_flux_potential_cm2_per_d =
        chosen.field_saturated_conductivity_cm_per_d / chosen.sorptive_number_per_cm;
    chosen.method = fmt::format("mean of single-head results at H = {} and {} cm", number(outflows[0].head_cm),
                                number(outflows[1].head_cm));
    add(chosen);
  } else if (singles.size() == 2) {
    chosen =
        soils::two_head_analysis({outflows[0].head_cm, outflows[0].outflow.outflow_cm3_per_d},
                                 {outflows[1].head_cm, outflows[1].outflow.outflow_cm3_per_d}, well_radius, category);
    add(chosen);
    for (const auto& w : chosen.warnings) report.warnings.push_back(inputs.file + ": " + w);
  }
  report.tables.push_back(results);
  report.saturated_conductivity_cm_per_d = chosen.field_saturated_conductivity_cm_per_d;
  report.provenance = fmt::format("well permeameter, {}: {}", inputs.file, chosen.method);
  return report;
}

FieldReport analyse_infiltrometer(const InfiltrometerInputs& inputs) {
  const double disc_radius = positive_option(inputs.disc_radius, base::Dimension::length, "--disc-radius");
  const double tower_area = positive_option(inputs.tower_area, base::Dimension::area, "--tower-area");

  const base::CsvTable table = base::CsvTable::read(inputs.file);
  const auto groups = group_readings(table, "supply head", base::Dimension::pressure_head);
  const std::size_t head_col = table.require_column("supply head");
  for (const auto& g : groups) {
    if (!(g.head_cm < 0.0)) {
      throw table.error_at(
          g.first_row, head_col,
          fmt::format("supply heads must be negative (suction at the disc), got {} cm", number(g.head_cm)));
    }
  }
  if (groups.size() < 2) {
    throw base::InputError(
        table.path(), 0, "supply head",
        fmt::format("the analysis needs readings at two or more supply heads; found {}", groups.size()));
  }
  const auto outflows = steady_outflows(table, groups, tower_area, inputs.tolerances);

  FieldReport report;
  add_steadiness_warnings(inputs.file, "supply head", outflows, report.warnings);
  report.tables.push_back(outflow_table("supply head [cm]", outflows));

  std::vector<soils::DiscFlow> flows;
  for (const auto& h : outflows) flows.push_back({h.head_cm, h.outflow.outflow_cm3_per_d});
  soils::DiscResult disc;
  try {
    disc = soils::analyse_disc(flows, disc_radius);
  } catch (const base::InputError& error) {
    throw base::InputError(table.path(), 0, "supply head", error.what());
  }

  auto range = [](const soils::HeadRange& r) {
    return fmt::format("{} to {}", number(r.drier_head_cm), number(r.wetter_head_cm));
  };
  ReportTable slopes;
  slopes.title = "Gardner alpha between successive heads (Wooding 1968: alpha = ln(Q1/Q2) / (h1 - h2))";
  slopes.headers = {"head range [cm]", "alpha [1/cm]"};
  for (const auto& p : disc.pairs) slopes.add_row({range(p.heads), number(p.alpha_per_cm)});
  report.tables.push_back(slopes);

  ReportTable results;
  results.title = fmt::format("Conductivity at each head (Wooding 1968, disc radius {} cm)", number(disc_radius));
  results.headers = {"supply head [cm]", "K [cm/d]", "K [cm/h]", "alpha from heads [cm]"};
  for (const auto& k : disc.conductivities) {
    results.add_row({number(k.supply_head_cm), number(k.conductivity_cm_per_d), number(k.conductivity_cm_per_d / 24.0),
                     range(k.alpha_from)});
  }
  results.add_row({"0 (extrapolated, Ks)", number(disc.saturated_conductivity_cm_per_d),
                   number(disc.saturated_conductivity_cm_per_d / 24.0), range(disc.saturated_from)});
  report.tables.push_back(results);

  report.saturated_conductivity_cm_per_d = disc.saturated_conductivity_cm_per_d;
  report.provenance = fmt::format("tension disc, {}: extrapolated to h = 0 with alpha = {} 1/cm from heads {} cm",
                                  inputs.file, number(disc.pairs.back().alpha_per_cm), range(disc.saturated_from));
  return report;
}

}  // namespace wetfront::site
