#!/usr/bin/python3
"""Outside check of the van Genuchten retention fit with scipy.optimize.curve_fit.

Fits theta(s) = theta_r + (theta_s - theta_r) [1 + (alpha s)^n]^-(1 - 1/n) (van Genuchten
1980, eq. 3) to tests/soils/data/retention_loam_core.csv by unbounded Levenberg-Marquardt
(MINPACK, method="lm") with the analytic Jacobian, and prints the parameters, standard errors
sqrt(diag(pcov)) (pcov scaled by SSE / (N - p), absolute_sigma=False) and the correlation matrix.
The numbers are copied into tests/soils/test_retention_fit.cpp as check values.

Run: /usr/bin/python3 tests/soils/scipy_retention_check.py   (Debian python3-scipy 1.10.1)
"""
import pathlib

import numpy as np
import scipy
from scipy.optimize import curve_fit

DATA = pathlib.Path(__file__).parent / "data" / "retention_loam_core.csv"


def theta(s, tr, ts, alpha, n):
    m = 1.0 - 1.0 / n
    return tr + (ts - tr) * (1.0 + (alpha * s) ** n) ** (-m)


def jacobian(s, tr, ts, alpha, n):
    m = 1.0 - 1.0 / n
    x = alpha * s
    xn = x ** n
    se = (1.0 + xn) ** (-m)
    with np.errstate(divide="ignore", invalid="ignore"):
        logx = np.where(x > 0, np.log(np.where(x > 0, x, 1.0)), 0.0)
    dlnse_dalpha = -m * n * xn / (alpha * (1.0 + xn))
    dlnse_dn = -np.log1p(xn) / n ** 2 - m * xn * logx / (1.0 + xn)
    rng = ts - tr
    return np.column_stack([1.0 - se, se, rng * se * dlnse_dalpha, rng * se * dlnse_dn])


def main():
    data = np.loadtxt(DATA, delimiter=",", comments="#", skiprows=2)
    s, th = data[:, 0], data[:, 1]
    p0 = [0.05, 0.44, 0.02, 1.5]
    popt, pcov = curve_fit(theta, s, th, p0=p0, jac=jacobian, method="lm",
                           ftol=1e-15, xtol=1e-15, gtol=1e-15, maxfev=100000)
    perr = np.sqrt(np.diag(pcov))
    corr = pcov / np.outer(perr, perr)
    sse = float(np.sum((theta(s, *popt) - th) ** 2))
    print(f"scipy {scipy.__version__}, {len(s)} points")
    for name, v, e in zip(["theta_r", "theta_s", "alpha", "n"], popt, perr):
        print(f"{name:8s} {v:.12g}  +/- {e:.12g}")
    print(f"SSE {sse:.12g}")
    print("correlation")
    for row in corr:
        print("  " + "  ".join(f"{c:+.9f}" for c in row))


if __name__ == "__main__":
    main()
