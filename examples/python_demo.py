"""The demo site from Python: run it, slow down the subsoil, run again, compare recharge.

Run from the source folder after building:  PYTHONPATH=build/python /usr/bin/python3 examples/python_demo.py
"""
import pathlib

import wetfront

site_file = pathlib.Path(__file__).parent / "demo" / "site.toml"
site = wetfront.load_site(str(site_file))
before = site.run()
site.set("saturated_conductivity", 5.0, layer="loam subsoil")  # cm/d, was 20
after = site.run()

print("season recharge: {:.1f} mm at 20 cm/d, {:.1f} mm at 5 cm/d".format(
    10 * before.season["recharge"], 10 * after.season["recharge"]))
print("visit interval end (day)   recharge 20 cm/d (mm)   5 cm/d (mm)")
for end, a, b in zip(before.visits["end_day"], before.visits["recharge"], after.visits["recharge"]):
    print(f"{end:24.0f} {10 * a:23.2f} {10 * b:13.2f}")
