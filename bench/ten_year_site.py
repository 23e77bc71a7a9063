#!/usr/bin/env python3
"""Writes an invented ten-year site with about 1,000 cells, to measure the memory of a long run.

    python3 bench/ten_year_site.py FOLDER [OUTPUT_INTERVAL]

FOLDER receives site.toml, rain.csv and pan.csv (daily, 2015-01-01 to 2024-12-31). The weather is
made up from a fixed seed (wet winters, dry summers); the soil is a sandy loam over a loam, 500 cm
deep, on cells of at most 0.5 cm. No real place or data. Used by bench/README.md ("Memory of a
run").
"""
import datetime
import math
import pathlib
import random
import sys

START = datetime.date(2015, 1, 1)
END = datetime.date(2025, 1, 1)

SITE = """# Invented ten-year site for the memory benchmark (bench/ten_year_site.py); no real place or data.
[site]
name = "Ten-year memory benchmark (invented)"

[run]
start = "{start}"
end = "{end}"
output_interval = "{interval}"
output_size_limit = "100 GB"

[[layers]]
name = "sandy loam"
top = "0 cm"
bottom = "60 cm"
texture = "sandy loam"

[[layers]]
name = "loam"
top = "60 cm"
bottom = "500 cm"
texture = "loam"

[grid]
surface_cell = "0.1 cm"
growth_factor = 1.05
max_cell = "0.5 cm"

[initial]
kind = "water table"
water_table_depth = "600 cm"

[bottom]
kind = "free drainage"

[surface]
max_ponding = "0.5 cm"

[weather]
rain = "rain.csv"

[pan]
daily_evaporation = "pan.csv"
coefficient = 0.75

[crop]
name = "grass"
planting = "{start}"
initial_stage = "10 d"
development_stage = "20 d"
mid_season_stage = "3600 d"
late_season_stage = "20 d"
kc_initial = 0.9
kc_mid = 0.95
kc_end = 0.9
kc_bare_soil = 0.5
evaporation_split = "leaf area index"

[crop.leaf_area_index]
dates = ["{start}"]
values = [2.0]

[crop.root_depth]
dates = ["{start}"]
depths = ["40 cm"]

[recharge]
plane_depth = "300 cm"
"""


def days():
    day = START
    while day < END:
        yield day
        day += datetime.timedelta(days=1)


def main():
    folder = pathlib.Path(sys.argv[1])
    interval = sys.argv[2] if len(sys.argv) > 2 else "1 d"
    folder.mkdir(parents=True, exist_ok=True)
    draw = random.Random(20261202)
    rain = ["# Invented daily rain (seeded random numbers)", "date,rain_mm"]
    pan = ["# Invented daily Class A pan evaporation (seeded random numbers)", "date,pan_evaporation_mm"]
    for day in days():
        season = math.cos(2 * math.pi * (day.timetuple().tm_yday - 15) / 365.25)  # 1 in winter, -1 in summer
        wet = draw.random() < 0.30 + 0.12 * season
        rain.append(f"{day},{draw.expovariate(1 / 7.0) if wet else 0.0:.1f}")
        pan.append(f"{day},{max(0.2, 3.5 - 2.5 * season + draw.gauss(0, 0.6)):.1f}")
    (folder / "rain.csv").write_text("\n".join(rain) + "\n")
    (folder / "pan.csv").write_text("\n".join(pan) + "\n")
    (folder / "site.toml").write_text(SITE.format(start=START, end=END, interval=interval))


if __name__ == "__main__":
    main()
