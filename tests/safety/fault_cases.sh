#!/usr/bin/env bash
# Bad-input and fault cases of the `wetfront` program, one per function `case_NAME`:
#   fault_cases.sh WETFRONT DEMO_DIR NAME
# Each case works in a fresh copy of the demo site and asserts the exit code, key words of the
# message, and that no file in the folder was changed (added, removed or rewritten), except
# where the case says what must appear. Exit 0 pass, 1 fail, 77 skipped (a permission case as root
# where no ordinary user can be taken on).
set -uo pipefail
WETFRONT=$1
DEMO=$2
NAME=$3
DATA=$(cd "$(dirname "${BASH_SOURCE[0]}")/data" && pwd)
work=$(mktemp -d)
trap 'chmod -R u+w "$work" 2>/dev/null; rm -rf "$work"' EXIT
cp -r "$DEMO"/. "$work"/
cd "$work" || exit 1
SHORT=(--to 2025-04-20)  # a short season keeps each case fast

fail() { printf 'FAIL %s: %s\n' "$NAME" "$*" >&2; exit 1; }
# Names and contents of every file below the folder (lock files aside).
snapshot() { find . -type f ! -name '*.lock' -print0 | sort -z | xargs -0 sha256sum; find . -type l | sort; }
# run EXIT REGEX ARGS...: runs wetfront, checks exit code and that stdout+stderr match REGEX.
AS_USER=()  # set by `unprivileged`: the command that runs wetfront as an ordinary user
run() {
  local want=$1 regex=$2
  shift 2
  OUT=$("${AS_USER[@]}" "$WETFRONT" "$@" 2>&1)
  local got=$?
  [[ $got == "$want" ]] || fail "exit $got, expected $want; output: $OUT"
  [[ -z $regex || $OUT =~ $regex ]] || fail "output does not match '$regex': $OUT"
  return 0
}
# refused EXIT REGEX ARGS...: as run, and not one file changed.
refused() {
  local before after
  before=$(snapshot)
  run "$@"
  after=$(snapshot)
  [[ $before == "$after" ]] || fail "files changed: $(diff <(echo "$before") <(echo "$after"))"
  [[ ! $OUT =~ HDF5-DIAG ]] || fail "HDF5 library error dump on the output: $OUT"
}
no_partials() { [[ -z $(find . -name '*.partial') ]] || fail "temporary files left: $(find . -name '*.partial')"; }
# Permission cases: root ignores the permissions of files and folders, so as root wetfront runs
# as the user nobody (setpriv, else runuser, both util-linux) in a working copy that user owns.
# Exit 77 (skipped) only when neither can run the program as nobody.
unprivileged() {
  [[ $(id -u) != 0 ]] && return 0
  chmod 755 "$work" && chown -R nobody:nogroup "$work" || exit 77
  if setpriv --reuid=nobody --regid=nogroup --clear-groups true 2> /dev/null; then
    AS_USER=(setpriv --reuid=nobody --regid=nogroup --clear-groups)
  elif runuser -u nobody -- true 2> /dev/null; then
    AS_USER=(runuser -u nobody --)
  else
    exit 77
  fi
  "${AS_USER[@]}" test -x "$WETFRONT" || exit 77  # the program's folders must be open to nobody
}
set_key() { sed -i "s|$1|$2|" site.toml; }  # replaces text in the site file
first_run() { run 0 "" run site.toml "${SHORT[@]}" --quiet; }

