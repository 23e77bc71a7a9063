#include "condensed_solver.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include <nvector/nvector_serial.h>
#include <sunmatrix/sunmatrix_band.h>

namespace wetfront::solver::detail {

namespace {

struct Condensed {
  std::size_t uptake_cells = 0;
  SUNLinearSolver fallback = nullptr;  // band LU, for a system whose uptake rows cannot be eliminated
  bool use_fallback = false;
  // Per uptake row i: 1 / d_i and the entries a_i (F_i), b_i (F_(i+1)) of the row, p_i and q_i of
  // U_i in the rows of F_i and F_(i+1).
  std::vector<double> inverse_diagonal, a, b, p, q;
  // The face system after elimination, factored as LAPACK's dgttrf does: sub-diagonal (then the
  // multipliers), diagonal (then the reciprocals of the pivots), super-diagonal and second
  // super-diagonal (fill from row interchanges), both then divided by their row's pivot.
  std::vector<double> lower, diagonal, upper, upper2;
  std::vector<char> swapped;  // row i interchanged with row i + 1
  // A diagonally dominant face system is factored from both ends at once (twisted): per row the
  // multiplier of its downward (rows 1..k) or upward (rows k..n-2) elimination, the reciprocal of
  // its pivot, and its back-substitution coefficient divided by the pivot.
  bool twisted = false;
  std::vector<double> down, up, inverse_pivot, back;
  std::vector<double> face_values;  // scratch of solve
  sunindextype last_flag = 0;
};
Condensed& content(SUNLinearSolver s) { return *static_cast<Condensed*>(s->content); }

std::size_t face_index(std::size_t face, std::size_t uptake_cells) { return face + std::min(face, uptake_cells); }
std::size_t uptake_index(std::size_t cell) { return 2 * cell + 1; }

// LU of the tridiagonal system with partial pivoting (Golub & Van Loan 2013, Alg. 4.3.5 for a
// band of one; the storage of LAPACK's dgttrf). Returns 0, or k + 1 for a zero pivot in column k.
sunindextype factor_tridiagonal(Condensed& c) {
  const std::size_t n = c.diagonal.size();
  auto& dl = c.lower;
  auto& d = c.diagonal;
  auto& du = c.upper;
  c.upper2.assign(n, 0.0);
  c.swapped.assign(n, 0);
  for (std::size_t i = 0; i + 1 < n; ++i) {
    if (std::abs(d[i]) >= std::abs(dl[i])) {
      if (d[i] == 0.0) return static_cast<sunindextype>(i + 1);
      const double factor = dl[i] / d[i];
      dl[i] = factor;
      d[i + 1] -= factor * du[i];
    } else {
      const double factor = d[i] / dl[i];
      d[i] = dl[i];
      dl[i] = factor;
      const double kept = du[i];
      du[i] = d[i + 1];
      d[i + 1] = kept - factor * d[i + 1];
      if (i + 2 < n) {
        c.upper2[i] = du[i + 1];
        du[i + 1] = -factor * du[i + 1];
      }
      c.swapped[i] = 1;
    }
  }
  if (d[n - 1] == 0.0) return static_cast<sunindextype>(n);
  // The back substitution's serial path is then one multiply and one subtraction per row.
  for (std::size_t i = 0; i < n; ++i) {
    d[i] = 1.0 / d[i];
    du[i] *= d[i];
    c.upper2[i] *= d[i];
  }
  return 0;
}

// Twisted LU of a tridiagonal matrix diagonally dominant by rows: Gaussian elimination downward
// from row 0 and upward from row n-1 meeting at row k = n/2 (the "twisted" factorisation, e.g.
// Meurant 1992, SIAM J. Matrix Anal. Appl. 13(3); from memory). Without pivoting it is stable for
// diagonal dominance by rows (Higham 2002, Accuracy and Stability of Numerical Algorithms, 2nd
// ed., ch. 9 on tridiagonal systems; from memory). The two eliminations are independent, so
// each of their serial chains is half as long as one LU's.
// Returns false if the meeting pivot is zero or not finite (the caller then pivots).
bool factor_twisted(Condensed& c) {
  const std::size_t n = c.diagonal.size(), k = n / 2, upward = n - 1 - k;  // upward <= k
  c.down.resize(n), c.up.resize(n), c.inverse_pivot.resize(n), c.back.resize(n);
  const double* l = c.lower.data();  // l[i]: row i + 1, column i
  const double* d = c.diagonal.data();
  const double* u = c.upper.data();  // u[i]: row i, column i + 1
  double *down = c.down.data(), *up = c.up.data(), *inverse_pivot = c.inverse_pivot.data(), *back = c.back.data();
  double p = d[0], q = d[n - 1];  // running pivots of the downward and upward eliminations
  auto downward = [&](std::size_t i) {
    inverse_pivot[i] = 1.0 / p;
    down[i + 1] = l[i] * inverse_pivot[i];
    back[i] = u[i] * inverse_pivot[i];
    p = d[i + 1] - down[i + 1] * u[i];
  };
  std::size_t step = 0;
  for (; step < upward; ++step) {
    downward(step);
    const std::size_t j = n - 1 - step;
    inverse_pivot[j] = 1.0 / q;
    up[j - 1] = u[j - 1] * inverse_pivot[j];
    back[j] = l[j - 1] * inverse_pivot[j];
    q = d[j - 1] - up[j - 1] * l[j - 1];
  }
  for (; step < k; ++step) downward(step);
  const double meeting = upward > 0 ? p + q - d[k] : p;  // both eliminations hold d[k] once
  if (meeting == 0.0 || !std::isfinite(meeting)) return false;
  inverse_pivot[k] = 1.0 / meeting;
  return std::all_of(c.inverse_pivot.begin(), c.inverse_pivot.end(), [](double v) { return std::isfinite(v); });
}

void solve_twisted(const Condensed& c, double* x) {
  const std::size_t n = c.diagonal.size(), k = n / 2, upward = n - 1 - k;
  const double *down = c.down.data(), *up = c.up.data(), *inverse_pivot = c.inverse_pivot.data(), *back = c.back.data();
  std::size_t step = 0;
  for (; step < upward; ++step) {  // eliminate toward row k from both ends
    x[step + 1] -= down[step + 1] * x[step];
    const std::size_t j = n - 1 - step;
    x[j - 1] -= up[j - 1] * x[j];
  }
  for (; step < k; ++step) x[step + 1] -= down[step + 1] * x[step];
  x[k] *= inverse_pivot[k];
  for (step = 1; step <= upward; ++step) {  // substitute outward from row k
    const std::size_t i = k - step, j = k + step;
    x[i] = x[i] * inverse_pivot[i] - back[i] * x[i + 1];
    x[j] = x[j] * inverse_pivot[j] - back[j] * x[j - 1];
  }
  for (; step <= k; ++step) {
    const std::size_t i = k - step;
    x[i] = x[i] * inverse_pivot[i] - back[i] * x[i + 1];
  }
}

bool rows_diagonally_dominant(const Condensed& c) {
  const std::size_t n = c.diagonal.size();
  for (std::size_t i = 0; i < n; ++i) {
    const double off = (i > 0 ? std::abs(c.lower[i - 1]) : 0.0) + (i + 1 < n ? std::abs(c.upper[i]) : 0.0);
    if (!(std::abs(c.diagonal[i]) >= off) || c.diagonal[i] == 0.0) return false;
  }
  return true;
}

void solve_tridiagonal(const Condensed& c, double* x) {
  if (c.twisted) return solve_twisted(c, x);
  const std::size_t n = c.diagonal.size();
  for (std::size_t i = 0; i + 1 < n; ++i) {
    if (c.swapped[i]) {
      const double kept = x[i];
      x[i] = x[i + 1];
      x[i + 1] = kept - c.lower[i] * x[i];
    } else {
      x[i + 1] -= c.lower[i] * x[i];
    }
  }
  // Rows scaled by their pivots' reciprocals; x[i + 2] is known a row early, so only x[i + 1]
  // waits on the previous row.
  x[n - 1] *= c.diagonal[n - 1];
  if (n < 2) return;
  x[n - 2] = x[n - 2] * c.diagonal[n - 2] - c.upper[n - 2] * x[n - 1];
  for (std::size_t i = n - 2; i-- > 0;) {
    const double known = x[i] * c.diagonal[i] - c.upper2[i] * x[i + 2];
    x[i] = known - c.upper[i] * x[i + 1];
  }
}

int initialize(SUNLinearSolver s) {
  content(s).last_flag = 0;
  return SUNLinSolInitialize(content(s).fallback);
}

// Eliminates each uptake unknown from the two face rows that hold it:
//   d_i dU_i + a_i dF_i + b_i dF_(i+1) = r_Ui  gives  dU_i = (r_Ui - a_i dF_i - b_i dF_(i+1)) / d_i,
// and the face rows lose p_i dU_i and q_i dU_i for the same terms in dF_i and dF_(i+1). d_i is
// cj plus the sink's slope g and a_i, b_i are -g and g: while |d_i| >= max(|a_i|, |b_i|) the
// multipliers are at most one and the elimination cannot grow the entries. Otherwise (a wet
// cell where the sink falls with wetness and g < -cj / 2) the band LU with row interchanges
// solves the full system instead.
int setup(SUNLinearSolver s, SUNMatrix matrix) {
  auto& c = content(s);
  if (SUNMatGetID(matrix) != SUNMATRIX_BAND) return c.last_flag = SUNLS_ILL_INPUT;
  const std::size_t m = c.uptake_cells;
  const std::size_t faces = static_cast<std::size_t>(SM_COLUMNS_B(matrix)) - m;
  auto at = [matrix](std::size_t row, std::size_t col) {
    return SM_ELEMENT_B(matrix, static_cast<sunindextype>(row), static_cast<sunindextype>(col));
  };
  auto face = [m](std::size_t j) { return face_index(j, m); };
  c.diagonal.resize(faces);
  c.lower.assign(faces, 0.0);
  c.upper.assign(faces, 0.0);
  for (std::size_t j = 0; j < faces; ++j) {
    c.diagonal[j] = at(face(j), face(j));
    if (j + 1 < faces) {
      c.upper[j] = at(face(j), face(j + 1));
      c.lower[j] = at(face(j + 1), face(j));
    }
  }
  c.inverse_diagonal.resize(m);
  c.a.resize(m), c.b.resize(m), c.p.resize(m), c.q.resize(m);
  c.use_fallback = false;
  for (std::size_t i = 0; i < m && !c.use_fallback; ++i) {
    const std::size_t u = uptake_index(i);
    const double d = at(u, u);
    c.a[i] = at(u, face(i));
    c.b[i] = at(u, face(i + 1));
    c.p[i] = at(face(i), u);
    c.q[i] = at(face(i + 1), u);
    if (!(std::abs(d) >= std::max(std::abs(c.a[i]), std::abs(c.b[i])) && d != 0.0 && std::isfinite(d))) {
      c.use_fallback = true;
      break;
    }
    c.inverse_diagonal[i] = 1.0 / d;
    const double pd = c.p[i] * c.inverse_diagonal[i], qd = c.q[i] * c.inverse_diagonal[i];
    c.diagonal[i] -= pd * c.a[i];
    c.upper[i] -= pd * c.b[i];
    c.lower[i] -= qd * c.a[i];
    c.diagonal[i + 1] -= qd * c.b[i];
  }
  if (c.use_fallback) {
    const int flag = SUNLinSolSetup(c.fallback, matrix);
    c.last_flag = SUNLinSolLastFlag(c.fallback);
    return flag;
  }
  c.twisted = c.diagonal.size() >= 2 && rows_diagonally_dominant(c) && factor_twisted(c);
  c.last_flag = c.twisted ? 0 : factor_tridiagonal(c);
  return c.last_flag > 0 ? SUNLS_LUFACT_FAIL : SUNLS_SUCCESS;
}

int solve(SUNLinearSolver s, SUNMatrix matrix, N_Vector x, N_Vector b, double tolerance) {
  auto& c = content(s);
  if (c.use_fallback) return SUNLinSolSolve(c.fallback, matrix, x, b, tolerance);
  const std::size_t m = c.uptake_cells, faces = c.diagonal.size();
  const double* rhs = N_VGetArrayPointer(b);
  double* out = N_VGetArrayPointer(x);
  auto& face_values = c.face_values;
  face_values.resize(faces);
  for (std::size_t j = 0; j < faces; ++j) face_values[j] = rhs[face_index(j, m)];
  for (std::size_t i = 0; i < m; ++i) {
    const double eliminated = rhs[uptake_index(i)] * c.inverse_diagonal[i];
    face_values[i] -= c.p[i] * eliminated;
    face_values[i + 1] -= c.q[i] * eliminated;
  }
  solve_tridiagonal(c, face_values.data());
  for (std::size_t i = 0; i < m; ++i)
    out[uptake_index(i)] =
        (rhs[uptake_index(i)] - c.a[i] * face_values[i] - c.b[i] * face_values[i + 1]) * c.inverse_diagonal[i];
  for (std::size_t j = 0; j < faces; ++j) out[face_index(j, m)] = face_values[j];
  c.last_flag = 0;
  return SUNLS_SUCCESS;
}

sunindextype last_flag(SUNLinearSolver s) { return content(s).last_flag; }
int free_solver(SUNLinearSolver s) {
  if (!s) return SUNLS_SUCCESS;
  if (s->content) {
    SUNLinSolFree(content(s).fallback);
    delete static_cast<Condensed*>(s->content);
    s->content = nullptr;
  }
  SUNLinSolFreeEmpty(s);
  return SUNLS_SUCCESS;
}

}  // namespace

SUNLinearSolver make_condensed_column_solver(N_Vector like, SUNContext context, std::size_t uptake_cells) {
  SUNLinearSolver fallback = make_band_lu_solver(like, context);
  if (!fallback) return nullptr;
  auto* content = new Condensed;
  content->uptake_cells = uptake_cells;
  content->fallback = fallback;
  SUNLinearSolver s = new_direct_solver(context, content, {initialize, setup, solve, last_flag, free_solver});
  if (!s) {
    SUNLinSolFree(fallback);
    delete content;
  }
  return s;
}

}  // namespace wetfront::solver::detail
