"""The Python module on the demo site: load, read and change values, run, the arrays, errors."""
import numpy as np
import pytest

import wetfront


def test_load_reads_layer_parameters(demo):
    site = wetfront.load_site(str(demo))
    assert site.layer_names == ["sandy loam topsoil", "loam subsoil"]
    # Values as written in examples/demo/site.toml (loam subsoil layer).
    assert site.get("saturated_conductivity", layer="loam subsoil") == pytest.approx(20.0)
    assert site.get("n", layer=1) == pytest.approx(1.5)
    assert site.layers[1]["units"]["saturated_conductivity"] == "cm/d"


def test_set_changes_one_value(demo):
    site = wetfront.load_site(str(demo))
    site.set("saturated_conductivity", 5.0, layer="loam subsoil")
    assert site.get("saturated_conductivity", layer=1) == pytest.approx(5.0)
    assert site.get("n", layer=1) == pytest.approx(1.5)
    site.set("kc_mid", 1.0)
    assert site.get("kc_mid") == pytest.approx(1.0)


def test_unknown_key_and_layer(demo):
    site = wetfront.load_site(str(demo))
    with pytest.raises(KeyError):
        site.get("conductivity", layer=0)
    with pytest.raises(KeyError):
        site.get("n", layer="no such layer")
    with pytest.raises(IndexError):
        site.get("n", layer=5)


def test_unphysical_value_raises_input_error(demo):
    site = wetfront.load_site(str(demo))
    with pytest.raises(wetfront.InputError):
        site.set("n", 0.5, layer="loam subsoil")  # van Genuchten needs n > 1
    assert site.get("n", layer=1) == pytest.approx(1.5)  # unchanged


def test_run_balance_closes_and_recharge_follows_conductivity(demo):
    site = wetfront.load_site(str(demo))
    first = site.run()
    assert first.complete
    season = first.season
    # Water balance of the column: storage change = infiltration - transpiration - bottom flux.
    assert abs(season["balance_error"]) < 1e-6
    assert season["storage_change"] == pytest.approx(
        season["infiltration"] - season["transpiration"] - season["bottom_flux"], abs=1e-6)
    visits = first.visits
    assert np.all(np.abs(visits["balance_error_change"]) < 1e-6)
    assert visits["recharge"].sum() == pytest.approx(season["recharge"], abs=1e-6)

    profiles = first.profiles
    cells = profiles["cell_depth"].size
    assert profiles["head"].shape == (profiles["time"].size, cells)
    assert profiles["water_content"].shape == profiles["head"].shape
    assert profiles["flux"].shape == (profiles["time"].size, profiles["face_depth"].size)
    assert np.all(np.diff(profiles["time"]) > 0)

    site.set("saturated_conductivity", 5.0, layer="loam subsoil")
    second = site.run()
    assert second.complete
    assert abs(second.season["balance_error"]) < 1e-6
    assert abs(second.season["recharge"] - season["recharge"]) > 0.01


def test_sensor_comparison_arrays(demo):
    result = wetfront.load_site(str(demo)).run()
    heads = result.sensor_comparison["pressure_head"]
    n = heads["observed"].size
    assert n > 0
    for name in ("sensor", "time", "depth", "simulated", "used"):
        assert heads[name].shape == (n,)
    assert {row["name"] for row in result.sensor_comparison["metrics"]} >= {"T30", "T60"}


def test_bad_site_file_names_file_line_and_key(demo):
    lines = demo.read_text().splitlines()
    index = lines.index('saturated_conductivity = "20 cm/d"')
    lines[index] = 'saturated_conductivity = "20 furlongs"'
    demo.write_text("\n".join(lines) + "\n")
    with pytest.raises(wetfront.InputError) as caught:
        wetfront.load_site(str(demo))
    error = caught.value
    assert error.file == str(demo)
    assert error.line == index + 1
    assert error.key == "layers[2].saturated_conductivity"
    assert isinstance(error, ValueError)


def test_missing_site_file(tmp_path):
    with pytest.raises(wetfront.InputError) as caught:
        wetfront.load_site(str(tmp_path / "none.toml"))
    assert caught.value.file == str(tmp_path / "none.toml")
    assert caught.value.line == 0


def test_sweep_reports_progress(demo):
    site = wetfront.load_site(str(demo))
    calls = []
    sweep = site.sweep(sample_size=3, seed=1, threads=2, progress=lambda done, planned: calls.append((done, planned)))
    assert sorted(calls) == [(1, 3), (2, 3), (3, 3)]
    assert sweep["values"].shape == (3, 2)
    assert sweep["complete"].all()
    assert sweep["parameters"] == ["loam subsoil: saturated_conductivity", "loam subsoil: n"]


def test_progress_exception_reaches_the_caller(demo):
    site = wetfront.load_site(str(demo))

    def stop(done, planned):
        raise RuntimeError("stop here")

    with pytest.raises(RuntimeError, match="stop here"):
        site.sweep(sample_size=2, threads=1, progress=stop)
