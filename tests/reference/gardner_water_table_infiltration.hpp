// Transient one-dimensional infiltration toward a water table in a homogeneous Gardner soil:
// the analytical solution of Srivastava & Yeh (1991, Water Resources Research 27(5):753-762).
//
// With K = Ks exp(a h) and theta = theta_r + (theta_s - theta_r) exp(a h), the Richards
// equation becomes linear in K. Height z is measured upward from the water table (h = 0 at
// z = 0) to the soil surface at z = L. The surface flux (positive downward) is qA for t < 0,
// with the column at the steady profile for qA, and changes to qB at t = 0. Dimensionless
//   z* = a z,  L* = a L,  t* = a Ks t / (theta_s - theta_r),  K* = K/Ks,  q* = q/Ks,
// the solution is (Srivastava & Yeh 1991, their eq. for the homogeneous case)
//   K*(z*, t*) = qB* - (qB* - 1) exp(-z*)
//              - 4 (qB* - qA*) exp((L* - z*)/2) exp(-t*/4)
//                * sum_n sin(l_n z*) sin(l_n L*) exp(-l_n^2 t*) / (1 + L*/2 + 2 l_n^2 L*),
// where l_n are the positive roots of tan(l L*) + 2 l = 0, one in each interval
// ((n - 1/2) pi / L*, n pi / L*). The steady profile for a flux q is K* = q* - (q* - 1) exp(-z*).
#pragma once

#include <vector>

namespace wetfront::reference {

// Dimensional description of the problem. Fluxes are positive downward, in cm/d.
struct GardnerWaterTableProblem {
  double sorptive_number_per_cm = 0.1;       // a, 1/cm
  double saturated_conductivity_cm_per_d = 1.0;
  double saturated_water_content = 0.40;
  double residual_water_content = 0.06;
  double column_height_cm = 100.0;           // L: water table to soil surface
  double initial_surface_flux_cm_per_d = 0.1;  // qA
  double new_surface_flux_cm_per_d = 0.9;      // qB, from t = 0 on
};

// Positive roots of tan(l L*) + 2 l = 0 (equivalently sin(l L*) + 2 l cos(l L*) = 0), the first
// `count` of them, each bracketed in ((n - 1/2) pi / L*, n pi / L*) and found by bisection to
// machine precision.
std::vector<double> srivastava_yeh_eigenvalues(double dimensionless_height, int count);

// The series solution in dimensionless form. Holds the roots it needs (enough terms for the
// earliest time it is asked about to converge to double precision).
class SrivastavaYehSolution {
 public:
  // earliest_dimensionless_time > 0 sets how many terms are kept: every term dropped has
  // exp(-l_n^2 t*) < 1e-18 at that time.
  SrivastavaYehSolution(double dimensionless_height, double initial_flux_ratio, double new_flux_ratio,
                        double earliest_dimensionless_time);

  // K*(z*, t*). At t* = 0 returns the steady profile for qA*; for 0 < t* below the earliest
  // time given to the constructor throws std::domain_error.
  double relative_conductivity(double dimensionless_height_above_table, double dimensionless_time) const;
  std::size_t term_count() const { return roots_.size(); }

 private:
  double height_;         // L*
  double initial_flux_;   // qA*
  double new_flux_;       // qB*
  double earliest_time_;  // t* the term count was chosen for
  std::vector<double> roots_;
};

// Steady relative conductivity K* = q* - (q* - 1) exp(-z*) for a downward flux ratio q*.
double steady_relative_conductivity(double flux_ratio, double dimensionless_height_above_table);

// Dimensional wrapper: pressure head h = ln(K*) / a at a depth below the soil surface
// (depth = L - z) and a time in days after the flux change.
class GardnerWaterTableInfiltration {
 public:
  GardnerWaterTableInfiltration(const GardnerWaterTableProblem& problem, double earliest_time_days);

  double pressure_head_cm(double depth_cm, double time_days) const;
  double initial_pressure_head_cm(double depth_cm) const;
  double dimensionless_time(double time_days) const;
  const GardnerWaterTableProblem& problem() const { return problem_; }

 private:
  GardnerWaterTableProblem problem_;
  SrivastavaYehSolution solution_;
};

}  // namespace wetfront::reference
