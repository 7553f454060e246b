#!/usr/bin/env bash
# Installs the Debian packages coldcore needs, only those that are missing.
# Sourced by demo.sh and test.sh. Needs root (or sudo) when something is missing.
set -euo pipefail

# clang + libclang-rt-dev: the sanitizer build and the libFuzzer harnesses use clang++ and its
# ASan/UBSan/libFuzzer runtimes (scripts/test.sh, scripts/fuzz.sh).
coldcore_packages=(g++ clang libclang-rt-dev cmake make libboost-dev libeigen3-dev libcli11-dev libtomlplusplus-dev
  doctest-dev)

coldcore_install_missing() {
  local missing=()
  for p in "$@"; do
    dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  echo "coldcore: installing missing packages: ${missing[*]}"
  local sudo=""
  [ "$(id -u)" -ne 0 ] && sudo="sudo"
  export DEBIAN_FRONTEND=noninteractive
  $sudo apt-get update -qq
  $sudo apt-get install -y -qq --no-install-recommends "${missing[@]}"
}