# --- never write over a file the command reads ---------------------------------------------
case_run_out_is_site_file() { refused 1 "site\.toml: is also an input.*never writes over a file it reads" run site.toml --out site.toml; }
case_run_out_is_rain_record() { refused 1 "rain\.csv: is also an input" run site.toml --out rain.csv; }
case_run_out_is_sensor_record() { refused 1 "tensiometer-30cm\.csv: is also an input" run site.toml --out tensiometer-30cm.csv; }
case_run_out_other_spelling() { mkdir sub; refused 1 "is also an input" run site.toml --out sub/../site.toml; }
case_run_out_symbolic_link_to_input() { ln -s rain.csv link.h5; refused 1 "link\.h5: is also an input.*rain\.csv" run site.toml --out link.h5; }
case_run_out_hard_link_to_input() { ln pan-readings.csv same.h5; refused 1 "same\.h5: is also an input" run site.toml --out same.h5; }
case_run_force_still_keeps_inputs() { refused 1 "is also an input" run site.toml --out rain.csv --force; }
case_run_visits_csv_is_input() {
  mv rain.csv season-visits.csv
  set_key 'rain = "rain.csv"' 'rain = "season-visits.csv"'
  refused 1 "season-visits\.csv: is also an input" run site.toml --out season.h5
}
case_run_absolute_path_of_input() { refused 1 "is also an input" run site.toml --out "$PWD/irrigation.csv"; }
case_sweep_out_is_site_file() { refused 1 "site\.toml: is also an input" sweep site.toml --out site.toml; }
case_calibrate_out_is_rain_record() { refused 1 "rain\.csv: is also an input" calibrate site.toml --out rain.csv; }
case_show_csv_is_run_file() { first_run; refused 1 "site\.h5: is also an input" show site.h5 --csv site.h5; }
case_show_sensors_csv_is_run_file() { first_run; refused 1 "is also an input" show site.h5 --sensors-csv ./site.h5; }
case_show_both_csv_same_file() { first_run; refused 1 "name the same file" show site.h5 --csv a.csv --sensors-csv a.csv; }
case_soil_cores_csv_is_input() { refused 1 "core-samples\.csv: is also an input" soil cores core-samples.csv --csv core-samples.csv; }
case_soil_retention_csv_is_input() {
  printf 'suction_cm,water_content\n0,0.42\n10,0.41\n50,0.35\n100,0.3\n300,0.22\n1000,0.15\n15000,0.09\n' > points.csv
  refused 1 "points\.csv: is also an input" soil retention points.csv --csv points.csv
}
case_soil_layer_output_is_input() {
  printf 'suction_cm,water_content\n0,0.42\n10,0.41\n50,0.35\n100,0.3\n300,0.22\n1000,0.15\n15000,0.09\n' > points.csv
  refused 1 "points\.csv: is also an input" soil layer --name x --top "0 cm" --bottom "30 cm" --retention points.csv \
    --saturated-conductivity "20 cm/d" --output points.csv --force
}
case_soil_layer_output_and_csv_same() {
  refused 1 "same file" soil layer --name x --top "0 cm" --bottom "30 cm" --texture loam \
    --saturated-conductivity "20 cm/d" --output a.txt --csv a.txt
}

# --- never write over a file wetfront did not write, unless --force ---------------------------
case_soil_layer_output_over_site_file() {
  refused 1 "site\.toml: exists and was not written by wetfront.*--force" soil layer --name x --top "0 cm" \
    --bottom "30 cm" --texture loam --saturated-conductivity "20 cm/d" --output site.toml
}
case_soil_layer_output_replaces_its_own_block() {
  run 0 "" soil layer --name x --top "0 cm" --bottom "30 cm" --texture loam --saturated-conductivity "20 cm/d" --output block.toml
  run 0 "Layer block written to block\.toml" soil layer --name y --top "0 cm" --bottom "30 cm" --texture loam \
    --saturated-conductivity "25 cm/d" --output block.toml
  grep -q 'name = "y"' block.toml || fail "block not replaced"
}
case_soil_layer_force_replaces_foreign() {
  echo "my notes" > notes.toml
  run 0 "" soil layer --name x --top "0 cm" --bottom "30 cm" --texture loam --saturated-conductivity "20 cm/d" \
    --output notes.toml --force
  grep -q '\[\[layers\]\]' notes.toml || fail "not replaced"
}
case_run_out_foreign_file() { echo "keep me" > mine.h5; refused 1 "mine\.h5: exists and was not written by wetfront" run site.toml --out mine.h5; }
case_run_foreign_visits_csv_beside() {
  echo "date,my numbers" > site-visits.csv
  refused 1 "site-visits\.csv: exists and was not written by wetfront" run site.toml "${SHORT[@]}"
}
case_run_foreign_sensors_csv_beside() {
  echo "a,b" > site-sensors.csv
  refused 1 "site-sensors\.csv: exists and was not written by wetfront" run site.toml "${SHORT[@]}"
}
case_run_force_replaces_foreign() {
  echo "keep me" > mine.h5
  run 0 "" run site.toml "${SHORT[@]}" --out mine.h5 --force --quiet
  "$WETFRONT" show mine.h5 > /dev/null 2>&1 || fail "the forced run file does not read back"
}
case_run_replaces_its_own_set() { first_run; run 0 "Wrote site\.h5" run site.toml "${SHORT[@]}"; no_partials; }
case_show_csv_foreign_file() { first_run; echo "x" > table.csv; refused 1 "table\.csv: exists and was not written by wetfront" show site.h5 --csv table.csv; }
case_soil_texture_csv_foreign_file() { echo "x,y" > classes.csv; refused 1 "classes\.csv: exists and was not written" soil texture --csv classes.csv; }
case_soil_texture_csv_replaces_own() { run 0 "" soil texture --csv classes.csv; run 0 "Results written" soil texture loam --csv classes.csv; }
case_sweep_csv_foreign_file() { echo "x" > site-sweep.csv; refused 1 "site-sweep\.csv: exists and was not written" sweep site.toml; }

