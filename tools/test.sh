#!/usr/bin/env bash
# Installs everything the tests need on a fresh Debian machine, then runs the whole suite.
# Extra arguments go to pytest (for example: bash tools/test.sh -m "not browser and not slow").
set -euo pipefail
cd "$(dirname "$0")/.."

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }
missing=()
command -v chromium >/dev/null 2>&1 || missing+=(chromium fonts-liberation)
command -v node >/dev/null 2>&1 || missing+=(nodejs)
if [ ${#missing[@]} -gt 0 ]; then
  as_root apt-get update -qq
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}"
fi

python3 -m pip install --quiet --disable-pip-version-check -e ".[test]"
python3 -m pytest "$@"
