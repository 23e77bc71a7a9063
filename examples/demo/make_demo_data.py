#!/usr/bin/python3
"""Writes the field records of the demo site (examples/demo/site.toml).

Everything here is invented: the plot, the weather, the pan, the irrigation and the sensor
readings are synthetic numbers from a seeded random generator, shaped only to look like a
plausible irrigated maize season. They describe no real place and no real measurements.

Run from anywhere:  /usr/bin/python3 examples/demo/make_demo_data.py
The output is the same every time (fixed seed, no clock).
"""
import datetime as dt
import math
import pathlib
import random

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

# Sensors read at the weekly visits: tensiometers (tension, kPa) and water-content probes.
visits = [START + dt.timedelta(days=7 * k) for k in range(1, 29) if START + dt.timedelta(days=7 * k) <= END]
for depth, base in [(30, 12.0), (60, 15.0), (90, 18.0), (120, 20.0)]:
    with open(HERE / f"tensiometer-{depth}cm.csv", "w") as f:
        f.write(INVENTED + f"# Tensiometer at {depth} cm: soil water tension read at each visit.\n")
        f.write("time,tension_kPa\n")
        for v in visits:
            i = (v - START).days
            value = base + 45.0 * season_shape(i) * (60.0 / (depth + 30.0)) + rng.uniform(-3, 3)
            f.write(f"{v.isoformat()}T09:00,{max(value, 2.0):.1f}\n")
with open(HERE / "probe-20cm.csv", "w") as f:
    f.write(INVENTED + "# Water-content probe at 20 cm, read at each visit.\n")
    f.write("time,water content [%]\n")
    for v in visits:
        i = (v - START).days
        f.write(f"{v.isoformat()}T09:00,{30.0 - 12.0 * season_shape(i) + rng.uniform(-2, 2):.1f}\n")
# Two deeper probes (drawn after the ones above, so the earlier files stay as they were):
# wetter and with a smaller seasonal swing than at 20 cm.
for depth, wet, swing in [(50, 32.0, 8.0), (80, 33.0, 5.0)]:
    with open(HERE / f"probe-{depth}cm.csv", "w") as f:
        f.write(INVENTED + f"# Water-content probe at {depth} cm, read at each visit.\n")
        f.write("time,water content [%]\n")
        for v in visits:
            i = (v - START).days
            f.write(f"{v.isoformat()}T09:00,{wet - swing * season_shape(i) + rng.uniform(-1.5, 1.5):.1f}\n")

print("visits = [" + ", ".join(f'"{v.isoformat()}"' for v in visits) + "]")
print(f"rain total {sum(rain[:DAYS - 1]):.0f} mm over {DAYS - 1} days")
