#!/usr/bin/env bash
# Reproduces every benchmark figure in one command: installs what the benchmarks need on a
# fresh Debian machine (Chromium for page_load.py, wrk for load.py, the package with its test
# extras for Playwright), then runs bench/api_bench.py, bench/load.py and bench/page_load.py
# and prints their figures. Figures only, no pass/fail; the exit status is non-zero only when
# a benchmark could not run. Benchmarks share the machine: run it when the machine is quiet
# (the load average is printed before each one).
#
#   bash bench/run_all.sh
set -uo pipefail
cd "$(dirname "$0")/.."

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }
missing=()
command -v chromium >/dev/null 2>&1 || missing+=(chromium fonts-liberation)
command -v wrk >/dev/null 2>&1 || missing+=(wrk)
if [ ${#missing[@]} -gt 0 ]; then
  as_root apt-get update -qq || exit 1
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" || exit 1
fi
python3 -m pip install --quiet --disable-pip-version-check -e ".[test]" || exit 1

failed=()
run() {
  echo
  echo "== $* ($(nproc) cores, load average $(cut -d' ' -f1-3 /proc/loadavg))"
  # waitress warns "Task queue depth is N" on standard error for every request that waits for a
  # free thread; hundreds of such lines would bury the figures (load.py counts them instead).
  if ! python3 "$@" 2> >(grep -v '^Task queue depth is' >&2); then failed+=("$1"); fi
}
echo "webcalc $(python3 -c 'import webcalc; print(webcalc.__version__)'), $(python3 --version), $(wrk --version 2>&1 | head -n 1 | cut -d' ' -f1-2), $(chromium --version 2>/dev/null)"
run bench/api_bench.py
run bench/load.py
run bench/page_load.py

echo
if [ ${#failed[@]} -gt 0 ]; then
  echo "could not run: ${failed[*]}"
  exit 1
fi
echo "all benchmarks ran"
