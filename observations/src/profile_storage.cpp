// Observed profile storage by the trapezoidal rule over probe depths (common practice).
#include "wetfront/observations/profile_storage.hpp"

#include <stdexcept>

#include <fmt/format.h>
#include "wetfront/base/input_error.hpp"
#include "visit_pairs.hpp"

namespace wetfront::observations {

double profile_storage_cm(std::span<const double> depths_cm, std::span<const double> water_content) {
  if (depths_cm.size() != water_content.size())
    throw base::InputError(
        fmt::format("{} probe depths for {} water contents", depths_cm.size(), water_content.size()));
  if (depths_cm.size() < 2) throw base::InputError("profile storage needs readings at two depths at least");
  double storage = 0;
  for (std::size_t i = 1; i < depths_cm.size(); ++i) {
    const double thickness = depths_cm[i] - depths_cm[i - 1];
    if (!(thickness > 0))
      throw base::InputError(
          fmt::format("probe depths must increase: {} cm follows {} cm", depths_cm[i], depths_cm[i - 1]));
    storage += 0.5 * (water_content[i] + water_content[i - 1]) * thickness;
  }
  return storage;
}

std::vector<StorageChange> storage_changes(std::span<const ProbeProfile> visits) {
  return detail::rows_between_visits<StorageChange>(
      visits, "probe", [](const ProbeProfile& from, const ProbeProfile& to) {
        if (to.depths_cm != from.depths_cm)
          throw base::InputError(
              fmt::format("probe visits on day {} and day {} use different depths; their storages do not compare",
                          from.day, to.day));
        StorageChange row;
        row.start_day = from.day;
        row.end_day = to.day;
        row.start_storage_cm = profile_storage_cm(from.depths_cm, from.water_content);
        row.end_storage_cm = profile_storage_cm(to.depths_cm, to.water_content);
        row.change_cm = row.end_storage_cm - row.start_storage_cm;
        return row;
      });
}

}  // namespace wetfront::observations
