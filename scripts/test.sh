#!/usr/bin/env bash
# Installs what is missing, builds coldcore with g++ (Release, in build/) and runs the whole test
# suite; then builds it with clang++ and AddressSanitizer + UndefinedBehaviorSanitizer, with the
# libFuzzer harnesses (build-asan/), runs the suite again and fuzzes each parser briefly
# (scripts/fuzz.sh; COLDCORE_FUZZ_SECONDS per harness, default 15). Two compilers, one build each.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source scripts/deps.sh
coldcore_install_missing "${coldcore_packages[@]}"

jobs="$(nproc)"
CC=gcc CXX=g++ cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$jobs"
(cd build && ctest --output-on-failure -j"$jobs")

CC=clang CXX=clang++ cmake -S . -B build-asan -DCMAKE_BUILD_TYPE=RelWithDebInfo -DCOLDCORE_SANITIZE=ON \
  -DCOLDCORE_FUZZ=ON -DCOLDCORE_BUILD_BENCH=OFF >/dev/null
cmake --build build-asan -j"$jobs"
(cd build-asan && ASAN_OPTIONS=detect_leaks=1 UBSAN_OPTIONS=print_stacktrace=1 ctest --output-on-failure -j"$jobs")

bash scripts/fuzz.sh "${COLDCORE_FUZZ_SECONDS:-15}" build-asan
