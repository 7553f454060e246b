#!/usr/bin/env bash
# Every verb's report in one data format, from the demo products, for the data-output checks
# (tests/data/check_json_schema.sh, tests/data/check_csv_readers.sh).
# usage: tests/data/make_outputs.sh COLDCORE OUT_DIR json|csv [extra options]
# Exit 0 when every report was written (exit 1 of a verb, a target not demonstrated, still writes).
set -uo pipefail
cc="$1"; out="$2"; fmt="$3"; shift 3
extra=("$@")
mkdir -p "$out"
status=0
one() {  # a report verb (it takes --date)
  local name="$1"; shift
  lib "$name" "$@" --date 2026-12-01
}
lib() {  # any verb
  local name="$1"; shift
  "$cc" "$@" -f "$fmt" "${extra[@]}" > "$out/$name.$fmt" 2> "$out/$name.err"
  local rc=$?
  if [ $rc -gt 1 ]; then echo "FAILED ($rc): coldcore $*"; cat "$out/$name.err"; status=1; fi
}
for p in kofta-balls chicken-sausage-log corned-beef-can lasagne-tray; do one "run-$p" run "products/$p.toml"; done
one run-kofta-F run products/kofta-balls.toml --units F
one run-scenarios run tests/cli/media-split/chill-credited.toml
one probe probe products/logs/kofta-probe.csv --organism listeria-monocytogenes --target-log 6 --rule two-stage-6h
one probe-no-target probe tests/cli/probe/constant-70C.csv --reference-C 70 --z-C 7.5 --D-min 0.5
one solve-hold solve products/kofta-balls.toml --for hold-time
one solve-chill solve products/chicken-sausage-log.toml --for chill-time
one deviation deviation products/corned-beef-can.toml --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412
one deviation-F deviation products/corned-beef-can.toml --medium-log products/logs/corned-beef-hold-deviation.csv --units F
one fit fit tests/cli/fit/sphere-study.toml --probe-log tests/reference/heat_penetration/sphere_noisy.csv --probe-column centre_C --library products
lib modes modes --shape sphere --biot 2.5
lib modes-inf modes --shape slab --biot inf
lib props props --composition water=0.74,protein=0.22,fat=0.03,ash=0.01
lib organisms organisms
lib rules rules
lib media media
exit $status
