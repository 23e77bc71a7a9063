#!/usr/bin/python3
"""Independent evaluation of the hydraulic model formulas at 30 significant digits (mpmath).

Prints theta(h) and K(h) for the parameter sets used in test_hydraulic_models.cpp. The
formulas are written here directly from the papers, not from the C++ code:
  van Genuchten (1980, SSSAJ 44:892) eq. 3 and eq. 8 (Mualem 1976 with exponent l);
  Ippisch, Vogel & Bastian (2006, Adv. Water Resour. 29:1780) eq. 9-11 (air-entry head h_e);
  Brooks & Corey (1964) retention with Burdine conductivity K = Ks Se^(3 + 2/lambda);
  Gardner (1958) K = Ks exp(a h) with Se = exp(a h).
Run:  /usr/bin/python3 tests/soils/hydraulic_reference_values.py
"""
from mpmath import mp, mpf

mp.dps = 30


def vg_se(alpha, n, h):
    if h >= 0:
        return mpf(1)
    m = 1 - 1 / mpf(n)
    return (1 + (alpha * abs(h)) ** n) ** (-m)


def vg_k(tr, ts, alpha, n, ks, l, h):
    if h >= 0:
        return mpf(ks)
    m = 1 - 1 / mpf(n)
    se = vg_se(alpha, n, h)
    return ks * se ** l * (1 - (1 - se ** (1 / m)) ** m) ** 2


def vg_air_entry(tr, ts, alpha, n, ks, l, he, h):
    if h >= he:
        return ts, mpf(ks)
    m = 1 - 1 / mpf(n)
    sc = vg_se(alpha, n, he)
    s = vg_se(alpha, n, h)
    se = s / sc
    theta = tr + (ts - tr) * se
    f = lambda x: 1 - (1 - x ** (1 / m)) ** m
    k = ks * se ** l * (f(s) / f(sc)) ** 2
    return theta, k


def main():
    heads = [mpf(-1), mpf(-10), mpf(-100), mpf(-1000), mpf(-15000)]
    # Carsel & Parrish (1988) class means, l = 0.5
    sets = {
        "sand": (mpf("0.045"), mpf("0.43"), mpf("0.145"), mpf("2.68"), mpf("712.8")),
        "sandy loam": (mpf("0.065"), mpf("0.41"), mpf("0.075"), mpf("1.89"), mpf("106.1")),
        "loam": (mpf("0.078"), mpf("0.43"), mpf("0.036"), mpf("1.56"), mpf("24.96")),
        "silt loam": (mpf("0.067"), mpf("0.45"), mpf("0.020"), mpf("1.41"), mpf("10.8")),
        "clay": (mpf("0.068"), mpf("0.38"), mpf("0.008"), mpf("1.09"), mpf("4.8")),
    }
    l = mpf("0.5")
    print("# van Genuchten-Mualem: class, h, theta, K")
    for name, (tr, ts, a, n, ks) in sets.items():
        for h in heads:
            se = vg_se(a, n, h)
            print(f'{{"{name}", {mp.nstr(h, 6)}, {mp.nstr(tr + (ts - tr) * se, 17)}, {mp.nstr(vg_k(tr, ts, a, n, ks, l, h), 17)}}},')
    print("# van Genuchten air entry, loam with h_e = -2 cm: h, theta, K")
    tr, ts, a, n, ks = sets["loam"]
    for h in [mpf(-2.5), mpf(-10), mpf(-100), mpf(-1000), mpf(-15000)]:
        th, k = vg_air_entry(tr, ts, a, n, ks, l, mpf(-2), h)
        print(f'{{{mp.nstr(h, 6)}, {mp.nstr(th, 17)}, {mp.nstr(k, 17)}}},')
    print("# Brooks-Corey/Burdine, theta_r 0.05, theta_s 0.40, h_b -20 cm, lambda 0.4, Ks 50: h, theta, K")
    for h in [mpf(-25), mpf(-100), mpf(-1000), mpf(-15000)]:
        se = (mpf(-20) / h) ** mpf("0.4")
        th = mpf("0.05") + mpf("0.35") * se
        k = 50 * se ** (3 + 2 / mpf("0.4"))
        print(f'{{{mp.nstr(h, 6)}, {mp.nstr(th, 17)}, {mp.nstr(k, 17)}}},')
    print("# Gardner, theta_r 0.02, theta_s 0.38, a 0.05 1/cm, Ks 30: h, theta, K")
    for h in [mpf(-1), mpf(-10), mpf(-100), mpf(-500)]:
        e = mp.exp(mpf("0.05") * h)
        print(f'{{{mp.nstr(h, 6)}, {mp.nstr(mpf("0.02") + mpf("0.36") * e, 17)}, {mp.nstr(30 * e, 17)}}},')


if __name__ == "__main__":
    main()
