#!/usr/bin/env bash
# Installs what is missing, builds coldcore (Release, in build/) and runs the demo.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source scripts/deps.sh
coldcore_install_missing "${coldcore_packages[@]}"

cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$(nproc)"

cc=build/coldcore
echo "== coldcore $($cc --version)"
echo "== Eigenvalues of a sphere at Bi = 5 (teaching view)"
$cc modes --shape sphere --biot 5 --count 6
