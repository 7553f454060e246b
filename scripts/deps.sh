#!/usr/bin/env bash
# Installs the Debian packages coldcore needs, only those that are missing.
# Sourced by demo.sh and test.sh. Needs root (or sudo) when something is missing.
set -euo pipefail

coldcore_packages=(g++ cmake make libboost-dev libeigen3-dev libcli11-dev libtomlplusplus-dev doctest-dev)

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
