// Adaptive Simpson quadrature (common practice): the interval is halved until the two-panel
// and one-panel Simpson estimates agree within 15 times the local tolerance, and the
// Richardson-extrapolated value (S2 + (S2 - S1)/15) is kept. For bounded integrands; an
// integrable endpoint singularity should be removed by a change of variable first.
#pragma once

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace wetfront::reference {

namespace detail {
template <class Function>
double simpson_refine(const Function& f, double a, double b, double fa, double fm, double fb, double whole,
                      double tolerance, int depth, long& evaluations_left) {
  evaluations_left -= 2;
  if (evaluations_left < 0) throw std::runtime_error("adaptive Simpson: evaluation budget exhausted");
  const double m = 0.5 * (a + b);
  const double lm = 0.5 * (a + m);
  const double rm = 0.5 * (m + b);
  const double flm = f(lm);
  const double frm = f(rm);
  const double left = (m - a) / 6.0 * (fa + 4.0 * flm + fm);
  const double right = (b - m) / 6.0 * (fm + 4.0 * frm + fb);
  const double difference = left + right - whole;
  // The local tolerance is never asked to go below rounding of the panel value itself.
  const double floor = 1e-12 * (std::abs(left) + std::abs(right));
  if (std::abs(difference) <= 15.0 * std::max(tolerance, floor)) return left + right + difference / 15.0;
  // At the depth limit the panel is narrower than (b - a) / 2^max_depth; for a bounded
  // integrand its error is below that width times the integrand, so it is accepted (this is
  // what happens next to a kink such as the infinite slope of Mualem K at saturation).
  if (depth <= 0) return left + right + difference / 15.0;
  return simpson_refine(f, a, m, fa, flm, fm, left, 0.5 * tolerance, depth - 1, evaluations_left) +
         simpson_refine(f, m, b, fm, frm, fb, right, 0.5 * tolerance, depth - 1, evaluations_left);
}
}  // namespace detail

// Integral of f over [a, b] to an absolute tolerance (a <= b or a > b both allowed), or to
// about 1e-12 relative where rounding of f limits it. Throws std::runtime_error rather than
// spend more than max_evaluations calls of f.
template <class Function>
double adaptive_simpson(const Function& f, double a, double b, double absolute_tolerance, int max_depth = 50,
                        long max_evaluations = 10'000'000) {
  if (a == b) return 0.0;
  const double fa = f(a);
  const double fb = f(b);
  const double fm = f(0.5 * (a + b));
  const double whole = (b - a) / 6.0 * (fa + 4.0 * fm + fb);
  long evaluations_left = max_evaluations - 3;
  return detail::simpson_refine(f, a, b, fa, fm, fb, whole, absolute_tolerance, max_depth, evaluations_left);
}

}  // namespace wetfront::reference