# --- output folder checked before any work ------------------------------------------------
case_run_out_folder_missing() { refused 1 "output folder 'no-such-folder' does not exist" run site.toml --out no-such-folder/x.h5; }
case_run_out_folder_is_a_file() { refused 1 "output folder 'rain\.csv' is not a folder" run site.toml --out rain.csv/x.h5; }
case_run_out_is_a_folder() { mkdir out.h5; refused 1 "out\.h5: is a folder" run site.toml --out out.h5; }
case_run_out_names_no_file() { refused 1 "names a folder, not a file" run site.toml --out sub/..; }
# refused_in_read_only_folder ARGS...: as an ordinary user, wetfront ARGS writing into the
# read-only folder 'locked' is refused before any work.
refused_in_read_only_folder() {
  unprivileged
  mkdir locked && chmod a-w locked
  refused 1 "cannot write in the output folder 'locked'" "$@"
}
case_run_out_folder_read_only() { refused_in_read_only_folder run site.toml --out locked/x.h5; }
case_sweep_out_folder_read_only() { refused_in_read_only_folder sweep site.toml --out locked/s.h5; }
case_show_csv_folder_read_only() {
  unprivileged
  run 0 "" run site.toml "${SHORT[@]}" --quiet
  refused_in_read_only_folder show site.h5 --csv locked/v.csv
}
case_run_again_in_folder_made_read_only() {
  unprivileged
  run 0 "" run site.toml "${SHORT[@]}" --quiet
  chmod a-w .
  refused 1 "site\.h5: cannot write in the output folder '\.'" run site.toml "${SHORT[@]}"
}
case_run_site_file_unreadable() {
  unprivileged
  chmod a-r site.toml
  refused 1 "site\.toml: cannot open the site file \(missing or unreadable\)" run site.toml
}
case_check_rain_record_unreadable() {
  unprivileged
  chmod a-r rain.csv
  refused 1 "rain\.csv: cannot open the file for reading" check site.toml
}
case_sweep_out_folder_missing() { refused 1 "output folder 'nowhere' does not exist" sweep site.toml --out nowhere/s.h5; }
case_calibrate_out_is_a_folder() { mkdir c.h5; refused 1 "c\.h5: is a folder" calibrate site.toml --out c.h5; }
case_show_csv_folder_missing() { first_run; refused 1 "output folder 'gone' does not exist" show site.h5 --csv gone/v.csv; }
case_soil_texture_csv_folder_missing() { refused 1 "output folder 'gone' does not exist" soil texture loam --csv gone/t.csv; }
case_soil_permeameter_csv_foreign_file() {
  cp "$DEMO"/../soil-data/well-permeameter.csv .
  echo "mine" > kfs.csv
  refused 1 "kfs\.csv: exists and was not written" soil permeameter well-permeameter.csv --well-radius "3 cm" \
    --reservoir-area "35.4 cm2" --csv kfs.csv
}
case_soil_infiltrometer_csv_is_input() {
  cp "$DEMO"/../soil-data/tension-disc.csv .
  refused 1 "tension-disc\.csv: is also an input" soil infiltrometer tension-disc.csv --disc-radius "10 cm" \
    --tower-area "19.6 cm2" --csv tension-disc.csv
}
case_run_message_names_folder_not_temporary() {
  OUT=$("$WETFRONT" run site.toml --out no-such-folder/x.h5 2>&1)
  [[ ! $OUT =~ \.partial ]] || fail "message names the temporary file: $OUT"
}

