#!/usr/bin/env bash
# Throughput of `wetfront sweep` on the demo site (full seasons, the site's own study) against
# the number of MPI ranks, beside the same sweep on threads. Timed runs, wall clock, each case
# REPEATS times (the best is reported: other work on a shared machine only slows a run).
#   bench/rank_throughput.sh BUILD_DIR [SETS=16] [REPEATS=2]
set -euo pipefail
wetfront=$(realpath "$1/cli/wetfront")
sets=${2:-16}
repeats=${3:-2}
demo=$(realpath "$(dirname "${BASH_SOURCE[0]}")/../examples/demo")
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cp -r "$demo"/. "$work"/
cd "$work"
mpirun=(mpirun --oversubscribe)
[[ $(id -u) == 0 ]] && mpirun+=(--allow-run-as-root)

best() {  # best wall time of REPEATS runs of the command
  local t best_t=
  for ((r = 0; r < repeats; ++r)); do
    rm -f site-sweep.h5 site-sweep.csv
    t=$( { /usr/bin/time -f %e "$@" --sample "$sets" --keep 0 --quiet >/dev/null; } 2>&1 | tail -n 1)
    if [[ -z $best_t ]] || awk "BEGIN{exit !($t < $best_t)}"; then best_t=$t; fi
  done
  echo "$best_t"
}
printf '%-28s %8s %10s\n' "how" "wall [s]" "runs/s"
for threads in 1 2; do
  t=$(best "$wetfront" sweep site.toml --threads "$threads")
  printf '%-28s %8s %10.2f\n' "threads $threads" "$t" "$(awk "BEGIN{print $sets / $t}")"
done
for ranks in 1 2 4; do
  t=$(best "${mpirun[@]}" -n "$ranks" "$wetfront" sweep site.toml --threads 1)
  printf '%-28s %8s %10.2f\n' "mpirun -n $ranks" "$t" "$(awk "BEGIN{print $sets / $t}")"
done
