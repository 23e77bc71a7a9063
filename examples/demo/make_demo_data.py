#!/usr/bin/python3
"""Writes the field records of the demo site (examples/demo/site.toml).

Everything here is invented: the plot, the weather, the pan and the irrigation are synthetic
numbers from a seeded random generator, shaped only to look like a plausible irrigated maize
season. The sensor readings, the well levels and the core samples are made from a wetfront run
of the site with a deliberately different "true" subsoil, plus seeded Gaussian noise (see the
section "Field readings made from a model run" below). They describe no real place and no
real measurements.

Run from anywhere, after building:  /usr/bin/python3 examples/demo/make_demo_data.py
(--wetfront PATH names the program if it is not build/cli/wetfront). The output is the same
every time for the same program (fixed seeds, no clock).
"""
import argparse
import datetime as dt
import math
import pathlib
import random
import shutil
import subprocess
import tempfile

import h5py
import numpy as np

HERE = pathlib.Path(__file__).resolve().parent
START = dt.date(2025, 4, 1)
END = dt.date(2025, 10, 18)          # run end (midnight); records run one day past it
DAYS = (END - START).days + 2
INVENTED = "# Invented demo data (synthetic, seeded random numbers); not a real site or real measurements.\n"

rng = random.Random(20250401)


def day(i):
    return START + dt.timedelta(days=i)


def season_shape(i):
    """0 in early April, 1 in mid July."""
    return 0.5 - 0.5 * math.cos(2 * math.pi * (i + 10) / 230.0)


# Rain: wet spring, drier summer, a few autumn storms.
rain = []
for i in range(DAYS):
    wet_chance = 0.35 - 0.22 * season_shape(i)
    amount = 0.0
    if rng.random() < wet_chance:
        amount = round(rng.expovariate(1 / 7.0), 1)
    rain.append(amount)
with open(HERE / "rain.csv", "w") as f:
    f.write(INVENTED + "# Daily rain at the plot gauge, midnight to midnight.\n")
    f.write("date,rain_mm\n")
    for i, r in enumerate(rain):
        f.write(f"{day(i).isoformat()},{r:.1f}\n")

# Irrigation: sprinkler sets of 25-35 mm in four hours, every 9-12 days in the dry months.
with open(HERE / "irrigation.csv", "w") as f:
    f.write(INVENTED + "# Sprinkler irrigation sets; time between sets is no irrigation.\n")
    f.write("start,end,irrigation_mm\n")
    d = dt.date(2025, 6, 10)
    while d < dt.date(2025, 8, 31):
        depth = round(rng.uniform(25, 35), 0)
        f.write(f"{d.isoformat()}T06:00,{d.isoformat()}T10:00,{depth:.0f}\n")
        d += dt.timedelta(days=rng.choice([9, 10, 11, 12]))

# Class A pan, hook gauge read at 08:00 every day or two; topped up when the level falls
# to 75 mm below the rim, bailed back when rain lifts it above 50 mm below the rim.
RIM = 254.0
TOP = RIM - 50.0
LOW = RIM - 75.0
level = TOP - 2.0
rows = [(dt.datetime.combine(START - dt.timedelta(days=1), dt.time(8)), level, "", "")]
last = -1
t = 0
while True:
    step = 2 if day(t).weekday() == 6 or rng.random() < 0.15 else 1
    t = min(t + step, DAYS - 1) if t + step <= DAYS - 1 else DAYS - 1
    caught = 0.0
    evaporated = 0.0
    for k in range(last, t):
        caught += rain[k + 1] if k + 1 < DAYS else 0.0   # rain of the day before 08:00, roughly
        evaporated += 2.5 + 6.0 * season_shape(k) + rng.uniform(-1.0, 1.0)
    level = level - evaporated + caught
    when = dt.datetime.combine(day(t), dt.time(8))
    if level > TOP:
        rows.append((when, level, f"{caught:.1f}", "before_refill"))
        level = TOP
        rows.append((when, level, "", "after_refill"))
    elif level < LOW:
        rows.append((when, level, f"{caught:.1f}", "before_refill"))
        level = TOP
        rows.append((when, level, "", "after_refill"))
    else:
        rows.append((when, level, f"{caught:.1f}", ""))
    last = t
    if day(t) > END:
        break
with open(HERE / "pan-readings.csv", "w") as f:
    f.write(INVENTED + "# Class A pan hook-gauge readings: water level above the pan floor; rain caught since the previous reading.\n")
    f.write("time,level_mm,rain_mm,event\n")
    for when, lvl, caught, event in rows:
        f.write(f"{when.strftime('%Y-%m-%dT%H:%M')},{lvl:.1f},{caught},{event}\n")

