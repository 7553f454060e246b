#!/usr/bin/env bash
# What a user waits for (issue 13): wall time of whole commands on the demo products, median of
# N runs (default 3). No assertions; compare before and after a change on the same machine.
# Usage: tests/bench/verbs.sh [path/to/coldcore] [N]   (or: cmake --build build --target bench_verbs)
set -euo pipefail
here="$(cd "$(dirname "$0")/../.." && pwd)"
cc="${1:-$here/build/coldcore}"
n="${2:-3}"
cd "$here"
median() { sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
time_of() {
  local label="$1"; shift
  for _ in $(seq "$n"); do
    local t0 t1
    t0=$(date +%s.%N)
    "$cc" "$@" > /dev/null 2>&1 || [ $? -eq 1 ]  # exit 1 is a verdict, not a failure
    t1=$(date +%s.%N)
    awk -v a="$t0" -v b="$t1" 'BEGIN { print b - a }'
  done | median | xargs printf "%-48s %8.2f s\n" "$label"
}
time_of "run kofta-balls" run products/kofta-balls.toml
time_of "run chicken-sausage-log" run products/chicken-sausage-log.toml
time_of "solve corned-beef-can hold-time" solve products/corned-beef-can.toml --for hold-time
time_of "solve chicken-sausage-log hold-time conservative" \
  solve products/chicken-sausage-log.toml --for hold-time --conservative
time_of "deviation chicken-sausage-log conservative" \
  deviation products/chicken-sausage-log.toml --medium-log products/logs/chicken-sausage-bath-deviation.csv --conservative
