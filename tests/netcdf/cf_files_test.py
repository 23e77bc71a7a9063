#!/usr/bin/python3
"""The demo's run file, small sweep, calibration and anchored-season files and the demo network's summary are netCDF-4 files that follow CF-1.10, read by
the tools hydrologists use: xarray (default engine, netCDF-C underneath), ncdump, UDUNITS-2.

Usage: cf_files_test.py WETFRONT_PROGRAM DEMO_DIRECTORY
Exit code 77 (skipped) when python3-xarray is not installed; any other missing tool fails.
"""
import ctypes
import ctypes.util
import pathlib
import shutil
import subprocess
import sys
import tempfile
import warnings

try:
    import xarray as xr
except ImportError:
    sys.exit(77)
import netCDF4
import numpy as np

DIMENSION_WITHOUT_VARIABLE = "This is a netCDF dimension but not a netCDF variable."


class Checks:
    def __init__(self):
        self.failures = []

    def expect(self, condition, message):
        if not condition:
            self.failures.append(message)


def group_paths(group, prefix=""):
    """Every group below `group`, as paths ("/balance", "/inputs/layers", ...)."""
    for name, child in group.groups.items():
        path = f"{prefix}/{name}"
        yield path, child
        yield from group_paths(child, path)


def every_variable(dataset):
    """(group path, variable) over the whole file, root first."""
    for variable in dataset.variables.values():
        yield "/", variable
    for path, group in group_paths(dataset):
        for variable in group.variables.values():
            yield path, variable


class Udunits:
    """UDUNITS-2 through its C library (Debian libudunits2-0, database from udunits-data)."""

    def __init__(self):
        name = ctypes.util.find_library("udunits2") or "libudunits2.so.0"
        self.library = ctypes.CDLL(name)
        self.library.ut_read_xml.restype = ctypes.c_void_p
        self.library.ut_read_xml.argtypes = [ctypes.c_char_p]
        self.library.ut_parse.restype = ctypes.c_void_p
        self.library.ut_parse.argtypes = [ctypes.c_void_p, ctypes.c_char_p, ctypes.c_int]
        self.library.ut_free.argtypes = [ctypes.c_void_p]
        self.library.ut_set_error_message_handler.restype = ctypes.c_void_p
        self.library.ut_set_error_message_handler.argtypes = [ctypes.c_void_p]
        self.library.ut_set_error_message_handler(self.library.ut_ignore)
        self.system = self.library.ut_read_xml(None)
        if not self.system:
            raise RuntimeError("UDUNITS-2 could not read its unit database")

    def parses(self, text):
        unit = self.library.ut_parse(self.system, text.encode(), 2)  # UT_UTF8
        if not unit:
            return False
        self.library.ut_free(unit)
        return True


def check_netcdf_file(checks, path, udunits):
    """What every wetfront file must pass: CF attribute, every group opens in xarray with its
    coordinates, times decode to dates, ncdump reads the header, every units string parses."""
    name = path.name
    dump = subprocess.run(["ncdump", "-h", str(path)], capture_output=True, text=True)
    checks.expect(dump.returncode == 0, f"{name}: ncdump -h failed: {dump.stderr.strip()}")
    checks.expect('Conventions = "CF-1.10"' in dump.stdout, f"{name}: ncdump shows no Conventions")
    checks.expect("phony_dim" not in dump.stdout, f"{name}: a dimension without a dimension scale")

    with netCDF4.Dataset(path) as nc:
        checks.expect(getattr(nc, "Conventions", "") == "CF-1.10", f"{name}: Conventions attribute")
        for group_path, variable in every_variable(nc):
            where = f"{name}:{group_path.rstrip('/')}/{variable.name}"
            attributes = variable.ncattrs()
            checks.expect("long_name" in attributes, f"{where} has no long_name")
            if variable.dtype == str:
                checks.expect("units" not in attributes, f"{where} is text but has units")
            if "units" in attributes:
                units = variable.getncattr("units")
                checks.expect(udunits.parses(units), f"{where}: UDUNITS-2 cannot parse units '{units}'")
            if variable.getncattr("standard_name") == "time" if "standard_name" in attributes else False:
                checks.expect(variable.units.startswith("days since "), f"{where}: time units {variable.units}")
        groups = [("/", nc)] + list(group_paths(nc))
        for group_path, group in groups:
            with warnings.catch_warnings():
                warnings.simplefilter("ignore")
                opened = xr.open_dataset(path, group=None if group_path == "/" else group_path)
            with opened:
                where = f"{name}:{group_path}"
                for dimension in opened.dims:
                    # A group sees its own dimensions: the coordinate variable, when there is
                    # one, is in the group and comes out as the dimension's coordinate.
                    checks.expect(dimension in group.dimensions, f"{where}: dimension {dimension} is not the group's own")
                    if dimension in group.variables:
                        checks.expect(dimension in opened.coords, f"{where}: {dimension} is not a coordinate")
                for variable_name, variable in opened.variables.items():
                    if variable.attrs.get("standard_name") == "time" or variable.encoding.get("units", "").startswith(
                            "days since"):
                        checks.expect(np.issubdtype(variable.dtype, np.datetime64),
                                      f"{where}/{variable_name}: times not decoded to dates")
                opened.load()


