#!/usr/bin/python3
"""Figures from a wetfront run file (netCDF-4 / CF-1.10, layout in docs/hdf5-layout.md), read with xarray.

Writes four PNG files next to each other:
  <stem>_sensor_heads.png   pressure head (cm) over time at each sensor depth, interpolated
                            linearly in depth between cell centres
  <stem>_water_content.png  water-content profiles at the chosen dates
  <stem>_balance.png        cumulative water-balance terms and the balance error (mm)
  <stem>_recharge.png       recharge per visit interval (mm): the model's drainage at the
                            recharge plane beside the Darcy and water-table estimates

Water amounts are shown in mm, as in the report; pressure heads stay in cm of water.

Usage:
  plot_run.py RUN.h5 [--out DIR] [--dates 2025-05-01,2025-06-15]

Dates are calendar dates (ISO 8601); each is shown at the nearest output time.
Without --dates the first, middle and last output times are shown.
Needs Debian's python3 with python3-xarray, python3-netcdf4, numpy and matplotlib.
"""
import argparse
import datetime as dt
import pathlib
import sys

import matplotlib

matplotlib.use("Agg")
import matplotlib.dates as mdates  # noqa: E402
import matplotlib.pyplot as plt  # noqa: E402
import numpy as np  # noqa: E402
import xarray as xr  # noqa: E402

MM_PER_CM = 10.0


class RunFileProblem(Exception):
    pass


def open_group(path, group=None):
    """The group as an xarray Dataset with times decoded to dates (loaded, file closed);
    None when the file has no such group."""
    try:
        with xr.open_dataset(path, group=group) as dataset:
            return dataset.load()
    except (OSError, ValueError, KeyError, AttributeError) as error:
        if group is None:
            raise RunFileProblem(f"cannot open '{path}' as a netCDF-4 file (a wetfront run file of "
                                 f"record_format_version 2 or later): {error}") from error
        return None


def load(path):
    root = open_group(path)
    if str(root.attrs.get("record_format", "")) != "wetfront run record":
        raise RunFileProblem(f"'{path}' is not a wetfront run record (no root attribute record_format)")
    if "time" not in root.coords or "pressure_head" not in root:
        raise RunFileProblem(f"'{path}' has no profiles at the root: a run file of an older layout? "
                             f"(record_format_version {root.attrs.get('record_format_version', 'missing')}); "
                             "write it again with this version of wetfront")
    if root.sizes["time"] == 0:
        raise RunFileProblem(f"'{path}' holds no output times: nothing to plot")
    data = {
        "site": str(root.attrs.get("site_name", path)),
        "start": np.datetime64(str(root.attrs["run_start_date"])),
        "complete": int(root.attrs.get("complete", 0)) == 1,
        "failure": None,
        "root": root,
        "balance": open_group(path, "balance"),
        "visits": open_group(path, "visits"),
        "sensors": open_group(path, "sensors"),
        "darcy": open_group(path, "recharge_estimates/darcy"),
        "water_table": open_group(path, "recharge_estimates/water_table"),
    }
    if "failure_reason" in root.attrs:
        data["failure"] = (float(root.attrs["failure_time_days"]), float(root.attrs["failure_depth_cm"]),
                           str(root.attrs["failure_reason"]))
    return data


def day_of_run(data, when):
    return (np.datetime64(when, "ns") - np.datetime64(data["start"], "ns")) / np.timedelta64(1, "D")


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


def save(figure, target):
    """Writes the figure to target (PNG, 110 dots per inch) and frees it."""
    figure.tight_layout()
    figure.savefig(target, dpi=110)
    plt.close(figure)


def no_data(axis, message):
    axis.text(0.5, 0.5, message, ha="center", va="center", transform=axis.transAxes)


def plot_sensor_heads(data, target):
    root = data["root"]
    figure, axis = plt.subplots(figsize=(9, 5))
    sensors = data["sensors"]
    names = [] if sensors is None else [str(n) for n in sensors["sensor"].values]
    if not names:
        no_data(axis, "no sensors in this run file")
    shown = 0
    for name, depth in zip(names, [] if sensors is None else sensors["depth"].values):
        if not np.isfinite(depth) or depth <= 0:
            continue  # an observation well or core samples (NaN, or 0): their readings carry the depths
        # linear between cell centres, constant beyond the first and last centre
        centres = root["cell_depth"].values
        head = root["pressure_head"].interp(cell_depth=float(np.clip(depth, centres[0], centres[-1])))
        axis.plot(root["time"].values, head.values, label=f"{name} ({depth:g} cm)")
        shown += 1
    axis.set_ylabel("pressure head (cm of water)")
    axis.set_title(title(data, "simulated pressure head at the sensor depths"))
    format_time_axis(axis)
    axis.grid(True, alpha=0.3)
    if shown:
        axis.legend()
    save(figure, target)


