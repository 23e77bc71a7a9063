#!/usr/bin/python3
"""Smoke test of profiles/plot_run.py: it makes four readable PNG files (sensor heads, water
content, balance, recharge per visit interval) from a sample run file and refuses a date
outside the run with a message naming it.

Usage: plot_run_smoke.py PLOT_RUN.py RUN_FILE.h5 OUTPUT_DIR
"""
import pathlib
import shutil
import subprocess
import sys

PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"


def main(script, run_file, out):
    out = pathlib.Path(out)
    shutil.rmtree(out, ignore_errors=True)
    failures = []
    result = subprocess.run([sys.executable, script, run_file, "--out", str(out), "--dates", "2025-04-05,2025-04-20"],
                            capture_output=True, text=True)
    if result.returncode != 0:
        failures.append(f"plot_run.py exited with {result.returncode}: {result.stderr}")
    stem = pathlib.Path(run_file).stem
    for kind in ("sensor_heads", "water_content", "balance", "recharge"):
        png = out / f"{stem}_{kind}.png"
        if not png.is_file():
            failures.append(f"missing {png}")
        elif png.stat().st_size < 10000 or png.read_bytes()[:8] != PNG_SIGNATURE:
            failures.append(f"{png} is not a plausible PNG ({png.stat().st_size} bytes)")

    refused = subprocess.run([sys.executable, script, run_file, "--out", str(out), "--dates", "2026-01-01"],
                             capture_output=True, text=True)
    if refused.returncode == 0 or "2026-01-01 is outside the output times" not in refused.stderr:
        failures.append(f"a date outside the run was not refused clearly: {refused.returncode} {refused.stderr!r}")

    for message in failures:
        print("FAIL:", message)
    print(f"{len(failures)} failure(s)")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main(*sys.argv[1:4]))
