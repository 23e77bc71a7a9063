#!/usr/bin/python3
"""A general HDF5 reader (h5py) understands a wetfront run file on its own terms:
long_name on every variable, units on every number, time and depth axes as HDF5 dimension
scales (the netCDF-4 dimensions).

Usage: h5py_reads_run_file.py RUN_FILE.h5   (written by write_sample_run)
"""
import sys

import h5py
import numpy as np


def text(value):
    return value.decode() if isinstance(value, bytes) else str(value)


def scale_name(dataset, dimension):
    """Name of the dimension scale attached to one dimension, or None."""
    try:
        scales = dataset.dims[dimension]
        return scales[0].name if len(scales) > 0 else None
    except (RuntimeError, IndexError):
        return None


def main(path):
    failures = []

    def expect(condition, message):
        if not condition:
            failures.append(message)

    with h5py.File(path, "r") as run:
        expect(text(run.attrs["record_format"]) == "wetfront run record", "record_format")
        expect(int(run.attrs["complete"]) == 1, "complete should be 1")
        expect(text(run.attrs["run_start_date"]) == "2025-04-01", "run_start_date")
        expect("positive downward" in text(run.attrs["sign_convention"]), "sign_convention text")
        for key in ("program_version", "site_name", "input_hash"):
            expect(key in run.attrs, f"root attribute {key}")

        datasets = []
        run.visititems(lambda name, obj: datasets.append(name) if isinstance(obj, h5py.Dataset) else None)
        expect(len(datasets) >= 40, f"only {len(datasets)} datasets")
        for name in datasets:
            attrs = run[name].attrs
            if text(attrs.get("NAME", "")).startswith("This is a netCDF dimension but not a netCDF variable."):
                continue  # a dimension without values, not a variable
            expect("long_name" in attrs, f"/{name} lacks long_name")
            is_text = run[name].dtype.kind in "OSU"
            if is_text:
                expect("units" not in attrs, f"text /{name} has units")

        time = run["time"]
        expect(text(time.attrs["units"]) == "days since 2025-04-01", "time units")
        expect(np.array_equal(time[...], np.arange(31.0)), "time values 0..30")

        head = run["pressure_head"]
        expect(head.shape == (31, 20), f"pressure_head shape {head.shape}")
        expect(text(head.attrs["units"]) == "cm", "pressure_head units")
        # The axes are found through the dimension-scale API, not by naming convention.
        expect(scale_name(head, 0) == "/time", f"pressure_head axis 0 is {scale_name(head, 0)}")
        expect(scale_name(head, 1) == "/cell_depth", f"pressure_head axis 1 is {scale_name(head, 1)}")
        if scale_name(head, 1):
            expect(np.allclose(head.dims[1][0][...], np.arange(20) * 5.0 + 2.5), "cell depths from the scale")

        flux = run["face_flux"]
        expect(scale_name(flux, 1) == "/face_depth", "face_flux attached to face_depth")
        expect(flux.dims[1][0].shape == (21,), "21 faces")
        expect(text(run["face_depth"].attrs["positive"]) == "down", "depth axis positive down")

        for term in ("water_input", "infiltration", "bottom_flux", "soil_storage", "balance_error"):
            ds = run[f"balance/{term}"]
            expect(scale_name(ds, 0) == "/balance/time", f"balance/{term} on the group's time axis")
            expect(text(ds.attrs["units"]) == "cm", f"balance/{term} units")
        plane = run["balance/plane_flux"]
        expect(scale_name(plane, 1) == "/balance/plane_depth", "plane_flux attached to plane_depth")
        expect(np.array_equal(run["balance/time"][...], time[...]), "balance time axis copies /time")

        visits = run["visits"]
        ends = visits["interval_end"][...]
        expect(np.array_equal(ends, [7.0, 14.0, 21.0, 30.0]), f"visit interval ends {ends}")
        expect(scale_name(visits["water_input"], 0) == "/visits/interval_end", "visit table axis")
        # Per-visit rows add up to the season total of the cumulative series.
        for term in ("water_input", "transpiration", "bottom_flux"):
            season = run[f"balance/{term}"][-1] - run[f"balance/{term}"][0]
            expect(abs(visits[term][...].sum() - season) < 1e-12, f"visit {term} sum")
        storage = run["balance/soil_storage"][...]
        expect(abs(visits["storage_change"][...].sum() - (storage[-1] - storage[0])) < 1e-12, "storage change sum")

        layers = run["inputs/layers"]
        names = [text(n) for n in layers["name"][...]]
        expect(names == ["loam topsoil", "sandy loam subsoil"], f"layer names {names}")
        expect(scale_name(layers["name"], 0) == "/inputs/layers/layer", "layer dimension")
        forcing = run["inputs/forcing"]
        expect(forcing["water_input"].shape == (30,), "30 forcing intervals")
        expect(text(forcing["water_input"].attrs["units"]) == "cm/d", "forcing units")
        sensors = run["sensors"]
        expect([text(n) for n in sensors["sensor"][...]][0] == "tensiometer 15 cm", "sensor names")
        expect(scale_name(sensors["depth"], 0) == "/sensors/sensor", "sensor depth along the sensor dimension")
        expect(int(run["run_statistics/steps"][()]) == 412, "run statistics")

        # Field checks per visit interval, each group along its own interval_end (invented sample values).
        darcy = run["recharge_estimates/darcy"]
        expect(scale_name(darcy["amount"], 0) == "/recharge_estimates/darcy/interval_end",
               "Darcy amount on the visit-interval axis")
        expect(text(darcy["amount"].attrs["units"]) == "cm", "Darcy amount units")
        expect(np.isnan(darcy["amount"][0]) and darcy["amount"][1] == 0.12, "Darcy amounts")
        expect([text(a) for a in darcy["agreement"][...]] == ["no estimate", "agree", "agree", "differ"], "Darcy agreement")
        expect([text(n) for n in darcy["sensor"][...]] == ["tensiometer 15 cm", "tensiometer 70 cm"], "Darcy pair")
        table = run["recharge_estimates/water_table"]
        expect(scale_name(table["amount"], 0) == "/recharge_estimates/water_table/interval_end",
               "water-table amount on the visit-interval axis")
        expect(abs(table["specific_yield"][()] - 0.15) < 1e-15, "specific yield")
        expect(text(table["recession_rate"].attrs["units"]) == "cm/d", "recession rate units")
        expect(text(table["end_depth"].attrs["positive"]) == "down", "water-table depth positive down")
        stored = run["stored_water"]
        expect(scale_name(stored["observed"], 0) == "/stored_water/storage_time", "stored water on its time axis")
        expect(text(stored["storage_time"].attrs["units"]) == "days since 2025-04-01", "stored water time units")
        expect(scale_name(stored["observed_change"], 0) == "/stored_water/interval_end",
               "storage change on the visit-interval axis")
        expect(np.allclose(stored["depth"][...], [15.0, 40.0, 70.0]), "stored water depths")

    for message in failures:
        print("FAIL:", message)
    print(f"{len(failures)} failure(s)")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1]))
