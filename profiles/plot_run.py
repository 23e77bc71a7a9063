#!/usr/bin/python3
"""Figures from a wetfront run file (HDF5, layout in docs/hdf5-layout.md).

Writes three PNG files next to each other:
  <stem>_sensor_heads.png   pressure head over time at each sensor depth, interpolated
                            linearly in depth between cell centres
  <stem>_water_content.png  water-content profiles at the chosen dates
  <stem>_balance.png        cumulative water-balance terms and the balance error

Usage:
  plot_run.py RUN.h5 [--out DIR] [--dates 2025-05-01,2025-06-15]

Dates are calendar dates (ISO 8601); each is shown at the nearest output time.
Without --dates the first, middle and last output times are shown.
Needs Debian's python3 with h5py, numpy and matplotlib.
"""
import argparse
import datetime as dt
import pathlib
import sys

import h5py
import matplotlib

matplotlib.use("Agg")
import matplotlib.dates as mdates  # noqa: E402
import matplotlib.pyplot as plt  # noqa: E402
import numpy as np  # noqa: E402


def text(value):
    return value.decode() if isinstance(value, bytes) else str(value)


class RunFileProblem(Exception):
    pass


def load(path):
    try:
        run = h5py.File(path, "r")
    except OSError as error:
        raise RunFileProblem(f"cannot open '{path}': {error}") from error
    with run:
        if text(run.attrs.get("record_format", "")) != "wetfront run record":
            raise RunFileProblem(f"'{path}' is not a wetfront run record (no root attribute record_format)")
        data = {
            "site": text(run.attrs["site_name"]),
            "start": dt.datetime.fromisoformat(text(run.attrs["run_start_date"])),
            "complete": int(run.attrs["complete"]) == 1,
            "failure": None,
            "time": run["time"][...],
            "cell_depth": run["cell_depth"][...],
            "head": run["pressure_head"][...],
            "water_content": run["water_content"][...],
            "sensor_names": [text(n) for n in run["sensors/sensor"][...]],
            "sensor_depths": run["sensors/depth"][...],
            "balance": {name: run[f"balance/{name}"][...] for name in (
                "water_input", "actual_evaporation", "transpiration", "runoff", "infiltration",
                "bottom_flux", "soil_storage", "ponded_depth", "balance_error")},
        }
        if "failure_reason" in run.attrs:
            data["failure"] = (float(run.attrs["failure_time_days"]), float(run.attrs["failure_depth_cm"]),
                               text(run.attrs["failure_reason"]))
    if data["time"].size == 0:
        raise RunFileProblem(f"'{path}' holds no output times: nothing to plot")
    return data


def calendar(data, days):
    return [data["start"] + dt.timedelta(days=float(d)) for d in np.atleast_1d(days)]


def title(data, what):
    line = f"{data['site']}: {what}"
    if not data["complete"]:
        if data["failure"]:
            day, depth, reason = data["failure"]
            line += f"\nINCOMPLETE RUN: stopped on day {day:g} at {depth:g} cm ({reason})"
        else:
            line += "\nINCOMPLETE RUN"
    return line


def format_time_axis(axis):
    locator = mdates.AutoDateLocator()
    axis.xaxis.set_major_locator(locator)
    axis.xaxis.set_major_formatter(mdates.ConciseDateFormatter(locator))


def head_at_depth(data, depth_cm):
    """Pressure head at one depth for every output time, linear between cell centres
    (constant beyond the first and last centre)."""
    return np.array([np.interp(depth_cm, data["cell_depth"], row) for row in data["head"]])


def save(figure, target):
    """Writes the figure to target (PNG, 110 dots per inch) and frees it."""
    figure.tight_layout()
    figure.savefig(target, dpi=110)
    plt.close(figure)


def plot_sensor_heads(data, target):
    figure, axis = plt.subplots(figsize=(9, 5))
    times = calendar(data, data["time"])
    if not data["sensor_names"]:
        axis.text(0.5, 0.5, "no sensors in this run file", ha="center", va="center", transform=axis.transAxes)
    for name, depth in zip(data["sensor_names"], data["sensor_depths"]):
        if not np.isfinite(depth) or depth <= 0:
            continue  # an observation well or core samples (NaN, or 0 in older files): their readings carry the depths
        axis.plot(times, head_at_depth(data, depth), label=f"{name} ({depth:g} cm)")
    axis.set_ylabel("pressure head (cm of water)")
    axis.set_title(title(data, "simulated pressure head at the sensor depths"))
    format_time_axis(axis)
    axis.grid(True, alpha=0.3)
    if data["sensor_names"]:
        axis.legend()
    save(figure, target)