def check_run_root(checks, path):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        run = xr.open_dataset(path)
    with run:
        for variable in ("pressure_head", "water_content", "conductivity", "sink_rate"):
            checks.expect(variable in run.data_vars, f"root has no {variable}")
            if variable in run.data_vars:
                checks.expect(run[variable].dims == ("time", "cell_depth"), f"{variable} dims {run[variable].dims}")
        checks.expect(run["face_flux"].dims == ("time", "face_depth"), "face_flux on time and face_depth")
        checks.expect(np.issubdtype(run["time"].dtype, np.datetime64), "root time decoded to dates")
        # The demo's run starts on 2025-04-01 (examples/demo/site.toml).
        checks.expect(run["time"].values[0] == np.datetime64("2025-04-01T00:00:00"), "first output time")
        for depth in ("cell_depth", "face_depth"):
            checks.expect(depth in run.coords, f"{depth} is a coordinate")
            checks.expect(run[depth].attrs.get("standard_name") == "depth", f"{depth} standard_name")
            checks.expect(run[depth].attrs.get("positive") == "down", f"{depth} positive down")
            checks.expect(bool(np.all(np.diff(run[depth].values) > 0)), f"{depth} increases downward")
        # Depth coordinates select like any other: the head 30 cm down on the second day.
        head = run["pressure_head"].sel(cell_depth=30.0, method="nearest").isel(time=1)
        checks.expect(np.isfinite(float(head)), "head selectable by depth and time")
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        sensors = xr.open_dataset(path, group="sensors")
    with sensors:
        checks.expect(sensors["depth"].dims == ("sensor",), "sensor depth along the sensor dimension")
        checks.expect("sensor" in sensors.coords, "sensor names are the sensor coordinate")
        checks.expect("depth" in sensors.coords, "sensor depth is an auxiliary coordinate, not a data variable")


def check_output_times(checks, path, interval_days):
    """Regular output times are start + index x interval, bit for bit (no repeated addition)."""
    with netCDF4.Dataset(path) as nc:
        days = np.asarray(nc.variables["time"][:], dtype=float)
    index = np.round(days / interval_days)
    regular = np.abs(days - index * interval_days) < 1e-9
    checks.expect(regular.sum() > 100, f"only {regular.sum()} regular output times")
    checks.expect(np.array_equal(days[regular], index[regular] * interval_days),
                  "regular output times differ from index x interval")


def main(program, demo):
    checks = Checks()
    udunits = Udunits()
    with tempfile.TemporaryDirectory(prefix="wetfront-netcdf-") as scratch:
        scratch = pathlib.Path(scratch)
        run_path = scratch / "run.h5"
        done = subprocess.run([program, "run", str(pathlib.Path(demo) / "site.toml"), "--out", str(run_path), "--quiet"],
                              capture_output=True, text=True)
        if done.returncode != 0:
            print(done.stdout, done.stderr)
            return 1
        check_netcdf_file(checks, run_path, udunits)
        check_run_root(checks, run_path)

        # The demo with 0.1-day output: 0.1 is not a binary fraction, so repeated addition drifts.
        tenth = scratch / "tenth"
        shutil.copytree(demo, tenth)
        site = (tenth / "site.toml").read_text()
        checks.expect('output_interval = "1 d"' in site, "demo output interval line")
        (tenth / "site.toml").write_text(site.replace('output_interval = "1 d"', 'output_interval = "0.1 d"'))
        tenth_run = scratch / "tenth.h5"
        done = subprocess.run([program, "run", str(tenth / "site.toml"), "--to", "2025-05-01", "--out", str(tenth_run),
                               "--quiet"], capture_output=True, text=True)
        checks.expect(done.returncode == 0, f"0.1-day run failed: {done.stderr}")
        if done.returncode == 0:
            check_output_times(checks, tenth_run, 0.1)

        sweep_path = scratch / "sweep.h5"
        done = subprocess.run([program, "sweep", str(tenth / "site.toml"), "--to", "2025-05-01", "--out",
                               str(sweep_path), "--sample", "3", "--keep", "1", "--threads", "1", "--quiet"],
                              capture_output=True, text=True)
        checks.expect(done.returncode == 0, f"sweep failed: {done.stderr}")
        if done.returncode == 0:
            check_netcdf_file(checks, sweep_path, udunits)

        calibration_path = scratch / "calibration.h5"
        done = subprocess.run([program, "calibrate", str(tenth / "site.toml"), "--to", "2025-05-01", "--out",
                               str(calibration_path), "--threads", "1", "--quiet"], capture_output=True, text=True)
        checks.expect(done.returncode == 0, f"calibration failed: {done.stderr}")
        if done.returncode == 0:
            check_netcdf_file(checks, calibration_path, udunits)

        anchored_path = scratch / "anchored.h5"
        done = subprocess.run([program, "anchor", str(tenth / "site.toml"), "--to", "2025-05-01", "--out",
                               str(anchored_path), "--members", "3", "--threads", "1", "--quiet"],
                              capture_output=True, text=True)
        checks.expect(done.returncode == 0, f"anchored season failed: {done.stderr}")
        if done.returncode == 0:
            check_netcdf_file(checks, anchored_path, udunits)

        # The summary of the demo network (examples/network).
        network = scratch / "network"
        shutil.copytree(pathlib.Path(demo).parent / "network", network, ignore=shutil.ignore_patterns("*.h5"))
        done = subprocess.run([program, "network", str(network / "network.toml"), "--quiet"], capture_output=True,
                              text=True)
        checks.expect(done.returncode == 0, f"network failed: {done.stderr}")
        if done.returncode == 0:
            check_netcdf_file(checks, network / "network.h5", udunits)

    for message in checks.failures:
        print("FAIL:", message)
    return 1 if checks.failures else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1], sys.argv[2]))