def choose_times(data, dates):
    """Indices of the output times nearest to each requested calendar date."""
    times = data["root"]["time"].values
    if not dates:
        return sorted({0, len(times) // 2, len(times) - 1})
    first, last = (np.datetime64(times[0], "D"), np.datetime64(times[-1], "D"))
    chosen = []
    for date in dates:
        day = np.datetime64(date.date(), "D")
        if not (first <= day <= last):
            raise RunFileProblem(f"--dates: {date.date()} is outside the output times of the run ({first} to {last})")
        chosen.append(int(np.argmin(np.abs(times - np.datetime64(date, "ns")))))
    return chosen


def plot_water_content(data, dates, target):
    root = data["root"]
    figure, axis = plt.subplots(figsize=(6, 7))
    for index in choose_times(data, dates):
        when = root["time"].values[index]
        label = f"{np.datetime_as_string(when, unit='D')} (day {day_of_run(data, when):g})"
        axis.plot(root["water_content"].values[index], root["cell_depth"].values, marker=".", label=label)
    axis.invert_yaxis()
    axis.set_xlabel("water content (cm3/cm3)")
    axis.set_ylabel("depth below the soil surface (cm)")
    axis.set_title(title(data, "water-content profiles"))
    axis.grid(True, alpha=0.3)
    axis.legend()
    save(figure, target)


def plot_balance(data, target):
    balance = data["balance"]
    if balance is None:
        raise RunFileProblem("the run file has no group 'balance'")
    times = balance["time"].values
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
        upper.plot(times, MM_PER_CM * balance[name].values, label=label)
    storage = balance["soil_storage"].values
    upper.plot(times, MM_PER_CM * (storage - storage[0]), "k--", label="soil storage change")
    upper.set_ylabel("cumulative since start (mm)")
    upper.set_title(title(data, "cumulative water balance (fluxes positive downward)"))
    upper.grid(True, alpha=0.3)
    upper.legend(fontsize="small", ncol=2)
    lower.plot(times, MM_PER_CM * balance["balance_error"].values, color="tab:red")
    lower.set_ylabel("balance error (mm)")
    lower.grid(True, alpha=0.3)
    format_time_axis(lower)
    save(figure, target)


def plot_recharge(data, target):
    """Bars per visit interval (drawn across the interval): the model's drainage at the recharge
    plane, the Darcy estimate from the tensiometer pair and the water-table-fluctuation estimate."""
    visits = data["visits"]
    figure, axis = plt.subplots(figsize=(9, 5))
    if visits is None or "plane_flux" not in visits or visits.sizes.get("interval_end", 0) == 0:
        no_data(axis, "no visit intervals in this run file")
        axis.set_title(title(data, "recharge per visit interval"))
        save(figure, target)
        return
    starts = visits["interval_start"].values
    ends = visits["interval_end"].values
    widths = (ends - starts) / np.timedelta64(1, "D")
    plane = visits["plane_depth"].values[0] if visits.sizes.get("plane_depth", 0) else float("nan")
    series = [("model drainage" + (f" at {plane:g} cm" if np.isfinite(plane) else ""),
               visits["plane_flux"].isel(plane_depth=0).values, "tab:blue")]
    for key, label, colour in (("darcy", "Darcy estimate", "tab:orange"),
                               ("water_table", "water-table estimate", "tab:green")):
        group = data[key]
        if group is not None and "amount" in group and group.sizes.get("interval_end", 0) == len(ends):
            series.append((label, group["amount"].values, colour))
    slot = 1.0 / len(series)
    for offset, (label, amount, colour) in enumerate(series):
        shown = np.isfinite(amount)
        left = starts + ((ends - starts) * (offset * slot))
        axis.bar(left[shown], MM_PER_CM * amount[shown], width=slot * widths[shown] * 0.9, align="edge",
                 color=colour, label=f"{label} ({int(shown.sum())} of {len(amount)} intervals)")
    axis.axhline(0.0, color="black", linewidth=0.8)
    axis.set_ylabel("recharge in the interval (mm, down +)")
    axis.set_title(title(data, "recharge per visit interval: model beside the field estimates"))
    format_time_axis(axis)
    axis.grid(True, axis="y", alpha=0.3)
    axis.legend(fontsize="small")
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
    targets = [out / f"{stem}_{kind}.png" for kind in ("sensor_heads", "water_content", "balance", "recharge")]
    try:
        if not args.run_file.is_file():
            raise RunFileProblem(f"cannot open '{args.run_file}': no such file")
        data = load(args.run_file)
        choose_times(data, args.dates)  # refuse bad dates before writing anything
        out.mkdir(parents=True, exist_ok=True)
        plot_sensor_heads(data, targets[0])
        plot_water_content(data, args.dates, targets[1])
        plot_balance(data, targets[2])
        plot_recharge(data, targets[3])
    except RunFileProblem as problem:
        print(f"plot_run.py: {problem}", file=sys.stderr)
        return 1
    for target in targets:
        print(target)
    return 0


if __name__ == "__main__":
    sys.exit(main())
