#!/usr/bin/python3
"""Writes the invented laboratory example files in this folder (nothing from a real site).

Retention points follow a van Genuchten curve with theta_r 0.06, theta_s 0.42,
alpha 0.03 /cm, n 1.6 plus a little scatter; ring masses are chosen to match a similar
curve for two rings of 100 cm3.
"""
import random

random.seed(11)


def vg(suction_cm, tr, ts, alpha, n):
    return tr + (ts - tr) * (1 + (alpha * suction_cm) ** n) ** (-(1 - 1 / n))


with open("retention-points.csv", "w") as out:
    out.write("# Invented example: two cores of one layer drained on a hanging column and pressure plates.\n")
    out.write("sample,suction_cm,water_content\n")
    for sample in ("ring A", "ring B"):
        for s in (0, 10, 20, 40, 70, 100, 200, 330, 1000, 3000, 15000):
            out.write(f"{sample},{s},{vg(s, 0.06, 0.42, 0.03, 1.6) + random.uniform(-0.006, 0.006):.4f}\n")

rings = {"ring A": (100.0, 82.0, 231.0), "ring B": (100.0, 80.5, 228.1)}  # volume cm3, tare g, oven-dry g
with open("cores.csv", "w") as out:
    out.write("# Invented example: two 100 cm3 rings, masses in g (ring included).\n")
    out.write("sample,ring_volume_cm3,tare_mass_g,wet_mass_g,oven_dry_mass_g,note\n")
    for name, (vol, tare, dry) in rings.items():
        wet = dry + vol * vg(330, 0.06, 0.42, 0.03, 1.6)
        out.write(f"{name},{vol:.1f},{tare:.1f},{wet:.1f},{dry:.1f},as sampled\n")
with open("suction-steps.csv", "w") as out:
    out.write("# Invented example: equilibrium masses of the rings in cores.csv at each suction step.\n")
    out.write("sample,suction_kPa,wet_mass_g\n")
    for name, (vol, tare, dry) in rings.items():
        for kpa in (0, 1, 2, 4, 10, 33, 100, 1500):
            theta = vg(kpa * 10.197, 0.06, 0.42, 0.03, 1.6) + random.uniform(-0.004, 0.004)
            out.write(f"{name},{kpa},{dry + vol * theta:.1f}\n")
