#!/usr/bin/env bash
# Installs what is missing, builds coldcore (Release, in build/) and runs the whole test suite;
# then builds and runs it again with AddressSanitizer and UndefinedBehaviorSanitizer (build-asan/).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source scripts/deps.sh
coldcore_install_missing "${coldcore_packages[@]}"

jobs="$(nproc)"
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$jobs"
(cd build && ctest --output-on-failure -j"$jobs")

cmake -S . -B build-asan -DCMAKE_BUILD_TYPE=RelWithDebInfo -DCOLDCORE_SANITIZE=ON -DCOLDCORE_BUILD_BENCH=OFF >/dev/null
cmake --build build-asan -j"$jobs"
(cd build-asan && ASAN_OPTIONS=detect_leaks=1 UBSAN_OPTIONS=print_stacktrace=1 ctest --output-on-failure -j"$jobs")