# --- Field readings made from a model run -------------------------------------------------
# The sensor readings, well levels and core samples are NOT invented independently: they are
# simulated values of a wetfront run of this site with a "true" soil that differs on purpose
# from the site file's (loam subsoil saturated conductivity 12 cm/d instead of 20 cm/d, van
# Genuchten n 1.4 instead of 1.5; everything else as in site.toml), plus Gaussian noise of a
# stated size from a fixed seed. The site file keeps 20 cm/d and 1.5 (the lab estimate), so the
# report shows how a soil-parameter error looks against the readings.
TRUE_SUBSOIL = {"saturated_conductivity": '"12 cm/d"', "n": "1.4"}
NOISE_HEAD_CM = 5.0                  # tensiometer heads, cm of water
NOISE_WATER_CONTENT = 0.01           # probes and cores, cm3/cm3
NOISE_WELL_CM = 0.5                  # depth to water, cm: a tape or logger reading (common practice)
CM_PER_KPA = 10.1972                 # 1 kPa of tension as cm of water (standard gravity)
noise = np.random.default_rng(20250402)

visits = [START + dt.timedelta(days=7 * k) for k in range(1, 29) if START + dt.timedelta(days=7 * k) <= END]
TENSIOMETER_DEPTHS = [30, 60, 90, 120]
PROBE_DEPTHS = [20, 50, 80]
# The 50 cm probe failed for three visits in July (the cores of 22 July stand in).
PROBE_GAPS = {50: {dt.date(2025, 7, 15), dt.date(2025, 7, 22), dt.date(2025, 7, 29)}}
CORE_DEPTHS = [20, 50, 80, 110, 140]
CORE_VISITS = visits[3::4]           # every fourth visit, cores taken at 10:00
# Dry bulk density of each layer for the core masses, g/cm3: 2.65 (1 - theta_s), the mineral
# particle density of soils/core_samples.hpp (common practice) and the layers' theta_s.
BULK_DENSITY = {"topsoil": 2.65 * (1 - 0.41), "subsoil": 2.65 * (1 - 0.42)}
RING_VOLUME_CM3 = 100.0
# The well: the column's bottom holds the water table at 300 cm, so the model has no moving
# table. The well levels come from an invented aquifer under the plot fed by the model's
# drainage at the recharge plane: dH/dt = drainage / Sy - (H - H_rest) / tau, with H the rise
# above the resting level (300 cm below ground), Sy = 0.10 (as in site.toml) and tau = 40 d.
AQUIFER_SPECIFIC_YIELD = 0.10
AQUIFER_RECESSION_DAYS = 40.0
WELL_TIMES = [dt.datetime.combine(START, dt.time(9))] + [dt.datetime.combine(v, dt.time(9)) for v in visits]


def at(date, hour):
    return dt.datetime.combine(date, dt.time(hour)).strftime("%Y-%m-%dT%H:%M")


def true_site_text(text):
    """site.toml with the true loam subsoil values."""
    head, subsoil = text.split('name = "loam subsoil"', 1)
    block, rest = subsoil.split("[grid]", 1)
    for key, value in TRUE_SUBSOIL.items():
        lines = block.split("\n")
        lines = [f"{key} = {value}" if line.split("=")[0].strip() == key else line for line in lines]
        block = "\n".join(lines)
    return head + 'name = "loam subsoil"' + block + "[grid]" + rest


def write_placeholders(folder):
    """Readings files at the wanted times with placeholder values, so that the run stops at
    those times and stores the simulated values beside them."""
    for depth in TENSIOMETER_DEPTHS:
        with open(folder / f"tensiometer-{depth}cm.csv", "w") as f:
            f.write("time,tension_kPa\n" + "".join(f"{at(v, 9)},10\n" for v in visits))
    for depth in PROBE_DEPTHS:
        with open(folder / f"probe-{depth}cm.csv", "w") as f:
            f.write("time,water content [%]\n" + "".join(f"{at(v, 9)},30\n" for v in visits))
    with open(folder / "well-levels.csv", "w") as f:
        f.write("time,depth to water [m]\n" + "".join(f"{t.strftime('%Y-%m-%dT%H:%M')},3\n" for t in WELL_TIMES))
    with open(folder / "core-samples.csv", "w") as f:
        f.write("time,depth [cm],water content [%]\n")
        for v in CORE_VISITS:
            f.write("".join(f"{at(v, 10)},{d},30\n" for d in CORE_DEPTHS))


def simulate_true_site(program):
    """Runs the true site; returns {(name, time text): simulated value} and the daily
    cumulative drainage at the recharge plane."""
    with tempfile.TemporaryDirectory(prefix="wetfront-demo-") as scratch:
        folder = pathlib.Path(scratch)
        for name in ("rain.csv", "irrigation.csv", "pan-readings.csv"):
            shutil.copy(HERE / name, folder / name)
        (folder / "site.toml").write_text(true_site_text((HERE / "site.toml").read_text()))
        write_placeholders(folder)
        subprocess.run([str(program), "run", str(folder / "site.toml"), "--out", str(folder / "true.h5"), "--quiet"],
                       check=True)
        simulated = {}
        with h5py.File(folder / "true.h5", "r") as run:
            for group in ("pressure_head", "water_content"):
                g = run[f"sensor_comparison/{group}"]
                for name, day, value in zip(g["sensor"][...], g["time"][...], g["simulated"][...]):
                    name = name.decode() if isinstance(name, bytes) else name
                    when = dt.datetime.combine(START, dt.time(0)) + dt.timedelta(minutes=round(float(day) * 1440))
                    simulated[(name, when.strftime("%Y-%m-%dT%H:%M"))] = float(value)
            days = run["time"][...]
            drainage = run["balance/plane_flux"][:, 0]
    return simulated, days, drainage


