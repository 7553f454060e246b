#!/usr/bin/env bash
# Regenerates the example reports: one HTML and one Markdown report (with its SVG plots) per
# demo product, one for the invented probe log, one `solve` answer and one `deviation` record.
# The date is fixed so that the same inputs give byte-identical files
# (tests/cli/reports_current.cmake checks the committed ones).
# usage: scripts/make_reports.sh COLDCORE_BINARY OUT_DIR     (run from anywhere)
set -euo pipefail
cc="$(cd "$(dirname "$1")" && pwd)/$(basename "$1")"
out="$2"
root="$(cd "$(dirname "$0")/.." && pwd)"
date="${COLDCORE_REPORT_DATE:-2026-12-01}"
mkdir -p "$out"
out="$(cd "$out" && pwd)"
cd "$root"
products=(kofta-balls chicken-sausage-log corned-beef-can lasagne-tray)
for p in "${products[@]}"; do
  # exit 1 (a target not demonstrated) still writes a report; only 2 (bad input) stops here
  "$cc" run "products/$p.toml" --format html --out "$out/$p.html" --date "$date" || [ $? -eq 1 ]
  "$cc" run "products/$p.toml" --format md --out "$out/$p.md" --date "$date" || [ $? -eq 1 ]
done
"$cc" probe products/logs/kofta-probe.csv --organism listeria-monocytogenes --target-log 6 \
  --rule two-stage-6h --format html --out "$out/kofta-probe.html" --date "$date" || [ $? -eq 1 ]
"$cc" probe products/logs/kofta-probe.csv --organism listeria-monocytogenes --target-log 6 \
  --rule two-stage-6h --format md --out "$out/kofta-probe.md" --date "$date" || [ $? -eq 1 ]
# An inverse answer (with the worst case of the file's ranges) and a deviation record.
for fmt in html md; do
  "$cc" solve products/kofta-balls.toml --for hold-time --conservative \
    --format "$fmt" --out "$out/kofta-balls-solve.$fmt" --date "$date" || [ $? -eq 1 ]
  "$cc" deviation products/corned-beef-can.toml --medium-log products/logs/corned-beef-hold-deviation.csv \
    --lot CB-0412 --format "$fmt" --out "$out/corned-beef-can-deviation.$fmt" --date "$date" || [ $? -eq 1 ]
done
# A heat-penetration study (invented: six cans, logs from the finite-volume generator), the
# product file it calibrates, and the hold that file needs with the fit's bound beside it. The
# calibrated file is read from standard input so that no scratch path enters the reports.
study=(products/corned-beef-can-study.toml --probe-log products/logs/can-study-probes.csv
       --medium-log products/logs/can-study-medium.csv --date "$date")
for fmt in html md; do
  "$cc" fit "${study[@]}" --format "$fmt" --out "$out/corned-beef-can-study-fit.$fmt"
done
"$cc" fit "${study[@]}" --write-product "$out/corned-beef-can-calibrated.toml" > /dev/null
for fmt in html md; do
  "$cc" solve - --for hold-time --library products --format "$fmt" --date "$date" \
    --out "$out/corned-beef-can-calibrated-solve.$fmt" < "$out/corned-beef-can-calibrated.toml" || [ $? -eq 1 ]
done
