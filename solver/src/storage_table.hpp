// Stored water per unit volume of soil as a function of pressure head, and its inverse, tabulated
// once per soil so that the residual needs no transcendental functions.
//
//   s(h) = theta(h) + Ss e(h - h_sat),   e(u) = u + w (u >= 0),  w exp(u / w) (u < 0),  w = 1 cm
//
// theta(h) is the soil model's retention curve, h_sat the head at which Se reaches one (0 cm, the
// air-entry head or the bubbling head) and Ss the specific storage. The term Ss e acts in full
// above saturation and fades below it, so the total capacity ds/dh stays positive and continuous
// and s(h) is one-to-one; above saturation s is linear in h.
//
// The table holds h(s) and K(h(s)) as monotone piecewise-cubic Hermite interpolants in s
// (Fritsch & Carlson 1980, SIAM J. Numer. Anal. 17:238) on nodes spaced geometrically in the
// distance below saturation, d = h_sat - h: d = 0, then d_min r^k. Node values and slopes come from
// the soil model; the slopes are limited to three times the neighbouring secants (Fritsch &
// Carlson's sufficient condition), which keeps both interpolants monotone and caps the infinite
// slope of the Mualem K at saturation for n < 2 over the first d_min of head.
//
// Dry end: where the total capacity has fallen below min_capacity on the dry side of its peak,
// storage no longer resolves the head (a sand at -15000 cm holds theta_r + 1e-24). Below that
// node the retention is continued linearly with the end slope, h = h_dry + (s - s_dry) dh/ds, so
// every storage has a finite head and Newton iterates never meet a NaN; K there is the soil
// model's K at that head. The change to theta is below min_capacity |h - h_dry| (1e-4 at -1e6 cm).
#pragma once

#include <algorithm>
#include <vector>

#include "wetfront/soils/hydraulic_models.hpp"

namespace wetfront::solver::detail {

struct StoragePoint {
  double head_cm;                    // h(s)
  double head_per_storage;           // dh/ds, cm per (cm3/cm3)
  double conductivity;               // K(h(s)), cm/d
  double conductivity_per_storage;   // dK/ds, cm/d per (cm3/cm3)
  double potential = 0;              // Kirchhoff potential Phi(h(s)) = integral of K dh from the driest node, cm2/d
  double potential_per_storage = 0;  // dPhi/ds of the same interpolant (so the Jacobian matches the residual)
};

struct StorageTableSettings {
  double closest_node_cm = 1e-3;  // d_min
  double node_ratio = 1.02;       // r
  double min_capacity_per_cm = 1e-10;
  double driest_head_cm = -1e9;  // the table never extends below this head
};

class StorageTable {
 public:
  StorageTable(const soils::HydraulicModel& model, double specific_storage_per_cm, StorageTableSettings settings = {});

  StoragePoint at(double storage) const {  // inline: the residual's inner loop
    if (storage >= full_storage_) return saturated(storage);
    if (storage < dry_storage_) return dry_tail(storage);
    return in_interval(intervals_[interval(storage)], storage);
  }
  // The same, trying first the interval `hint` (where this cell's last lookup ended: a cell's
  // storage changes little from one call to the next) and leaving there the interval used.
  StoragePoint at(double storage, unsigned& hint) const {
    if (storage >= full_storage_) return saturated(storage);
    if (storage < dry_storage_) return dry_tail(storage);
    if (!(storage_[hint] <= storage && storage < storage_[hint + 1])) hint = static_cast<unsigned>(interval(storage));
    return in_interval(intervals_[hint], storage);
  }
  // The inverse of at(s).head_cm, to round-off: the storage that the table maps to this head.
  double storage_at(double head_cm) const;
  // Phi at a head (a boundary held at that head).
  double potential_at_head(double head_cm) const;
  // The model's water content belonging to a storage (s minus the specific-storage term).
  double water_content(double storage, double head_cm) const;

  double saturation_head_cm() const { return saturation_head_; }
  double full_storage() const { return full_storage_; }  // s at h_sat
  double dry_storage() const { return dry_storage_; }    // s at the driest node
  std::size_t node_count() const { return storage_.size(); }

 private:
  // k with storage_[k] <= s < storage_[k+1], for dry_storage <= s < full_storage.
  std::size_t interval(double storage) const {
    const auto b =
        std::min(static_cast<std::size_t>((storage - dry_storage_) * bucket_scale_), bucket_first_.size() - 1);
    std::size_t lo = bucket_first_[b], hi = bucket_last_[b];
    while (lo < hi) {  // the largest k in [lo, hi] with storage_[k] <= s
      const std::size_t mid = (lo + hi + 1) / 2;
      if (storage_[mid] <= storage)
        lo = mid;
      else
        hi = mid - 1;
    }
    return lo;
  }
  StoragePoint dry_tail(double storage) const;
  StoragePoint saturated(double storage) const {
    const double slope = 1.0 / specific_storage_;
    const double above = (storage - full_storage_) * slope;
    return {saturation_head_ + above,
            slope,
            saturated_conductivity_,
            0.0,
            full_potential_ + saturated_conductivity_ * above,
            saturated_conductivity_ * slope};
  }

  soils::HydraulicModel model_;
  double specific_storage_;
  double saturation_head_;
  double saturated_conductivity_;
  double full_storage_ = 0, dry_storage_ = 0, full_potential_ = 0;
  // Nodes, driest first.
  std::vector<double> storage_, head_, head_slope_, conductivity_, conductivity_slope_;
  // The same interpolants per interval as cubics in t = (s - s_k) / (s_(k+1) - s_k).
  struct Interval {
    double storage, inverse_width;
    double head[4], conductivity[4], potential[4];  // coefficients of 1, t, t^2, t^3
  };
  std::vector<Interval> intervals_;
  static StoragePoint in_interval(const Interval& iv, double storage) {
    const double t = (storage - iv.storage) * iv.inverse_width;
    const double* h = iv.head;
    const double* k = iv.conductivity;
    const double* f = iv.potential;
    return {h[0] + t * (h[1] + t * (h[2] + t * h[3])), (h[1] + t * (2 * h[2] + t * 3 * h[3])) * iv.inverse_width,
            k[0] + t * (k[1] + t * (k[2] + t * k[3])), (k[1] + t * (2 * k[2] + t * 3 * k[3])) * iv.inverse_width,
            f[0] + t * (f[1] + t * (f[2] + t * f[3])), (f[1] + t * (2 * f[2] + t * 3 * f[3])) * iv.inverse_width};
  }
  // Uniform buckets over [dry_storage, full_storage]: the first and last interval that can hold
  // a storage in each bucket.
  std::vector<unsigned> bucket_first_, bucket_last_;
  double bucket_scale_ = 0;
};

}  // namespace wetfront::solver::detail
