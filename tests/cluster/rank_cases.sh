#!/usr/bin/env bash
# The studies spread over MPI ranks against the same studies on threads, one case per function
# `case_NAME`:   rank_cases.sh WETFRONT EXAMPLES_DIR NAME
# Each case runs in fresh copies of the examples (demo/, network/), once on two threads and once under
# `mpirun -n 2 --oversubscribe`, and compares the files: the CSV tables byte for byte and the
# HDF5 files by a full-precision dump, once each file's run id (new on every run) is masked.
# Exit 0 pass, 1 fail.
set -uo pipefail
WETFRONT=$1
EXAMPLES=$2
NAME=$3
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
for copy in threads ranks; do
  mkdir -p "$work/$copy" && cp -r "$EXAMPLES/demo" "$EXAMPLES/network" "$work/$copy"/
done
FOLDER=demo  # the example a case works in
SHORT=(--to 2025-04-20)  # a short season keeps each case to seconds
MPIRUN=(mpirun -n 2 --oversubscribe)
[[ $(id -u) == 0 ]] && MPIRUN+=(--allow-run-as-root)  # CI runs as root
# Containers often forbid one process reading another's memory, which Open MPI's shared-memory
# transport uses for large messages (a network site's files); plain copies work everywhere.
export OMPI_MCA_btl_vader_single_copy_mechanism=none

fail() { printf 'FAIL %s: %s\n' "$NAME" "$*" >&2; exit 1; }
# run_in COPY EXIT ARGS...: runs wetfront (on threads, or ranks under mpirun) in that copy, checks
# the exit code, keeps the output in OUT.
run_in() {
  local copy=$1 want=$2
  shift 2
  local launcher=()
  [[ $copy == ranks ]] && launcher=("${MPIRUN[@]}")
  OUT=$(cd "$work/$copy/$FOLDER" && "${launcher[@]}" "$WETFRONT" "$@" 2>&1)
  local got=$?
  [[ $got == "$want" ]] || fail "$copy: exit $got, expected $want; output: $OUT"
}
# A file with its run id masked; HDF5 files as a dump with every double to 17 digits.
masked() {
  local file=$work/$1/$FOLDER/$2 id
  if [[ $2 == *.h5 ]]; then
    id=$(h5dump -a run_id "$file" | sed -n 's/^ *(0): "\(.*\)"$/\1/p')
    (cd "$work/$1/$FOLDER" && h5dump -m '%.17g' "$2") | sed "s/$id/RUN-ID/g"
  else
    id=$(tail -n 1 "$file" | sed 's/.*,//')
    sed "s/$id/RUN-ID/g" "$file"
  fi
}
same_files() {
  for f in "$@"; do
    [[ -s $work/ranks/$FOLDER/$f ]] || fail "ranks did not write $f"
    diff <(masked threads "$f") <(masked ranks "$f") >/dev/null || fail "$f differs: $(diff <(masked threads "$f") <(masked ranks "$f") | head -20)"
  done
}
# Only the adjustable water contents of the loam subsoil: a grid whose corner theta_r 0.3 >
# theta_s 0.25 is no soil, so that run fails and the study goes on.
failing_grid() {
  for copy in threads ranks; do
    sed -i '/^\[\[adjustable\]\]/,$d' "$work/$copy/demo/site.toml"
    cat >> "$work/$copy/demo/site.toml" <<'TOML'
[[adjustable]]
parameter = "residual_water_content"
layer = "loam subsoil"
range = ["0.05 cm3/cm3", "0.3 cm3/cm3"]
grid_points = 3

[[adjustable]]
parameter = "saturated_water_content"
layer = "loam subsoil"
range = ["0.25 cm3/cm3", "0.45 cm3/cm3"]
grid_points = 3
TOML
  done
}