def choose_times(data, dates):
    """Indices of the output times nearest to each requested calendar date."""
    days = data["time"]
    if not dates:
        return sorted({0, len(days) // 2, len(days) - 1})
    first, last = calendar(data, [days[0], days[-1]])
    chosen = []
    for date in dates:
        if not (first.date() <= date.date() <= last.date()):
            raise RunFileProblem(
                f"--dates: {date.date()} is outside the output times of the run ({first.date()} to {last.date()})")
        wanted = (date - data["start"]).total_seconds() / 86400.0
        chosen.append(int(np.argmin(np.abs(days - wanted))))
    return chosen


def plot_water_content(data, dates, target):
    figure, axis = plt.subplots(figsize=(6, 7))
    for index in choose_times(data, dates):
        day = data["time"][index]
        label = f"{calendar(data, day)[0]:%Y-%m-%d} (day {day:g})"
        axis.plot(data["water_content"][index], data["cell_depth"], marker=".", label=label)
    axis.invert_yaxis()
    axis.set_xlabel("water content (cm3/cm3)")
    axis.set_ylabel("depth below the soil surface (cm)")
    axis.set_title(title(data, "water-content profiles"))
    axis.grid(True, alpha=0.3)
    axis.legend()
    save(figure, target)


def plot_balance(data, target):
    balance = data["balance"]
    times = calendar(data, data["time"])
    figure, (upper, lower) = plt.subplots(2, 1, figsize=(9, 7), sharex=True, height_ratios=[3, 1])
    curves = [
        ("water_input", "rain and irrigation"),
        ("infiltration", "infiltration (down +)"),
        ("actual_evaporation", "evaporation (out +)"),
        ("transpiration", "transpiration (out +)"),
        ("runoff", "runoff"),
        ("bottom_flux", "bottom flux (down +)"),
    ]
    for name, label in curves:
        upper.plot(times, balance[name], label=label)
    upper.plot(times, balance["soil_storage"] - balance["soil_storage"][0], "k--", label="soil storage change")
    upper.set_ylabel("cumulative since start (cm)")
    upper.set_title(title(data, "cumulative water balance (fluxes positive downward)"))
    upper.grid(True, alpha=0.3)
    upper.legend(fontsize="small", ncol=2)
    lower.plot(times, balance["balance_error"], color="tab:red")
    lower.set_ylabel("balance error (cm)")
    lower.grid(True, alpha=0.3)
    format_time_axis(lower)
    save(figure, target)


def parse_dates(value):
    dates = []
    for item in filter(None, (part.strip() for part in value.split(","))):
        try:
            dates.append(dt.datetime.fromisoformat(item))
        except ValueError as error:
            raise argparse.ArgumentTypeError(f"'{item}' is not an ISO 8601 date (YYYY-MM-DD)") from error
    return dates


def main(argv=None):
    parser = argparse.ArgumentParser(description="PNG figures from a wetfront run file.")
    parser.add_argument("run_file", type=pathlib.Path)
    parser.add_argument("--out", type=pathlib.Path, help="folder for the figures (default: the run file's folder)")
    parser.add_argument("--dates", type=parse_dates, default=[],
                        help="comma-separated dates for the water-content profiles, e.g. 2025-05-01,2025-06-15")
    args = parser.parse_args(argv)
    out = args.out or args.run_file.parent
    stem = args.run_file.stem
    try:
        data = load(args.run_file)
        out.mkdir(parents=True, exist_ok=True)
        targets = [out / f"{stem}_sensor_heads.png", out / f"{stem}_water_content.png", out / f"{stem}_balance.png"]
        plot_sensor_heads(data, targets[0])
        plot_water_content(data, args.dates, targets[1])
        plot_balance(data, targets[2])
    except RunFileProblem as problem:
        print(f"plot_run.py: {problem}", file=sys.stderr)
        return 1
    for target in targets:
        print(target)
    return 0


if __name__ == "__main__":
    sys.exit(main())