# --- one writer at a time; stale temporary files; kills at every write step -------------------
case_run_refused_while_locked() {
  command -v flock > /dev/null || exit 77
  first_run
  flock .site.h5.lock sleep 2 &
  sleep 0.5
  refused 1 "another wetfront command is writing this output now" run site.toml "${SHORT[@]}"
  wait
}
case_run_removes_stale_temporaries() {
  echo junk > .site.h5.99999-0.partial
  echo junk > .site-visits.csv.99999-1.partial
  echo mine > .other.txt.1-0.partial
  run 0 "" run site.toml "${SHORT[@]}" --quiet
  [[ ! -e .site.h5.99999-0.partial && ! -e .site-visits.csv.99999-1.partial ]] || fail "stale temporary files kept"
  [[ -e .other.txt.1-0.partial ]] || fail "a temporary file of another output was removed"
}
# A run killed at write step k (1: lock taken, 2: temporary run file begun, its profiles written
# as the run goes, 3-4: temporary CSV files written, 5: temporary run file complete, 6-8: renames):
# the set on disk is the old one, or `show` names each file that does not belong; the next run
# cleans up.
kill_at_step() {
  first_run
  cp site.h5 old.h5
  WETFRONT_STOP_AT_WRITE_STEP=$1 "$WETFRONT" run site.toml "${SHORT[@]}" --quiet > /dev/null 2>&1
  [[ $? == 86 ]] || fail "the test hook did not stop the run at step $1"
  if (($1 >= 2 && $1 <= 5)); then
    [[ -n $(find . -name '.site.h5.*.partial') ]] || fail "no temporary run file left by the kill at step $1"
  fi
  run 0 "" show site.h5
  if (($1 <= 5)); then
    cmp -s site.h5 old.h5 || fail "the run file changed before its rename"
    [[ ! $OUT =~ "does not belong" ]] || fail "old set reported as mismatched: $OUT"
  elif (($1 < 8)); then
    [[ $OUT =~ "does not belong to this run file" ]] || fail "mismatched set not reported: $OUT"
  else
    [[ ! $OUT =~ "does not belong" ]] || fail "complete new set reported as mismatched: $OUT"
  fi
  run 0 "" run site.toml "${SHORT[@]}" --quiet
  no_partials
  run 0 "" show site.h5
  [[ ! $OUT =~ "does not belong" ]] || fail "set still mismatched after a full run: $OUT"
}
case_kill_at_write_step_1() { kill_at_step 1; }
case_kill_at_write_step_2() { kill_at_step 2; }
case_kill_at_write_step_3() { kill_at_step 3; }
case_kill_at_write_step_4() { kill_at_step 4; }
case_kill_at_write_step_5() { kill_at_step 5; }
case_kill_at_write_step_6() { kill_at_step 6; }
case_kill_at_write_step_7() { kill_at_step 7; }
case_kill_at_write_step_8() { kill_at_step 8; }
case_show_reports_csv_of_another_run() {
  first_run
  cp site-visits.csv keep.csv
  run 0 "" run site.toml "${SHORT[@]}" --quiet
  cp keep.csv site-visits.csv
  refused 0 "site-visits\.csv does not belong to this run file" show site.h5
}
case_run_file_size_limit() {
  # A full disk seen as a file-size limit: the write fails, nothing is left half-written.
  first_run
  cp site.h5 old.h5
  OUT=$(trap '' XFSZ; ulimit -f 1; "$WETFRONT" run site.toml "${SHORT[@]}" --quiet 2>&1)
  local got=$?
  [[ $got == 1 ]] || fail "exit $got, expected 1: $OUT"
  [[ $OUT =~ "cannot write" ]] || fail "message: $OUT"
  cmp -s site.h5 old.h5 || fail "the run file changed"
  no_partials
}
case_run_file_size_limit_while_profiles_are_written() {
  # The whole season (a run file of about 2 MB) against a limit of 600 kB: the run file written as
  # the run goes fails, the old set stays and the temporary file goes.
  first_run
  cp site.h5 old.h5
  OUT=$(trap '' XFSZ; ulimit -f 600; "$WETFRONT" run site.toml --quiet 2>&1)
  local got=$?
  [[ $got == 1 ]] || fail "exit $got, expected 1: $OUT"
  [[ $OUT =~ "cannot write run record 'site.h5'" && ! $OUT =~ \.partial ]] || fail "message: $OUT"
  cmp -s site.h5 old.h5 || fail "the run file changed"
  no_partials
}

