#include "visit_readings.hpp"

#include <cmath>
#include <limits>

#include "fit_readings.hpp"

namespace wetfront::site::detail {

std::vector<ReadingsAtVisit> readings_by_visit(const std::vector<SensorRecord>& sensors,
                                               const std::vector<double>& visit_days, const FitWeights& weights,
                                               double end_day, const std::vector<double>& cell_centres_cm,
                                               std::size_t& unused) {
  std::vector<ReadingsAtVisit> by_visit(visit_days.size());
  for (std::size_t v = 0; v < visit_days.size(); ++v) by_visit[v].visit = v;
  unused = 0;
  for (const auto& sensor : sensors) {
    for (const auto& o : sensor.series.observations) {
      if (!compared(sensor, o, weights, end_day)) continue;
      std::size_t nearest = visit_days.size();
      double distance = std::numeric_limits<double>::infinity();
      for (std::size_t v = 0; v < visit_days.size(); ++v) {
        if (std::abs(visit_days[v] - o.day) < distance) distance = std::abs(visit_days[v] - o.day), nearest = v;
      }
      const bool inside =
          !cell_centres_cm.empty() && o.depth_cm >= cell_centres_cm.front() && o.depth_cm <= cell_centres_cm.back();
      if (nearest == visit_days.size() || distance >= kVisitReadingWindowDays || !inside) {
        ++unused;
        continue;
      }
      VisitReading reading;
      reading.sensor = sensor.name;
      reading.quantity = sensor.quantity;
      reading.depth_cm = o.depth_cm;
      reading.day = o.day;
      reading.value = o.value;
      reading.uncertainty = reading_uncertainty(sensor, weights);
      by_visit[nearest].readings.push_back(std::move(reading));
    }
  }
  std::vector<ReadingsAtVisit> kept;
  for (auto& visit : by_visit)
    if (!visit.readings.empty()) kept.push_back(std::move(visit));
  return kept;
}

}  // namespace wetfront::site::detail
