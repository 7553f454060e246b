#!/usr/bin/env bash
# Installs what is missing, builds coldcore (Release, in build/) and runs the demo: the invented
# Harbour Lane Kitchen products through their processes, a measured-log check, and the example
# reports regenerated in reports/.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source scripts/deps.sh
coldcore_install_missing "${coldcore_packages[@]}"

cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$(nproc)"

cc=build/coldcore
say() { printf '\n== %s\n' "$*"; }
say "$($cc --version)"
say "Eigenvalues of a sphere at Bi = 5 (teaching view)"
$cc modes --shape sphere --biot 5 --count 4
for p in kofta-balls chicken-sausage-log corned-beef-can lasagne-tray; do
  say "coldcore run products/$p.toml"
  $cc run "products/$p.toml" || echo "(exit $?: a target was not demonstrated)"
done
say "coldcore probe products/logs/kofta-probe.csv (an invented measured log)"
$cc probe products/logs/kofta-probe.csv --organism listeria-monocytogenes --target-log 6 --rule two-stage-6h || true
say "coldcore solve products/corned-beef-can.toml --for hold-time"
$cc solve products/corned-beef-can.toml --for hold-time || true
say "coldcore deviation: the invented retort dip of the corned beef hold"
$cc deviation products/corned-beef-can.toml --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412 || true
say "coldcore fit: an invented heat-penetration study of six cans, calibrating the model"
$cc fit products/corned-beef-can-study.toml --probe-log products/logs/can-study-probes.csv \
  --medium-log products/logs/can-study-medium.csv --write-product build/corned-beef-can-calibrated.toml || true
say "coldcore solve on the calibrated product: the hold, and the hold at the fit's 95 % bound"
$cc solve build/corned-beef-can-calibrated.toml --for hold-time --library products || true
say "Example reports"
scripts/make_reports.sh "$cc" reports
ls -1 reports