# --- damaged or misplaced inputs ----------------------------------------------------------
case_show_damaged_run_file() { first_run; head -c 3000 site.h5 > cut.h5; refused 1 "cut\.h5" show cut.h5; }
case_show_run_file_is_a_folder() { mkdir r.h5; refused 1 "r\.h5.*is a folder" show r.h5; }
# Found by fuzzing the run-file reader: a damaged run file (bytes changed at random) crashes
# Debian's libhdf5 with signal 11; `show` reads it first in a child process and says it is damaged.
case_show_file_that_crashes_hdf5() {
  cp "$DATA"/run-file-corrupt-text-heap.h5 damaged.h5
  refused 1 "damaged\.h5: the run file is damaged: the HDF5 library failed while reading it" show damaged.h5
}
case_show_text_file() { refused 1 "not an HDF5 file" show rain.csv; }

# --- physical ranges: hard limits are errors naming file, line and column --------------------
probe_file() { printf '# probe\ntime,permittivity\n2025-04-08T09:00,%s\n' "$1" > probe-20cm.csv; }
case_probe_permittivity_below_soil() { probe_file 1.5; refused 1 "probe-20cm\.csv:3: column 'permittivity'.*negative water content" check site.toml; }
case_probe_permittivity_above_water() { probe_file 120; refused 1 "probe-20cm\.csv:3: column 'permittivity'.*above 88" check site.toml; }
case_probe_permittivity_below_vacuum() { probe_file 0.5; refused 1 "probe-20cm\.csv:3:.*below 1" check site.toml; }
case_pan_level_falls_too_fast() {
  sed -i 's/^2025-04-02T08:00,200.4,/2025-04-02T08:00,50.4,/' pan-readings.csv
  refused 1 "pan-readings\.csv:5: column 'level': the level fell 151\.6 mm.*faster than a pan evaporates" check site.toml
}
case_pan_two_before_refill_rows() {
  printf 'time,level_mm,rain_mm,event\n2025-03-31T08:00,202.0,,\n2025-04-02T08:00,200.4,4.6,before_refill\n2025-04-02T08:10,200.4,,before_refill\n' > pan-readings.csv
  refused 1 "pan-readings\.csv:4: column 'event': 'before_refill' follows before_refill \(line 3\)" check site.toml
}
case_saturated_conductivity_absurd() {
  set_key 'saturated_conductivity = "20 cm/d"' 'saturated_conductivity = "1e308 cm/d"'
  refused 1 "site\.toml:[0-9]+: key 'layers\[2\]\.saturated_conductivity'.*at most 100000 cm/d" run site.toml
}
case_saturated_conductivity_zero() {
  set_key 'saturated_conductivity = "20 cm/d"' 'saturated_conductivity = "0 cm/d"'
  refused 1 "saturated_conductivity.*positive" check site.toml
}
case_rain_depth_absurd() {
  sed -i 's/^2025-04-02,4.6$/2025-04-02,1e308/' rain.csv
  refused 1 "rain\.csv:5: column 'rain_mm': 1e\+308 mm in one interval is beyond any rain on record" run site.toml
}
case_irrigation_depth_absurd() {
  sed -i '4s/,31$/,99999/' irrigation.csv
  refused 1 "irrigation\.csv:[0-9]+: .*beyond any irrigation on record" check site.toml
}
case_theta_r_above_theta_s_blames_theta_r() {
  set_key 'residual_water_content = 0.08' 'residual_water_content = 0.5'
  refused 1 "key 'layers\[2\]\.residual_water_content'.*0\.5 is not below the saturated water content 0\.42" check site.toml
}
case_theta_s_too_low_blames_theta_s() {
  set_key 'saturated_water_content = "0.42 cm3/cm3"' 'saturated_water_content = 0.05'
  refused 1 "key 'layers\[2\]\.saturated_water_content'.*unusually low" check site.toml
}
case_negative_theta_r_no_percent_advice() {
  set_key 'residual_water_content = 0.08' 'residual_water_content = -0.05'
  refused 1 "residual_water_content.*-0\.05 is negative" check site.toml
  [[ ! $OUT =~ "%" ]] || fail "suggests a percentage for a negative value: $OUT"
}
case_water_content_percent_advice() {
  set_key 'residual_water_content = 0.08' 'residual_water_content = 8'
  refused 1 "for a percentage write \"8 %\"" check site.toml
}
case_retention_lab_noise_fitted_with_warning() {
  printf 'suction_cm,water_content\n0,0.415\n10,0.416\n50,0.39\n100,0.35\n330,0.27\n1000,0.19\n15000,0.1\n' > points.csv
  refused 0 "warning: points\.csv: all points: point 2 \(suction 10 cm.*lab noise" soil retention points.csv
}
case_retention_rise_beyond_noise_refused() {
  printf 'suction_cm,water_content\n0,0.40\n100,0.30\n330,0.35\n1000,0.20\n15000,0.10\n' > points.csv
  refused 1 "points\.csv: all points: .*point 3 \(suction 330 cm.*0\.0500 more water" soil retention points.csv
}
case_retention_replicate_cores_pooled() {
  printf 'sample,suction_cm,water_content\nA,0,0.43\nA,10,0.425\nA,100,0.33\nA,1000,0.2\nA,15000,0.1\nB,0,0.40\nB,10,0.395\nB,100,0.31\nB,1000,0.19\nB,15000,0.09\n' > points.csv
  refused 0 "sample A .*sample B .*all samples pooled" soil retention points.csv
}
# Outside the usual range but inside the hard one: used, with a note in the report.
case_conductivity_unusual_noted() {
  set_key 'saturated_conductivity = "20 cm/d"' 'saturated_conductivity = "5000 cm/d"'
  set_key 'range = \["5 cm/d", "80 cm/d"\]' 'range = ["5 cm/d", "8000 cm/d"]'
  refused 0 "note: layer 'loam subsoil': saturated conductivity 5000 cm/d is outside the usual range" check site.toml
}
case_rain_unusual_noted() {
  sed -i 's/^2025-04-02,4.6$/2025-04-02,350/' rain.csv
  refused 0 "note: .*rain\.csv:5: 350 mm of rain in one interval is more than usual" check site.toml
}
case_pan_fall_unusual_noted() {
  sed -i 's/^2025-03-31T08:00,202.0,/2025-03-31T08:00,239.0,/' pan-readings.csv
  refused 0 "note: .*pan-readings\.csv:5: the pan level fell 19\.3 mm/d, more than usual" check site.toml
}

