#include "wetfront/base/did_you_mean.hpp"

#include <algorithm>
#include <cctype>
#include <vector>

namespace wetfront::base {

std::size_t edit_distance(std::string_view a, std::string_view b) {
  std::vector<std::size_t> row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    std::size_t diagonal = row[0];
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t above = row[j];
      const bool same =
          std::tolower(static_cast<unsigned char>(a[i - 1])) == std::tolower(static_cast<unsigned char>(b[j - 1]));
      row[j] = std::min({row[j] + 1, row[j - 1] + 1, diagonal + (same ? 0 : 1)});
      diagonal = above;
    }
  }
  return row[b.size()];
}

std::optional<std::string> did_you_mean(std::string_view name, std::span<const std::string_view> candidates) {
  std::optional<std::string> best;
  std::size_t best_distance = 0;
  for (const auto candidate : candidates) {
    const std::size_t distance = edit_distance(name, candidate);
    const std::size_t limit = std::max<std::size_t>(2, candidate.size() / 3);
    if (distance <= limit && (!best || distance < best_distance)) {
      best = std::string(candidate);
      best_distance = distance;
    }
  }
  return best;
}

}  // namespace wetfront::base
