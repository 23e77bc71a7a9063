// Recharge estimated from field readings alone, per interval between visits, to set beside the
// simulated flux through the recharge plane. Amounts in cm of water, positive downward.
#pragma once

#include <span>
#include <string>
#include <vector>

#include "wetfront/soils/hydraulic_models.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::observations {

struct IntervalRecharge {
  double start_day = 0;
  double end_day = 0;
  double mean_flux_cm_per_d = 0;  // positive downward
  double amount_cm = 0;           // mean flux times the interval length
};

// --- Darcy flux from a tensiometer pair below the root zone --------------------------------
// Darcy's law with depth d positive downward and fluxes positive downward (total head
// H = h - d):  q = K(h_mean) (1 - (h_lower - h_upper) / (d_lower - d_upper)),
// K taken at the arithmetic mean head of the pair, h_mean = (h_upper + h_lower) / 2.
double darcy_flux_cm_per_d(const soils::HydraulicModel& soil, double upper_depth_cm, double upper_head_cm,
                           double lower_depth_cm, double lower_head_cm);

struct TensiometerPair {
  soils::HydraulicModel soil;  // the layer around both cups
  double upper_depth_cm = 0;
  double lower_depth_cm = 0;  // deeper than upper_depth_cm
};

struct PairHeads {
  double day = 0;
  double upper_head_cm = 0;  // pressure head at the cup
  double lower_head_cm = 0;
};

// Per interval between consecutive visits: the arithmetic mean of the two end fluxes, each
// from darcy_flux_cm_per_d at that visit. Throws base::InputError for depths out of
// order or visits not increasing in time.
std::vector<IntervalRecharge> darcy_recharge(const TensiometerPair& pair, std::span<const PairHeads> visits);

// --- Water-table fluctuation (Healy & Cook 2002, Hydrogeology Journal 10:91) --------
//   R = Sy * dh/dt,  summed over an interval as R = Sy * rise
// Only rises count. The rise is measured against the antecedent recession: the depth the
// table would have reached without recharge, start depth + recession rate * interval
// (a rate of zero takes the plain rise). Falls give zero recharge, never negative.
struct WaterTableReading {
  double day = 0;
  double depth_cm = 0;  // depth of the water table below the surface
};

struct WaterTableFluctuation {
  double specific_yield = 0;                 // dimensionless, 0 < Sy < 1
  double antecedent_recession_cm_per_d = 0;  // fall rate without recharge, >= 0
};

std::vector<IntervalRecharge> water_table_recharge(const WaterTableFluctuation& method,
                                                   std::span<const WaterTableReading> readings);

// --- Comparing two estimates -------------------------------------------------------------
struct ComparisonRule {
  double factor = 2.0;         // disagreement when one exceeds the other by more than this
  double negligible_cm = 0.0;  // both at or below this (in magnitude) agree whatever the ratio
};

struct EstimateAgreement {
  bool disagree = false;
  double ratio = 0;  // larger over smaller magnitude; infinity when one is zero; NaN if both
  std::vector<std::string> reasons_to_consider;  // plain English; empty when they agree
};

// Two estimates disagree when their signs differ, or when the larger exceeds the smaller by
// more than the factor.
EstimateAgreement compare_recharge_estimates(double first_cm, double second_cm, ComparisonRule rule = {});

}  // namespace wetfront::observations
