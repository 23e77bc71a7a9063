#!/usr/bin/env bash
# Runs the libFuzzer targets of a build made with -DWETFRONT_FUZZ=ON (clang-14; see DEVELOPERS.md):
#   bash fuzz/run_fuzz.sh BUILD_DIR SECONDS [TARGET...]
# TARGET is site_file, csv_readers or run_file (default: all three, one after the other), each
# for SECONDS. Seeds come from examples/ and tests/ (and, for run_file, a short demo run written
# by the build's wetfront); the growing corpus and any crash files stay in BUILD_DIR/fuzz-work/.
# Exit status 0 when no target found anything. An hour each: bash fuzz/run_fuzz.sh build-sanitize 3600
set -euo pipefail
repo=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
build=$(cd "$1" && pwd)
seconds=$2
shift 2
targets=("$@")
((${#targets[@]})) || targets=(site_file csv_readers run_file)

seed() {  # seed TARGET CORPUS: copies the seed files of TARGET into CORPUS
  case $1 in
    site_file) cp "$repo"/examples/demo/site.toml "$repo"/tests/site/data/*.toml "$2"/ ;;
    csv_readers)
      local i=0
      for f in "$repo"/examples/demo/*.csv "$repo"/examples/soil-data/*.csv "$repo"/tests/*/data/*.csv; do
        cp "$f" "$2/seed-$((i++))-$(basename "$f")"
      done
      ;;
    run_file)
      "$build/cli/wetfront" run "$repo/examples/demo/site.toml" --to 2025-04-05 --out "$2/short.h5" --quiet --force ||
        { echo "run_fuzz: cannot write the run-file seed" >&2; exit 1; }
      rm -f "$2"/short-*.csv
      ;;
  esac
}

status=0
for target in "${targets[@]}"; do
  program="$build/fuzz/fuzz_$target"
  [[ -x $program ]] || { echo "run_fuzz: $program not built (configure with -DWETFRONT_FUZZ=ON)" >&2; exit 1; }
  work="$build/fuzz-work/$target"
  mkdir -p "$work/corpus" "$work/seeds" "$work/findings"
  seed "$target" "$work/seeds"
  # Leaks inside Debian's HDF5 library after a failed open are the library's, not findings.
  leaks=1 asan=${ASAN_OPTIONS:-abort_on_error=1}
  if [[ $target == run_file ]]; then leaks=0 asan="$asan:detect_leaks=0"; fi
  echo "run_fuzz: $target for $seconds s"
  # The run-file reader drives Debian's libhdf5, which crashes on some damaged files (e.g. a
  # corrupt global heap read in H5HG_read). Those crashes are the library's: run_file fuzzes in
  # fork mode, keeps going after a crash, and afterwards each crash file is run again and counts
  # as a finding only when the crashing frame is outside libhdf5.
  mode=()
  [[ $target == run_file ]] && mode=(-fork=1 -ignore_crashes=1 -ignore_timeouts=0 -ignore_ooms=0)
  rm -f "$work"/findings/crash-* "$work"/findings/oom-* "$work"/findings/timeout-*
  set +e
  ASAN_OPTIONS=$asan UBSAN_OPTIONS=${UBSAN_OPTIONS:-print_stacktrace=1:halt_on_error=1} \
    "$program" "${mode[@]}" -max_total_time="$seconds" -timeout=20 -rss_limit_mb=2048 -detect_leaks="$leaks" \
    -print_final_stats=1 -artifact_prefix="$work/findings/" "$work/corpus" "$work/seeds" >"$work/log.txt" 2>&1
  result=$?
  found=0 library=0 unrepeated=0
  if [[ $target == run_file ]]; then
    for crash in "$work"/findings/crash-* "$work"/findings/oom-* "$work"/findings/timeout-*; do
      [[ -e $crash ]] || continue
      # The first frame of the report that is not the sanitizer's, the allocator's or libFuzzer's.
      report=$(ASAN_OPTIONS=$asan "$program" -rss_limit_mb=2048 -timeout=20 "$crash" 2>&1)
      rerun=$?
      frame=$(grep -E '^ +#[0-9]+ ' <<<"$report" |
        grep -vE '__interceptor_|__asan|__sanitizer|fuzzer::|libc\.so| in (malloc|calloc|realloc|operator new)' | head -1)
      if ((rerun == 0)); then
        # Fork mode runs many inputs per process: a crash that the input alone does not repeat
        # most likely came from state an earlier input left in the library (every crash that
        # repeats alone so far was inside libhdf5); kept for a look, not counted.
        unrepeated=$((unrepeated + 1))
        mv "$crash" "$work/findings/unrepeated-$(basename "$crash")"
      elif [[ $frame == *libhdf5* ]]; then
        library=$((library + 1))
        mv "$crash" "$work/findings/libhdf5-$(basename "$crash")"
      else
        found=$((found + 1))
      fi
    done
  elif ((result != 0)); then
    found=1
  fi
  set -e
  ((library == 0)) || echo "run_fuzz: $target: $library crash(es) inside libhdf5 (kept as $work/findings/libhdf5-*)"
  ((unrepeated == 0)) ||
    echo "run_fuzz: $target: $unrepeated crash(es) the input alone does not repeat (kept as $work/findings/unrepeated-*)"
  if ((found > 0)); then
    echo "run_fuzz: $target FOUND A PROBLEM; see $work/log.txt and $work/findings/" >&2
    tail -40 "$work/log.txt" >&2
    status=1
  else
    grep -E "stat::number_of_executed_units|DONE|cov:" "$work/log.txt" | tail -2
  fi
done
exit $status
