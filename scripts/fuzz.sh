#!/usr/bin/env bash
# Runs every libFuzzer harness (tests/fuzz/*_fuzz.cpp) for SECONDS each and fails on the first
# crash, leak, UB report, input slower than 2 s, or memory use over 2 GB.
# Usage: scripts/fuzz.sh [SECONDS=30] [BUILD_DIR=build-asan]
# The build dir must be configured with clang++ and -DCOLDCORE_FUZZ=ON (scripts/test.sh does it).
# New inputs collect in BUILD_DIR/fuzz-corpus/<name> (kept between runs); a failing input is
# saved as BUILD_DIR/fuzz-artifacts/<name>-crash-... (rerun it: BUILD_DIR/fuzz_<name> FILE).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
seconds="${1:-30}"
build="${2:-build-asan}"
cd "$root"
[ -d "$build" ] || { echo "fuzz.sh: no build dir $build (configure with CXX=clang++ -DCOLDCORE_FUZZ=ON)" >&2; exit 2; }

# Seeds: the project's own files, by the parser that reads them.
library_files="products/organisms.toml products/cooling-rules.toml products/media.toml products/cooking-tables.toml"
seed_files() {
  case "$1" in
    organisms) echo products/organisms.toml ;;
    cooling_rules) echo products/cooling-rules.toml ;;
    media) echo products/media.toml tests/cli/media-split/media.toml ;;
    cooking_tables) echo products/cooking-tables.toml ;;
    logger_csv) find products tests/cli -name '*.csv' | sort ;;
    product_file)
      find products tests/cli -name '*.toml' | sort | while read -r f; do
        case " $library_files tests/cli/media-split/media.toml " in *" $f "*) ;; *) echo "$f" ;; esac
      done ;;
    cli) find tests/fuzz/seeds/cli -type f | sort ;;
  esac
}

export ASAN_OPTIONS="detect_leaks=1:allocator_may_return_null=1"
export UBSAN_OPTIONS="print_stacktrace=1:halt_on_error=1"
status=0
for bin in "$build"/fuzz_*; do
  [ -x "$bin" ] || continue
  name="${bin##*/fuzz_}"
  seeds="$build/fuzz-seeds/$name"
  corpus="$build/fuzz-corpus/$name"
  rm -rf "$seeds"
  mkdir -p "$seeds" "$corpus" "$build/fuzz-artifacts"
  for f in $(seed_files "$name"); do cp "$f" "$seeds/$(echo "$f" | tr / _)"; done
  echo "fuzz.sh: $name for ${seconds} s ($(ls "$seeds" | wc -l) seeds, $(ls "$corpus" | wc -l) in corpus)"
  if ! "$bin" -max_total_time="$seconds" -timeout=2 -rss_limit_mb=2048 -malloc_limit_mb=2048 -max_len=16384 \
      -print_final_stats=1 -artifact_prefix="$build/fuzz-artifacts/$name-" "$corpus" "$seeds" \
      >"$build/fuzz-$name.log" 2>&1; then
    echo "fuzz.sh: $name FAILED; log $build/fuzz-$name.log:" >&2
    tail -n 60 "$build/fuzz-$name.log" >&2
    status=1
  else
    grep -E "^stat::number_of_executed_units|^Done" "$build/fuzz-$name.log" | tr '\n' ' '; echo
  fi
done
exit "$status"
