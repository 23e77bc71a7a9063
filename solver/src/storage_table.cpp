#include "storage_table.hpp"

#include "wetfront/soils/model_parameters.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>

namespace wetfront::solver::detail {

namespace {

constexpr double storage_fade_cm = 1.0;  // w in e(u)

// The cubic Hermite interpolant between (0, y0) and (1, y1) with slopes m0, m1 per unit s over
// an interval of width w, as coefficients of 1, t, t^2, t^3.
void hermite_coefficients(double w, double y0, double m0, double y1, double m1, double* c) {
  c[0] = y0;
  c[1] = w * m0;
  c[2] = 3 * (y1 - y0) - w * (2 * m0 + m1);
  c[3] = 2 * (y0 - y1) + w * (m0 + m1);
}

// Fritsch & Carlson (1980) sufficient condition for a monotone cubic: each node slope between
// 0 and three times the secant of either interval beside it.
void limit_slopes(const std::vector<double>& x, const std::vector<double>& y, std::vector<double>& m) {
  for (std::size_t k = 0; k < x.size(); ++k) {
    double cap = std::numeric_limits<double>::infinity();
    if (k > 0) cap = std::min(cap, 3.0 * (y[k] - y[k - 1]) / (x[k] - x[k - 1]));
    if (k + 1 < x.size()) cap = std::min(cap, 3.0 * (y[k + 1] - y[k]) / (x[k + 1] - x[k]));
    if (!(m[k] >= 0)) m[k] = std::isnan(m[k]) ? cap : 0.0;  // an infinite or undefined slope takes the cap
    m[k] = std::min(m[k], cap);
  }
}

}  // namespace

StorageTable::StorageTable(const soils::HydraulicModel& model, double specific_storage, StorageTableSettings settings)
    : model_(model),
      specific_storage_(specific_storage),
      saturation_head_(soils::full_saturation_head(model)),
      saturated_conductivity_(soils::saturated_conductivity(model)) {
  if (!(specific_storage_ > 0)) throw std::invalid_argument("specific storage must be positive");
  // Node heads, wettest first: h_sat, then h_sat - d_min r^k until the dry end.
  std::vector<double> heads = {saturation_head_};
  double previous_capacity = std::numeric_limits<double>::infinity();
  for (double d = settings.closest_node_cm;; d *= settings.node_ratio) {
    const double h = saturation_head_ - d;
    if (h < settings.driest_head_cm) break;
    heads.push_back(h);
    const double capacity = soils::moisture_capacity(model_, h) + specific_storage_ * std::exp(-d / storage_fade_cm);
    if (capacity < settings.min_capacity_per_cm && capacity < previous_capacity) break;
    previous_capacity = capacity;
  }
  std::reverse(heads.begin(), heads.end());
  for (double h : heads) {
    const double u = h - saturation_head_;
    // At h_sat itself the slopes are the unsaturated side's limits.
    const double h_side = u < 0 ? h : h - 1e-9 * std::max(1.0, std::abs(h));
    const auto state = soils::evaluate(model_, h_side);
    const double water = u < 0 ? state.water_content : soils::saturated_water_content(model_);
    const double storage = water + specific_storage_ * storage_fade_cm * std::exp(u / storage_fade_cm);
    if (!storage_.empty() && !(storage > storage_.back())) {
      // Storage no longer resolves the head here: this node becomes the dry end.
      storage_.clear(), head_.clear(), head_slope_.clear(), conductivity_.clear(), conductivity_slope_.clear();
    }
    const double capacity = state.moisture_capacity + specific_storage_ * std::exp(std::min(u, 0.0) / storage_fade_cm);
    storage_.push_back(storage);
    head_.push_back(h);
    head_slope_.push_back(1.0 / capacity);
    conductivity_.push_back(u < 0 ? state.conductivity : saturated_conductivity_);
    conductivity_slope_.push_back(state.conductivity_slope / capacity);
  }
  if (storage_.size() < 4) throw std::invalid_argument("the soil's retention curve leaves too few table nodes");
  // At saturation both interpolants take the slopes of the saturated side (dh/ds = 1/Ss, K flat
  // at Ks), so h(s) and K(s) have no corner there: a cell that fills to saturation and drains
  // again does not make Newton's iterates jump between two slopes. This rounds the model only
  // within the last table interval (the first d_min of head below saturation).
  head_slope_.back() = 1.0 / specific_storage_;
  conductivity_slope_.back() = 0.0;
  limit_slopes(storage_, head_, head_slope_);
  limit_slopes(storage_, conductivity_, conductivity_slope_);

  dry_storage_ = storage_.front();
  full_storage_ = storage_.back();
  for (std::size_t k = 0; k + 1 < storage_.size(); ++k) {
    Interval iv{};
    const double width = storage_[k + 1] - storage_[k];
    iv.storage = storage_[k];
    iv.inverse_width = 1.0 / width;
    hermite_coefficients(width, head_[k], head_slope_[k], head_[k + 1], head_slope_[k + 1], iv.head);
    hermite_coefficients(width, conductivity_[k], conductivity_slope_[k], conductivity_[k + 1],
                         conductivity_slope_[k + 1], iv.conductivity);
    intervals_.push_back(iv);
  }
  // Kirchhoff potential Phi = integral of K dh, zero at the driest node. Node values integrate
  // the table's own K(t) h'(t) over each interval (degree 5 in t: three-point Gauss-Legendre is
  // exact); node slopes are dPhi/ds = K dh/ds, limited as above, so Phi(s) is monotone and every
  // integral mean of K between two heads is positive.
  std::vector<double> potential(storage_.size(), 0.0), potential_slope(storage_.size());
  for (std::size_t k = 0; k + 1 < storage_.size(); ++k) {
    const Interval& iv = intervals_[k];
    auto cubic = [](const double* c, double t) { return c[0] + t * (c[1] + t * (c[2] + t * c[3])); };
    auto rate = [](const double* c, double t) { return c[1] + t * (2 * c[2] + t * 3 * c[3]); };
    constexpr double half_spread = 0.5 * 0.7745966692414834;  // sqrt(3/5) / 2
    constexpr double nodes[3] = {0.5 - half_spread, 0.5, 0.5 + half_spread},
                     weights[3] = {5.0 / 18, 8.0 / 18, 5.0 / 18};
    double rise = 0;
    for (int q = 0; q < 3; ++q) rise += weights[q] * cubic(iv.conductivity, nodes[q]) * rate(iv.head, nodes[q]);
    potential[k + 1] = potential[k] + rise;
  }
  for (std::size_t k = 0; k < storage_.size(); ++k) potential_slope[k] = conductivity_[k] * head_slope_[k];
  limit_slopes(storage_, potential, potential_slope);
  for (std::size_t k = 0; k + 1 < storage_.size(); ++k)
    hermite_coefficients(storage_[k + 1] - storage_[k], potential[k], potential_slope[k], potential[k + 1],
                         potential_slope[k + 1], intervals_[k].potential);
  full_potential_ = potential.back();
  const std::size_t buckets = 2 * storage_.size();
  bucket_scale_ = static_cast<double>(buckets) / (full_storage() - dry_storage());
  bucket_first_.resize(buckets);
  bucket_last_.resize(buckets);
  const auto last_interval = static_cast<unsigned>(storage_.size() - 2);
  auto interval_of = [&](double s) {
    const auto it = std::upper_bound(storage_.begin(), storage_.end(), s);
    const auto k = static_cast<unsigned>(std::max<std::ptrdiff_t>(it - storage_.begin() - 1, 0));
    return std::min(k, last_interval);
  };
  for (std::size_t b = 0; b < buckets; ++b) {
    bucket_first_[b] = interval_of(dry_storage() + static_cast<double>(b) / bucket_scale_);
    bucket_last_[b] = interval_of(dry_storage() + static_cast<double>(b + 1) / bucket_scale_);
  }
}

StoragePoint StorageTable::dry_tail(double s) const {
  const double slope = head_slope_.front();
  const double h = head_.front() + (s - storage_.front()) * slope;
  if (!std::isfinite(h)) return {h, slope, 0.0, 0.0, 0.0, 0.0};
  const auto state = soils::evaluate(model_, h);
  return {h,
          slope,
          state.conductivity,
          state.conductivity_slope * slope,
          conductivity_.front() * (h - head_.front()),
          conductivity_.front() * slope};
}

double StorageTable::storage_at(double h) const {
  if (!std::isfinite(h)) throw std::invalid_argument(fmt::format("a head of {} cm has no stored water", h));
  if (h >= saturation_head_) return full_storage() + specific_storage_ * (h - saturation_head_);
  if (h <= head_.front()) return storage_.front() + (h - head_.front()) / head_slope_.front();
  const auto it = std::upper_bound(head_.begin(), head_.end(), h);
  const std::size_t k = static_cast<std::size_t>(it - head_.begin()) - 1;
  // Solve the monotone cubic h(s) = target on [s_k, s_(k+1)]: Newton kept inside a bracket.
  double lo = storage_[k], hi = storage_[k + 1], s = 0.5 * (lo + hi);
  for (int iteration = 0; iteration < 100; ++iteration) {
    const auto p = at(s);
    const double mismatch = p.head_cm - h;
    if (mismatch == 0) break;
    (mismatch > 0 ? hi : lo) = s;
    double next = s - mismatch / p.head_per_storage;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (next == s || hi <= lo) break;
    s = next;
  }
  return s;
}

double StorageTable::potential_at_head(double h) const {
  if (h >= saturation_head_) return full_potential_ + saturated_conductivity_ * (h - saturation_head_);
  return at(storage_at(h)).potential;
}

double StorageTable::water_content(double s, double h) const {
  const double u = h - saturation_head_;
  return s - specific_storage_ * (u >= 0 ? u + storage_fade_cm : storage_fade_cm * std::exp(u / storage_fade_cm));
}

}  // namespace wetfront::solver::detail