def well_depths(days, drainage):
    """Depth to water (cm) at WELL_TIMES from the invented aquifer, stepped daily."""
    grid = np.arange(0.0, days[-1] + 1e-9, 0.25)
    cumulative = np.interp(grid, days, drainage)
    rise = np.zeros_like(grid)
    for i in range(1, len(grid)):
        step = grid[i] - grid[i - 1]
        recharge = cumulative[i] - cumulative[i - 1]
        rise[i] = rise[i - 1] + recharge / AQUIFER_SPECIFIC_YIELD - rise[i - 1] * step / AQUIFER_RECESSION_DAYS
    wanted = [(t - dt.datetime.combine(START, dt.time(0))).total_seconds() / 86400 for t in WELL_TIMES]
    return 300.0 - np.interp(wanted, grid, rise)


def main():
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--wetfront", default=str(HERE.parents[1] / "build" / "cli" / "wetfront"),
                        help="the built wetfront program (default: build/cli/wetfront of this repository)")
    args = parser.parse_args()
    simulated, days, drainage = simulate_true_site(pathlib.Path(args.wetfront))
    made = f"# Made from a wetfront run of this site with a true loam subsoil (Ks 12 cm/d, n 1.4; the site file says\n"
    made += "# 20 cm/d and 1.5), plus Gaussian noise from a fixed seed; see make_demo_data.py. Not real measurements.\n"
    for depth in TENSIOMETER_DEPTHS:
        with open(HERE / f"tensiometer-{depth}cm.csv", "w") as f:
            f.write(made + f"# Tensiometer at {depth} cm read at the cup, each visit; noise {NOISE_HEAD_CM:g} cm of water on the head.\n")
            f.write("time,tension_kPa\n")
            for v in visits:
                head = simulated[(f"T{depth}", at(v, 9))] + noise.normal(0.0, NOISE_HEAD_CM)
                f.write(f"{at(v, 9)},{-head / CM_PER_KPA:.1f}\n")
    for depth in PROBE_DEPTHS:
        with open(HERE / f"probe-{depth}cm.csv", "w") as f:
            f.write(made + f"# Water-content probe at {depth} cm, each visit; noise {NOISE_WATER_CONTENT:g} cm3/cm3.\n")
            if depth in PROBE_GAPS:
                f.write("# The probe failed on 15, 22 and 29 July: no readings then.\n")
            f.write("time,water content [%]\n")
            for v in visits:
                theta = simulated[(f"P{depth}", at(v, 9))] + noise.normal(0.0, NOISE_WATER_CONTENT)
                if v in PROBE_GAPS.get(depth, set()):
                    continue
                f.write(f"{at(v, 9)},{100 * theta:.1f}\n")
    with open(HERE / "core-samples.csv", "w") as f:
        f.write(made + f"# Oven-dried cores ({RING_VOLUME_CM3:g} cm3 rings, masses of the soil alone) every fourth visit;\n")
        f.write(f"# noise {NOISE_WATER_CONTENT:g} cm3/cm3 on the water content.\n")
        f.write("time,depth [cm],wet mass [g],dry mass [g],ring volume [cm3]\n")
        for v in CORE_VISITS:
            for depth in CORE_DEPTHS:
                theta = simulated[(f"cores at {depth} cm", at(v, 10))] + noise.normal(0.0, NOISE_WATER_CONTENT)
                dry = BULK_DENSITY["topsoil" if depth < 40 else "subsoil"] * RING_VOLUME_CM3 + noise.normal(0.0, 1.0)
                wet = dry + theta * RING_VOLUME_CM3  # water at 1 g/cm3
                f.write(f"{at(v, 10)},{depth},{wet:.1f},{dry:.1f},{RING_VOLUME_CM3:g}\n")
    depths = well_depths(days, drainage)
    with open(HERE / "well-levels.csv", "w") as f:
        f.write(made.replace("), plus Gaussian", "), its drainage\n# fed to an invented aquifer (Sy 0.10, recession time 40 d), plus Gaussian"))
        f.write(f"# Observation well next to the plot, read at the run start and each visit; noise {NOISE_WELL_CM:g} cm.\n")
        f.write("time,depth to water [m]\n")
        for t, depth in zip(WELL_TIMES, depths):
            f.write(f"{t.strftime('%Y-%m-%dT%H:%M')},{(depth + noise.normal(0.0, NOISE_WELL_CM)) / 100:.3f}\n")
    print("visits = [" + ", ".join(f'"{v.isoformat()}"' for v in visits) + "]")
    print(f"rain total {sum(rain[:DAYS - 1]):.0f} mm over {DAYS - 1} days")


main()