case_sweep_same_as_threads() {
  run_in threads 0 sweep site.toml "${SHORT[@]}" --sample 12 --seed 7 --threads 2 --quiet
  run_in ranks 0 sweep site.toml "${SHORT[@]}" --sample 12 --seed 7
  [[ $OUT =~ "12 runs in".*"on 2 " ]] || fail "the report does not count 12 runs on 2 workers: $OUT"
  same_files site-sweep.csv site-sweep.h5
}
case_calibrate_same_as_threads() {
  run_in threads 0 calibrate site.toml "${SHORT[@]}" --max-runs 12 --band-runs 4 --threads 2 --quiet
  run_in ranks 0 calibrate site.toml "${SHORT[@]}" --max-runs 12 --band-runs 4
  same_files site-calibration.csv site-calibration.h5
}
case_sweep_failed_run_recorded() {
  failing_grid
  run_in threads 0 sweep site.toml "${SHORT[@]}" --grid --threads 2 --quiet
  run_in ranks 0 sweep site.toml "${SHORT[@]}" --grid
  same_files site-sweep.csv site-sweep.h5
  [[ $(grep -c "not below the saturated" "$work/ranks/demo/site-sweep.csv") == 1 ]] ||
    fail "expected one failed run of nine, with its reason, in the table"
}
case_bad_input_ends_every_rank() {
  touch "$work/started"  # the examples folder may hold a sweep file from an earlier run by hand
  run_in ranks 1 sweep no-such-site.toml --sample 4
  [[ $OUT =~ "no-such-site.toml: cannot open the site file" ]] || fail "no message naming the file: $OUT"
  [[ $(grep -c "cannot open the site file" <<<"$OUT") == 1 ]] || fail "the message is not printed once: $OUT"
  [[ ! $OUT =~ MPI_ABORT|MPI_Abort ]] || fail "MPI abort on the output: $OUT"
  [[ -z $(find "$work/ranks" -name 'site-sweep*' -newer "$work/started") ]] || fail "files written"
}
network_files=(network-sites.csv network-intervals.csv network.h5 plot-a.h5 plot-a-visits.csv plot-a-sensors.csv
               plot-b.h5 plot-b-visits.csv plot-c.h5 plot-c-visits.csv)
case_network_same_as_threads() {
  FOLDER=network
  run_in threads 0 network network.toml --threads 2 --quiet
  run_in ranks 0 network network.toml
  [[ $OUT =~ "3 sites on 2 ranks" ]] || fail "not run on 2 ranks: $OUT"
  same_files "${network_files[@]}"
}
case_network_failed_site_recorded() {
  FOLDER=network
  for copy in threads ranks; do sed -i 's/^kind = "water table"/kind = "no such bottom"/' "$work/$copy/network/plot-b.toml"; done
  run_in threads 4 network network.toml --threads 2 --quiet
  run_in ranks 4 network network.toml
  [[ $OUT =~ "2 of 3 sites done" ]] || fail "the other sites did not go on: $OUT"
  [[ $(grep -c "plot-b.toml" <<<"$OUT") -ge 1 ]] || fail "the failed site is not named: $OUT"
  local kept=() f
  for f in "${network_files[@]}"; do [[ $f == plot-b* ]] || kept+=("$f"); done
  same_files "${kept[@]}"
  [[ ! -e $work/ranks/network/plot-b.h5 ]] || fail "a run file of the failed site"
}
# Rank 1 starts in an empty folder: it can build the study only from the bytes rank 0 sends.
case_other_ranks_read_no_user_files() {
  run_in threads 0 sweep site.toml "${SHORT[@]}" --sample 6 --threads 2 --quiet
  mkdir "$work/empty"
  local options=(--oversubscribe)
  [[ $(id -u) == 0 ]] && options+=(--allow-run-as-root)
  OUT=$(mpirun "${options[@]}" -n 1 -wdir "$work/ranks/demo" "$WETFRONT" sweep site.toml "${SHORT[@]}" --sample 6 : \
        -n 1 -wdir "$work/empty" "$WETFRONT" sweep site.toml "${SHORT[@]}" --sample 6 2>&1) || fail "exit $?: $OUT"
  [[ $OUT =~ "on 2 " ]] || fail "not run on 2 ranks: $OUT"
  [[ -z $(ls -A "$work/empty") ]] || fail "rank 1 wrote into its folder"
  same_files site-sweep.csv site-sweep.h5
}
case_bad_option_printed_once() {
  run_in ranks 1 sweep site.toml --sample 0
  [[ $(grep -c "sample" <<<"$OUT") == 1 ]] || fail "the option error is not printed once: $OUT"
}
case_other_command_runs_on_rank_zero() {
  run_in ranks 0 run site.toml "${SHORT[@]}"
  [[ $(grep -c "Wrote site\.h5" <<<"$OUT") == 1 ]] || fail "the run did not report once: $OUT"
}

"case_$NAME"
