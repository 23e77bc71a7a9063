#!/usr/bin/python3
"""The demo site from Python: recharge per visit interval before and after slowing down the
subsoil, drawn into one PNG figure.

Run from the source folder after building:
  PYTHONPATH=build/python /usr/bin/python3 examples/plot_recharge.py recharge.png [--conductivity 5]
"""
import argparse
import pathlib

import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt  # noqa: E402
import numpy as np  # noqa: E402

import wetfront  # noqa: E402

MM_PER_CM = 10.0
LAYER = "loam subsoil"


def main():
    parser = argparse.ArgumentParser(description="Recharge per visit interval of the demo at two subsoil conductivities.")
    parser.add_argument("png", type=pathlib.Path, help="the figure to write (PNG)")
    parser.add_argument("--conductivity", type=float, default=5.0,
                        help="saturated conductivity of the loam subsoil for the second run, cm/d (default 5)")
    args = parser.parse_args()

    site = wetfront.load_site(str(pathlib.Path(__file__).parent / "demo" / "site.toml"))
    original = site.get("saturated_conductivity", layer=LAYER)
    before = site.run()
    site.set("saturated_conductivity", args.conductivity, layer=LAYER)
    after = site.run()

    figure, axis = plt.subplots(figsize=(9, 5))
    for result, conductivity, style in ((before, original, "o-"), (after, args.conductivity, "s--")):
        ends = np.asarray(result.visits["end_day"])
        recharge = MM_PER_CM * np.asarray(result.visits["recharge"])
        season = MM_PER_CM * result.season["recharge"]
        axis.plot(ends, recharge, style, label=f"subsoil saturated conductivity {conductivity:g} cm/d (season {season:.1f} mm)")
    axis.axhline(0.0, color="black", linewidth=0.8)
    axis.set_xlabel("end of the visit interval (day of the run)")
    axis.set_ylabel("recharge in the interval (mm, down +)")
    axis.set_title("Demo site: recharge per visit interval at two subsoil conductivities")
    axis.grid(True, alpha=0.3)
    axis.legend()
    figure.tight_layout()
    figure.savefig(args.png, dpi=110)
    print(args.png)


if __name__ == "__main__":
    main()