# --- accepted as a spreadsheet writes it; clear words for a folder or missing tables -----------
case_rain_csv_with_byte_order_mark() {
  printf '\xEF\xBB\xBF' | cat - rain.csv > r && mv r rain.csv
  run 0 "Site file is usable" check site.toml
}
case_probe_csv_with_byte_order_mark() {
  printf '\xEF\xBB\xBF' | cat - probe-20cm.csv > p && mv p probe-20cm.csv
  run 0 "Site file is usable" check site.toml
}
case_lab_csv_with_byte_order_mark() {
  printf '\xEF\xBB\xBFsuction_cm,water_content\n0,0.42\n10,0.41\n50,0.35\n100,0.3\n300,0.22\n1000,0.15\n15000,0.09\n' > points.csv
  run 0 "Retention: theta_r" soil retention points.csv
}
case_site_file_is_a_folder() { mkdir s.toml; refused 1 "s\.toml: is a folder, not a site file" check s.toml; }
case_rain_file_is_a_folder() { rm rain.csv; mkdir rain.csv; refused 1 "weather\.rain'.*is a folder" check site.toml; }
case_lab_csv_is_a_folder() { mkdir points.csv; refused 1 "points\.csv: is a folder" soil retention points.csv; }
case_site_file_missing_tables() {
  sed -i '/^\[weather\]$/d; /^\[pan\]$/d; /^\[recharge\]$/d' site.toml
  refused 1 "missing tables \[weather\], \[pan\], \[recharge\]" check site.toml
}

# --- bounded work: the output size is estimated and refused before any computation ------------
case_output_every_second_refused_by_check() {
  set_key 'output_interval = "1 d"' 'output_interval = "1 s"'
  refused 1 "run\.output_interval.*output size limit of 1 GB.*output_size_limit" check site.toml
}
case_output_every_second_refused_by_run() {
  set_key 'output_interval = "1 s"' 'output_interval = "1 s"'
  set_key 'output_interval = "1 d"' 'output_interval = "1 s"'
  refused 1 "output size limit" run site.toml
}
case_output_size_limit_not_a_size() {
  set_key 'output_interval = "1 d"' 'output_interval = "1 d"\noutput_size_limit = "lots"'
  refused 1 "run\.output_size_limit': 'lots' is not a size" check site.toml
}
case_output_size_limit_raised() {
  set_key 'output_interval = "1 d"' 'output_interval = "1 min"\noutput_size_limit = "100 GB"'
  run 0 "Site file is usable" check site.toml
}

"case_$NAME"
