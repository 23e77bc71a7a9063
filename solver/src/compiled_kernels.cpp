#include "compiled_kernels.hpp"

#include <algorithm>
#include <cmath>
#include <span>
#include <vector>

#include <nvector/nvector_serial.h>
#include <sunmatrix/sunmatrix_band.h>

namespace wetfront::solver::detail {

namespace {

std::span<double> data(N_Vector v) { return {NV_DATA_S(v), static_cast<std::size_t>(NV_LENGTH_S(v))}; }

// --- vector operations (semantics as documented for NVECTOR_SERIAL) -----------------------
// Each loop reads element i of every input before it writes element i of the output, so an
// output that is also an input is safe.

void linear_sum(double a, N_Vector x, double b, N_Vector y, N_Vector z) {
  const auto xs = data(x), ys = data(y), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = a * xs[i] + b * ys[i];
}
void constant(double c, N_Vector z) { std::ranges::fill(data(z), c); }
void product(N_Vector x, N_Vector y, N_Vector z) {
  const auto xs = data(x), ys = data(y), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = xs[i] * ys[i];
}
void divide(N_Vector x, N_Vector y, N_Vector z) {
  const auto xs = data(x), ys = data(y), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = xs[i] / ys[i];
}
void scale(double c, N_Vector x, N_Vector z) {
  const auto xs = data(x), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = c * xs[i];
}
void absolute(N_Vector x, N_Vector z) {
  const auto xs = data(x), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = std::abs(xs[i]);
}
void inverse(N_Vector x, N_Vector z) {
  const auto xs = data(x), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = 1.0 / xs[i];
}
void add_constant(N_Vector x, double b, N_Vector z) {
  const auto xs = data(x), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = xs[i] + b;
}
double dot(N_Vector x, N_Vector y) {
  const auto xs = data(x), ys = data(y);
  double sum = 0;
  for (std::size_t i = 0; i < xs.size(); ++i) sum += xs[i] * ys[i];
  return sum;
}
double max_norm(N_Vector x) {
  double largest = 0;
  for (double v : data(x)) largest = std::max(largest, std::abs(v));
  return largest;
}
double weighted_square_sum(N_Vector x, N_Vector w) {
  const auto xs = data(x), ws = data(w);
  // Four running sums: one sum alone waits on each addition in turn.
  double sum[4] = {};
  std::size_t i = 0;
  for (; i + 4 <= xs.size(); i += 4)
    for (std::size_t k = 0; k < 4; ++k) sum[k] += (xs[i + k] * ws[i + k]) * (xs[i + k] * ws[i + k]);
  for (; i < xs.size(); ++i) sum[0] += (xs[i] * ws[i]) * (xs[i] * ws[i]);
  return (sum[0] + sum[1]) + (sum[2] + sum[3]);
}
double weighted_square_sum_masked(N_Vector x, N_Vector w, N_Vector mask) {
  const auto xs = data(x), ws = data(w), ms = data(mask);
  double sum = 0;
  for (std::size_t i = 0; i < xs.size(); ++i)
    if (ms[i] > 0) sum += (xs[i] * ws[i]) * (xs[i] * ws[i]);
  return sum;
}
thread_local const StepNorm* installed_norm = nullptr;  // ScopedStepNorm
double wrms_norm(N_Vector x, N_Vector w) {
  if (installed_norm) return installed_norm->norm(installed_norm->context, data(x), data(w));
  return std::sqrt(weighted_square_sum(x, w) / static_cast<double>(NV_LENGTH_S(x)));
}
double wrms_norm_masked(N_Vector x, N_Vector w, N_Vector mask) {
  return std::sqrt(weighted_square_sum_masked(x, w, mask) / static_cast<double>(NV_LENGTH_S(x)));
}
double minimum(N_Vector x) {
  const auto xs = data(x);
  return *std::min_element(xs.begin(), xs.end());
}
double weighted_l2_norm(N_Vector x, N_Vector w) { return std::sqrt(weighted_square_sum(x, w)); }
double l1_norm(N_Vector x) {
  double sum = 0;
  for (double v : data(x)) sum += std::abs(v);
  return sum;
}
void compare(double c, N_Vector x, N_Vector z) {
  const auto xs = data(x), zs = data(z);
  for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = std::abs(xs[i]) >= c ? 1.0 : 0.0;
}
booleantype inverse_test(N_Vector x, N_Vector z) {
  const auto xs = data(x), zs = data(z);
  booleantype no_zero = SUNTRUE;
  for (std::size_t i = 0; i < zs.size(); ++i) {
    if (xs[i] == 0.0)
      no_zero = SUNFALSE;
    else
      zs[i] = 1.0 / xs[i];
  }
  return no_zero;
}
int linear_combination(int count, double* c, N_Vector* x, N_Vector z) {
  const auto zs = data(z);
  double* out = zs.data();
  const std::size_t n = zs.size();
  // z = c_0 x_0 (in place when z is x_0), then z += c_j x_j; an output that is one of the
  // later inputs is summed element by element instead.
  for (int j = 1; j < count; ++j)
    if (NV_DATA_S(x[j]) == out) {
      for (std::size_t i = 0; i < n; ++i) {
        double sum = 0;
        for (int k = 0; k < count; ++k) sum += c[k] * NV_DATA_S(x[k])[i];
        out[i] = sum;
      }
      return 0;
    }
  const double* first = NV_DATA_S(x[0]);
  for (std::size_t i = 0; i < n; ++i) out[i] = c[0] * first[i];
  for (int j = 1; j < count; ++j) {
    const double* in = NV_DATA_S(x[j]);
    const double cj = c[j];
    for (std::size_t i = 0; i < n; ++i) out[i] += cj * in[i];
  }
  return 0;
}
int scale_add_multi(int count, double* a, N_Vector x, N_Vector* y, N_Vector* z) {
  const auto xs = data(x);
  for (int j = 0; j < count; ++j) {
    const auto ys = data(y[j]), zs = data(z[j]);
    for (std::size_t i = 0; i < zs.size(); ++i) zs[i] = a[j] * xs[i] + ys[i];
  }
  return 0;
}
int dot_multi(int count, N_Vector x, N_Vector* y, double* d) {
  for (int j = 0; j < count; ++j) d[j] = dot(x, y[j]);
  return 0;
}

// --- band LU -------------------------------------------------------------------------------
// Storage of SUNBandMatrix: column j holds rows j - smu .. j + ml; element (i, j) is
// SM_COLUMN_B(A, j)[i - j]. Multipliers are stored negated below the diagonal, as SUNDIALS' own
// band solver does.

struct BandLu {
  std::vector<sunindextype> pivot;
  sunindextype last_flag = 0;
};
BandLu& content(SUNLinearSolver s) { return *static_cast<BandLu*>(s->content); }

// Band LU with partial pivoting for lower bandwidth ML known at compile time (the column's
// systems have 1, or 2 with a sink), or any bandwidth when ML is 0.
template <int ML>
sunindextype factor(SUNMatrix a, std::vector<sunindextype>& pivot) {
  const sunindextype n = SM_COLUMNS_B(a), ml = ML > 0 ? ML : SM_LBAND_B(a), smu = ML > 0 ? 2 * ML : SM_SUBAND_B(a);
  double** cols = SM_COLS_B(a);
  auto column = [=](sunindextype j) { return cols[j] + smu; };
  pivot.resize(static_cast<std::size_t>(n));
  for (sunindextype k = 0; k < n; ++k) {
    double* col_k = column(k);
    const sunindextype last_row = std::min(n - 1, k + ml);
    sunindextype p = k;
    for (sunindextype i = k + 1; i <= last_row; ++i)
      if (std::abs(col_k[i - k]) > std::abs(col_k[p - k])) p = i;
    pivot[static_cast<std::size_t>(k)] = p;
    if (col_k[p - k] == 0.0) return k + 1;  // singular
    const sunindextype last_col = std::min(n - 1, k + smu);
    if (p != k)
      for (sunindextype j = k; j <= last_col; ++j) std::swap(column(j)[k - j], column(j)[p - j]);
    const double multiplier = -1.0 / col_k[0];
    for (sunindextype i = k + 1; i <= last_row; ++i) col_k[i - k] *= multiplier;
    for (sunindextype j = k + 1; j <= last_col; ++j) {
      double* col_j = column(j);
      const double a_kj = col_j[k - j];
      for (sunindextype i = k + 1; i <= last_row; ++i) col_j[i - j] += a_kj * col_k[i - k];
    }
  }
  return 0;
}

template <int ML>
void back_substitute(SUNMatrix a, const std::vector<sunindextype>& pivot, double* b) {
  const sunindextype n = SM_COLUMNS_B(a), ml = ML > 0 ? ML : SM_LBAND_B(a), smu = ML > 0 ? 2 * ML : SM_SUBAND_B(a);
  double* const* cols = SM_COLS_B(a);
  for (sunindextype k = 0; k + 1 < n; ++k) {  // L y = P b
    const sunindextype p = pivot[static_cast<std::size_t>(k)];
    if (p != k) std::swap(b[k], b[p]);
    const double bk = b[k];
    const double* col_k = cols[k] + smu;
    const sunindextype last_row = std::min(n - 1, k + ml);
    for (sunindextype i = k + 1; i <= last_row; ++i) b[i] += bk * col_k[i - k];
  }
  for (sunindextype k = n - 1; k >= 0; --k) {  // U x = y
    const double* col_k = cols[k] + smu;
    b[k] /= col_k[0];
    const double bk = -b[k];
    for (sunindextype i = std::max<sunindextype>(0, k - smu); i < k; ++i) b[i] += bk * col_k[i - k];
  }
}

// The storage layout the fixed-bandwidth versions assume: mu = ml and smu = mu + ml.
int fixed_bandwidth(SUNMatrix a) {
  const sunindextype ml = SM_LBAND_B(a);
  if (SM_UBAND_B(a) != ml || SM_SUBAND_B(a) != 2 * ml) return 0;
  return ml == 1 || ml == 2 ? static_cast<int>(ml) : 0;
}

// Tridiagonal (ml = mu = 1, smu = 2): the same algorithm written out. In column k, c[0] is
// a(k,k) and c[1] a(k+1,k); the next column holds a(k,k+1) at [-1], a(k+1,k+1) at [0]; the
// one after holds the fill a(k,k+2) at [-2] and a(k+1,k+2) at [-1].
sunindextype factor_tridiagonal(SUNMatrix a, std::vector<sunindextype>& pivot) {
  const sunindextype n = SM_COLUMNS_B(a);
  double** cols = SM_COLS_B(a);
  pivot.resize(static_cast<std::size_t>(n));
  for (sunindextype k = 0; k < n; ++k) {
    double* c = cols[k] + 2;
    pivot[static_cast<std::size_t>(k)] = k;
    if (k + 1 == n) return c[0] == 0.0 ? k + 1 : 0;
    double* next = cols[k + 1] + 2;
    double* after = k + 2 < n ? cols[k + 2] + 2 : nullptr;
    if (std::abs(c[1]) > std::abs(c[0])) {
      pivot[static_cast<std::size_t>(k)] = k + 1;
      std::swap(c[0], c[1]);
      std::swap(next[-1], next[0]);
      if (after) std::swap(after[-2], after[-1]);
    }
    if (c[0] == 0.0) return k + 1;
    const double multiplier = -c[1] / c[0];
    c[1] = multiplier;
    next[0] += multiplier * next[-1];
    if (after) after[-1] += multiplier * after[-2];
  }
  return 0;
}

void back_substitute_tridiagonal(SUNMatrix a, const std::vector<sunindextype>& pivot, double* b) {
  const sunindextype n = SM_COLUMNS_B(a);
  double* const* cols = SM_COLS_B(a);
  for (sunindextype k = 0; k + 1 < n; ++k) {
    if (pivot[static_cast<std::size_t>(k)] != k) std::swap(b[k], b[k + 1]);
    b[k + 1] += b[k] * cols[k][3];
  }
  for (sunindextype k = n - 1; k >= 0; --k) {
    const double* c = cols[k] + 2;
    b[k] /= c[0];
    if (k >= 1) b[k - 1] -= b[k] * c[-1];
    if (k >= 2) b[k - 2] -= b[k] * c[-2];
  }
}

sunindextype factor(SUNMatrix a, std::vector<sunindextype>& pivot) {
  switch (fixed_bandwidth(a)) {
    case 1: return factor_tridiagonal(a, pivot);
    case 2: return factor<2>(a, pivot);
    default: return factor<0>(a, pivot);
  }
}

void back_substitute(SUNMatrix a, const std::vector<sunindextype>& pivot, double* b) {
  switch (fixed_bandwidth(a)) {
    case 1: return back_substitute_tridiagonal(a, pivot, b);
    case 2: return back_substitute<2>(a, pivot, b);
    default: return back_substitute<0>(a, pivot, b);
  }
}

SUNLinearSolver_Type solver_type(SUNLinearSolver) { return SUNLINEARSOLVER_DIRECT; }
SUNLinearSolver_ID solver_id(SUNLinearSolver) { return SUNLINEARSOLVER_CUSTOM; }
int initialize(SUNLinearSolver s) {
  content(s).last_flag = 0;
  return SUNLS_SUCCESS;
}
int setup(SUNLinearSolver s, SUNMatrix a) {
  if (SUNMatGetID(a) != SUNMATRIX_BAND) return content(s).last_flag = SUNLS_ILL_INPUT;
  content(s).last_flag = factor(a, content(s).pivot);
  return content(s).last_flag > 0 ? SUNLS_LUFACT_FAIL : SUNLS_SUCCESS;
}
int solve(SUNLinearSolver s, SUNMatrix a, N_Vector x, N_Vector b, double) {
  N_VScale(1.0, b, x);
  back_substitute(a, content(s).pivot, N_VGetArrayPointer(x));
  content(s).last_flag = 0;
  return SUNLS_SUCCESS;
}
sunindextype last_flag(SUNLinearSolver s) { return content(s).last_flag; }
int free_solver(SUNLinearSolver s) {
  if (!s) return SUNLS_SUCCESS;
  delete static_cast<BandLu*>(s->content);
  s->content = nullptr;
  SUNLinSolFreeEmpty(s);
  return SUNLS_SUCCESS;
}

int zero_band(SUNMatrix a) {
  std::fill_n(SM_DATA_B(a), SM_LDATA_B(a), 0.0);
  return 0;
}

}  // namespace

ScopedStepNorm::ScopedStepNorm(StepNorm norm) : norm_(norm), previous_(installed_norm) { installed_norm = &norm_; }
ScopedStepNorm::~ScopedStepNorm() { installed_norm = previous_; }

void use_compiled_zero(SUNMatrix band) { band->ops->zero = zero_band; }

void use_compiled_vector_ops(N_Vector v) {
  auto* ops = v->ops;
  ops->nvlinearsum = linear_sum;
  ops->nvconst = constant;
  ops->nvprod = product;
  ops->nvdiv = divide;
  ops->nvscale = scale;
  ops->nvabs = absolute;
  ops->nvinv = inverse;
  ops->nvaddconst = add_constant;
  ops->nvdotprod = dot;
  ops->nvmaxnorm = max_norm;
  ops->nvwrmsnorm = wrms_norm;
  ops->nvwrmsnormmask = wrms_norm_masked;
  ops->nvmin = minimum;
  ops->nvwl2norm = weighted_l2_norm;
  ops->nvl1norm = l1_norm;
  ops->nvcompare = compare;
  ops->nvinvtest = inverse_test;
  ops->nvlinearcombination = linear_combination;
  ops->nvscaleaddmulti = scale_add_multi;
  ops->nvdotprodmulti = dot_multi;
  ops->nvdotprodlocal = dot;
  ops->nvmaxnormlocal = max_norm;
  ops->nvminlocal = minimum;
  ops->nvl1normlocal = l1_norm;
  ops->nvinvtestlocal = inverse_test;
  ops->nvwsqrsumlocal = weighted_square_sum;
  ops->nvwsqrsummasklocal = weighted_square_sum_masked;
}

SUNLinearSolver new_direct_solver(SUNContext context, void* content, const DirectSolverOps& ops) {
  SUNLinearSolver s = SUNLinSolNewEmpty(context);
  if (!s) return nullptr;
  s->content = content;
  s->ops->gettype = solver_type;
  s->ops->getid = solver_id;
  s->ops->initialize = ops.initialize;
  s->ops->setup = ops.setup;
  s->ops->solve = ops.solve;
  s->ops->lastflag = ops.last_flag;
  s->ops->free = ops.free;
  return s;
}

SUNLinearSolver make_band_lu_solver(N_Vector like, SUNContext context) {
  if (N_VGetVectorID(like) != SUNDIALS_NVEC_SERIAL) return nullptr;
  auto* content = new BandLu;
  SUNLinearSolver s = new_direct_solver(context, content, {initialize, setup, solve, last_flag, free_solver});
  if (!s) delete content;
  return s;
}

}  // namespace wetfront::solver::detail
