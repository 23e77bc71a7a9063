#!/usr/bin/python3
"""Writes the invented field example files in this folder.

The readings are synthetic: flows come from the methods' own equations for chosen
parameters (stated below), levels are read every minute or two with a short settling
period first, and each reading is rounded to 0.1 cm the way a crew reads a scale.
Nothing here is from a real site.
"""
import math
import random

random.seed(7)
PI = math.pi


def shape_factor_structured(depth_cm, radius_cm):
    ratio = depth_cm / radius_cm
    return (ratio / (1.992 + 0.091 * ratio)) ** 0.683


def well_outflow_cm3_per_min(depth_cm, radius_cm, kfs_cm_per_d, phi_cm2_per_d):
    c = shape_factor_structured(depth_cm, radius_cm)
    q = (2 * PI * depth_cm**2 / c + PI * radius_cm**2) * kfs_cm_per_d + 2 * PI * depth_cm / c * phi_cm2_per_d
    return q / 1440.0


def disc_inflow_cm3_per_min(head_cm, radius_cm, ks_cm_per_d, alpha_per_cm):
    q = PI * radius_cm**2 * ks_cm_per_d * math.exp(alpha_per_cm * head_cm) * (1 + 4 / (PI * radius_cm * alpha_per_cm))
    return q / 1440.0


def readings(rate_cm3_per_min, area_cm2, start_level_cm, step_min, count, settling):
    """Level readings: the first `settling` intervals fall faster (wetting of the hole)."""
    rows = []
    level = start_level_cm
    for i in range(count):
        rows.append((i * step_min, round(level + random.uniform(-0.04, 0.04), 1), "no" if i < settling else "yes"))
        boost = 1.6 if i < settling else 1.0
        level -= boost * rate_cm3_per_min / area_cm2 * step_min
    return rows


def write(path, head_header, comment, groups):
    with open(path, "w") as out:
        for line in comment:
            out.write(f"# {line}\n")
        out.write(f"{head_header},time [min],water level [cm],steady\n")
        for head, rows in groups:
            for t, level, steady in rows:
                out.write(f"{head:g},{t:g},{level:.1f},{steady}\n")


# Well permeameter: well radius 3 cm, reservoir area 35.4 cm2, structured loam with
# Kfs = 30 cm/d and matric flux potential 250 cm2/d (alpha* = 0.12 /cm).
AREA = 35.4
two = [(depth, readings(well_outflow_cm3_per_min(depth, 3.0, 30.0, 250.0), AREA, 60.0, 2.0, 12, 4)) for depth in (5.0, 15.0)]
write("well-permeameter.csv", "water depth [cm]",
      ["Invented example: constant-head well permeameter, two water depths in one auger hole.",
       "Well radius 3 cm, reservoir cross-section 35.4 cm2. Synthetic readings, no real site."], two)
write("well-permeameter-one-depth.csv", "water depth [cm]",
      ["Invented example: one water depth (single-head analysis). Well radius 3 cm,",
       "reservoir cross-section 35.4 cm2. Synthetic readings, no real site."],
      [(10.0, readings(well_outflow_cm3_per_min(10.0, 3.0, 30.0, 250.0), AREA, 60.0, 2.0, 12, 4))])
# A layered case: a denser layer under the first depth makes the deeper flow barely larger.
q5 = well_outflow_cm3_per_min(5.0, 3.0, 30.0, 250.0)
write("well-permeameter-layered.csv", "water depth [cm]",
      ["Invented example: the deeper water depth reaches a tighter layer, so the flow hardly grows;",
       "the two-head equations then give a negative value. Synthetic readings, no real site."],
      [(5.0, readings(q5, AREA, 60.0, 2.0, 12, 4)), (15.0, readings(1.1 * q5, AREA, 60.0, 2.0, 12, 4))])

# Tension disc: radius 10 cm, tower cross-section 19.6 cm2, Gardner soil Ks = 20 cm/d,
# alpha = 0.05 /cm, heads -15, -6 and -3 cm run from dry to wet.
TOWER = 19.6
disc = [(h, readings(disc_inflow_cm3_per_min(h, 10.0, 20.0, 0.05), TOWER, 45.0, 1.0, 12, 4)) for h in (-15.0, -6.0, -3.0)]
write("tension-disc.csv", "supply head [cm]",
      ["Invented example: tension disc infiltrometer, three supply heads on one disc.",
       "Disc radius 10 cm, water tower cross-section 19.6 cm2. Synthetic readings, no real site."], disc)
