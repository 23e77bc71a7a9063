#include "sensor_report.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <vector>

#include <fmt/format.h>

#include "wetfront/site/season_tables.hpp"

namespace wetfront::cli {

using namespace wetfront::site;  // the application library these commands drive
namespace {

std::string value(double v, int digits) {
  return std::isnan(v) ? std::string("n/a") : fmt::format("{:.{}f}", v, digits);
}

// The intervals with an estimate: how many, the model's drainage and the estimate summed over
// them, how many differ, and the reasons to consider (each once).
struct EstimateSummary {
  int estimated = 0;
  int differ = 0;
  double model_cm = 0;
  double estimate_cm = 0;
  std::vector<std::string> reasons;
};

EstimateSummary summarise(const std::vector<EstimateInterval>& intervals) {
  EstimateSummary s;
  for (const auto& i : intervals) {
    if (!i.estimate_cm) continue;
    ++s.estimated;
    s.model_cm += i.model_cm;
    s.estimate_cm += *i.estimate_cm;
    if (!i.disagree) continue;
    ++s.differ;
    for (const auto& reason : i.reasons) {
      if (std::find(s.reasons.begin(), s.reasons.end(), reason) == s.reasons.end()) s.reasons.push_back(reason);
    }
  }
  return s;
}

// Over the entries where both the observed and the simulated value are known: how many, and
// the sum of each.
struct PairedSums {
  int count = 0;
  double observed = 0;
  double simulated = 0;
};

template <class Entry>
PairedSums paired_sums(const std::vector<Entry>& entries, std::optional<double> Entry::*observed,
                       std::optional<double> Entry::*simulated) {
  PairedSums sums;
  for (const Entry& entry : entries) {
    if (!(entry.*observed) || !(entry.*simulated)) continue;
    ++sums.count;
    sums.observed += *(entry.*observed);
    sums.simulated += *(entry.*simulated);
  }
  return sums;
}

// How many of the intervals have an estimate, what the model drained and what `source` gives
// over them, and in how many the two differ.
std::string agreement_text(const EstimateSummary& s, std::size_t intervals, std::string_view source) {
  return fmt::format(
      "  Intervals with an estimate: {} of {}; over them the model drained {} mm, {} gives {} mm;\n"
      "  they differ in {} interval(s).\n",
      s.estimated, intervals, mm(s.model_cm), source, mm(s.estimate_cm), s.differ);
}

}  // namespace

std::string sensor_section(const SensorCheck& sensors) {
  std::string out = "Sensors against the model\n";
  if (sensors.sensors.empty()) return out + "  no sensor readings inside the run\n\n";
  out +=
      "  Simulated values at each reading's time and depth (reading times are solver output times; linear in depth\n"
      "  between cell centres). Bias = mean(model - reading): positive means the model is wetter (higher head) or\n"
      "  holds more water. Heads in cm of water at the cup; water content in cm3/cm3.\n";
  ReportTable table;
  table.headers = {"sensor", "depth [cm]", "quantity [unit]", "used", "left out", "bias", "RMSE", "NSE", "KGE"};
  auto add = [&](const SensorFitRow& r) {
    const int digits = r.unit == "cm" ? 1 : 3;
    table.add_row({r.name, std::isnan(r.depth_cm) ? std::string("") : number(r.depth_cm),
                   fmt::format("{} [{}]", r.quantity, r.unit), fmt::format("{}", r.metrics.count),
                   fmt::format("{}", r.beyond_working_limit + r.outside_run + r.outside_depth),
                   value(r.metrics.bias, digits), value(r.metrics.root_mean_square_error, digits),
                   value(r.metrics.nash_sutcliffe, 2), value(r.metrics.kling_gupta, 2)});
  };
  for (const auto& r : sensors.sensors) add(r);
  for (const auto& r : sensors.pooled) add(r);
  out += format_table(table);
  int limit = 0, outside = 0, off_depth = 0;
  for (const auto& r : sensors.pooled) {
    if (r.unit == "cm") limit += r.beyond_working_limit;
    outside += r.outside_run;
    off_depth += r.outside_depth;
  }
  out += fmt::format(
      "  Left out: {} tensiometer reading(s) beyond the working limit (the water column cavitates at high tension,\n"
      "  so the reading no longer gives the soil's head); {} reading(s) outside the time the run covers.\n",
      limit, outside);
  if (off_depth > 0) {
    out += fmt::format(
        "  Also left out: {} reading(s) above the shallowest or below the deepest cell centre, where the model\n"
        "  gives no value to interpolate.\n",
        off_depth);
  }
  out +=
      "  A reading left out for more than one reason counts once: outside the run first, then outside the cell\n"
      "  centres, then beyond the working limit.\n";
  out +=
      "  Pooled rows combine all sensors of one kind; heads and water contents are never pooled together.\n"
      "  NSE and KGE are n/a where the readings have no spread.\n";
  if (sensors.darcy) {
    const auto& d = *sensors.darcy;
    out += fmt::format(
        "\n  Recharge from tensiometers {} ({} cm) and {} ({} cm) by Darcy's law, per visit interval, beside the\n"
        "  model's drainage;\n  {}.\n  Readings within {} d of a visit count as read at it. Estimates "
        "differ when their signs differ or one\n  exceeds the other by more than a factor of {} "
        "(both below {} mm agree). See the visit table for every interval.\n",
        d.upper_name, number(d.upper_depth_cm), d.lower_name, number(d.lower_depth_cm), d.soil_note,
        kVisitReadingWindowDays, kAgreementFactor, kNegligibleRechargeCm * kMmPerCm);
    const EstimateSummary s = summarise(d.intervals);
    out += agreement_text(s, d.intervals.size(), "Darcy");
    if (!s.reasons.empty()) {
      out += "  Where they differ, consider:\n";
      for (const auto& reason : s.reasons) out += fmt::format("    - {}\n", reason);
    }
  }
  return out + "\n";
}

std::string storage_section(const StorageCheck& storage) {
  std::string out = "Stored water over the probe depths\n";
  if (!storage.usable()) {
    const std::string has = storage.depths_cm.empty()
                                ? std::string("has none")
                                : fmt::format("has them at one depth only ({} cm)", number(storage.depths_cm.front()));
    return out +
           fmt::format("  The comparison needs water-content probes at two or more depths; this site {}.\n\n", has);
  }
  out += fmt::format(
      "  Water stored between {} and {} cm (probes {}, at {} cm), in mm: the trapezoidal rule\n"
      "  over the probe depths, from the readings and from the model at the same depths and times.\n"
      "  Readings within {} d of a visit count as read at it; nothing is counted above the shallowest or\n"
      "  below the deepest probe.\n",
      number(storage.depths_cm.front()), number(storage.depths_cm.back()), fmt::join(storage.probe_names, ", "),
      fmt::join(storage.depths_cm, ", "), kVisitReadingWindowDays);
  const auto [both, observed, simulated] =
      paired_sums(storage.visits, &StorageVisit::observed_cm, &StorageVisit::simulated_cm);
  out += fmt::format("  Visits (with the run start and end) with a reading at every depth: {} of {}.\n", both,
                     storage.visits.size());
  if (both > 0) {
    out +=
        fmt::format("  Mean stored water at those visits: readings {} mm, model {} mm (model minus readings {} mm).\n",
                    mm(observed / both), mm(simulated / both), mm((simulated - observed) / both));
  }
  const auto [intervals, observed_change, simulated_change] =
      paired_sums(storage.intervals, &StorageInterval::observed_change_cm, &StorageInterval::simulated_change_cm);
  out += fmt::format(
      "  Intervals with a change from both: {} of {}; the changes summed over them: readings {} mm,\n"
      "  model {} mm (positive: water gained). The storage change columns of the visit table give every\n"
      "  interval.\n\n",
      intervals, storage.intervals.size(), mm(observed_change), mm(simulated_change));
  return out;
}

std::string water_table_section(const WaterTableCheck& w) {
  std::string out = "Recharge from the water table\n";
  out += fmt::format(
      "  Water-table fluctuation (Healy & Cook 2002) from well {}: recharge = specific yield x rise of the\n"
      "  water table between visits (rises only), with specific yield {}; the rise is taken against a fall\n"
      "  of {} cm/d without recharge.\n",
      w.well, number(w.specific_yield), number(w.recession_cm_per_d));
  if (!w.specific_yield_note.empty()) out += fmt::format("  Specific yield: {}.\n", w.specific_yield_note);
  out += fmt::format(
      "  Readings within {} d of a visit count as read at it. Beside the model's drainage at the recharge\n"
      "  plane; they differ when their signs differ or one exceeds the other by more than a factor of {}\n"
      "  (both below {} mm agree). See the visit table for every interval.\n",
      kVisitReadingWindowDays, kAgreementFactor, kNegligibleRechargeCm * kMmPerCm);
  const EstimateSummary s = summarise(w.intervals);
  out += agreement_text(s, w.intervals.size(), "the water table");
  if (!s.reasons.empty()) {
    out += "  Where they differ, consider:\n";
    for (const auto& reason : s.reasons) {
      // The tensiometer-gradient reason does not apply to a well.
      if (reason.rfind("sensor depth", 0) != 0) out += fmt::format("    - {}\n", reason);
    }
    out +=
        "    - specific yield: the estimate scales with it, and a value from a table for the texture can be off by a\n"
        "      factor of two or more\n"
        "    - the water table answers more than the plot: water flowing in or out of the aquifer sideways, pumping\n"
        "      nearby, and the time drainage takes from the recharge plane down to the water table\n";
  }
  return out + "\n";
}

}  // namespace wetfront::cli
