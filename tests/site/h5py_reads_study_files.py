"""The HDF5 files of `wetfront sweep` and `wetfront calibrate`, read by h5py: every dataset has
a long_name and every number its units, tables hang on dimension scales, and the numbers agree with the CSV.

Usage: h5py_reads_study_files.py WETFRONT DEMO_FOLDER
"""
import csv
import math
import shutil
import subprocess
import sys
import tempfile
from pathlib import Path

import h5py

def every_dataset(group):
    found = []
    group.visititems(lambda name, obj: found.append(obj) if isinstance(obj, h5py.Dataset) else None)
    return found


def check_described(f):
    """long_name everywhere; units on numbers, except columns of mixed units whose long_name
    names the column that gives each row's unit; no units on text (CF-1.10)."""
    for dataset in every_dataset(f):
        assert "long_name" in dataset.attrs, f"{dataset.name} has no long_name"
        if dataset.dtype.kind in "OSU":
            assert "units" not in dataset.attrs, f"text {dataset.name} has units"
        elif "units" not in dataset.attrs:
            long_name = text(dataset.attrs["long_name"])
            assert "unit" in long_name, f"{dataset.name} has no units and its long_name names none"


def scale_name(dataset, dimension):
    scales = dataset.dims[dimension]
    assert len(scales) == 1, f"{dataset.name} dimension {dimension} has {len(scales)} scales"
    return scales[0].name.rsplit("/", 1)[-1]


def text(value):
    return value.decode() if isinstance(value, bytes) else str(value)


def main():
    wetfront, demo = sys.argv[1], Path(sys.argv[2])
    with tempfile.TemporaryDirectory() as tmp:
        site = Path(tmp) / "site"
        shutil.copytree(demo, site, ignore=shutil.ignore_patterns("*.h5", "*-visits.csv"))
        study = (Path(__file__).parent / "data" / "loam-study.toml").read_text()
        site_text = (site / "site.toml").read_text()
        # The demo's own study ([fit] and [[adjustable]] at the end) gives way to the test's.
        cuts = [i for i in (site_text.find("\n[fit]"), site_text.find("\n[[adjustable]]")) if i >= 0]
        if cuts:
            site_text = site_text[: min(cuts) + 1]
        (site / "site.toml").write_text(site_text + "\n" + study)
        common = [str(site / "site.toml"), "--to", "2025-05-10", "--quiet", "--threads", "2"]
        subprocess.run([wetfront, "sweep", *common, "--grid", "--keep", "2"], check=True)
        subprocess.run([wetfront, "calibrate", *common, "--max-runs", "12", "--band-runs", "4"], check=True)

        with h5py.File(site / "site-sweep.h5", "r") as f:
            check_described(f)
            assert text(f.attrs["record_format"]) == "wetfront parameter study"
            assert text(f.attrs["study_kind"]) == "parameter sweep"
            names = [text(n) for n in f["parameters/name"][()]]
            assert names == ["loam subsoil: saturated_conductivity", "loam subsoil: n"], names
            values = f["sets/values"]
            assert values.shape == (9, 2), values.shape
            assert scale_name(values, 0) == "set_number" and scale_name(values, 1) == "parameter_number"
            assert sorted(f["sets/rank"][()].tolist()) == list(range(1, 10))
            recharge = f["sets/interval_recharge"]
            assert scale_name(recharge, 1) == "interval_end"
            assert "days since" in text(f["sets/interval_end"].attrs["units"])
            assert sorted(f["runs"].keys()) == ["rank_1", "rank_2"]
            head = f["runs/rank_1/pressure_head"]
            assert head.shape == (f["runs/rank_1/time"].shape[0], f["runs/rank_1/cell_depth"].shape[0])
            assert scale_name(head, 0) == "time" and scale_name(head, 1) == "cell_depth"
            # The best set in the file is the first row of the CSV.
            best = int(list(f["sets/rank"][()]).index(1))
            with open(site / "site-sweep.csv") as c:
                first = next(csv.DictReader(c))
            assert int(first["set"]) == best + 1
            assert math.isclose(float(first["season recharge [mm]"]), 10 * f["sets/season_recharge"][best], rel_tol=0, abs_tol=0.0051)  # the CSV rounds to 0.01 mm

        with h5py.File(site / "site-calibration.h5", "r") as f:
            check_described(f)
            assert text(f.attrs["study_kind"]) == "calibration"
            assert "stop_reason" in f.attrs
            calibrated = f["parameters/calibrated"][()]
            assert calibrated.shape == (2,)
            assert "covariance" in f["parameters"], "both loam parameters are resolved: a covariance is expected"
            cov = f["parameters/covariance"][()]
            assert cov.shape == (2, 2) and abs(cov[0, 1] - cov[1, 0]) < 1e-15
            assert scale_name(f["parameters/covariance"], 1) == "parameter_number"
            assert [text(u) for u in f["parameters/search_unit"][()]] == ["log10(cm/d)", "1"]
            assert "calibrated" in f["recharge"] and "interval_end" in f["recharge"]
            assert f["runs/calibrated/water_content"].ndim == 2
    print("study files read back")


if __name__ == "__main__":
    main()
