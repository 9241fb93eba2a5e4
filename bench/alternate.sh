#!/bin/bash
# Compares two builds of fillcast on this noisy machine by alternating them:
# ROUNDS times, each build simulates RUNS demo-plan runs on one thread
# (fillcast_step_count); prints each build's minimum and median user time.
# The minimum is the least disturbed measurement; their ratio is the speed-up.
#   bash bench/alternate.sh OLD_BUILD_DIR NEW_BUILD_DIR [ROUNDS] [RUNS]
set -euo pipefail
if [ $# -lt 2 ]; then
  echo "usage: bash bench/alternate.sh OLD_BUILD_DIR NEW_BUILD_DIR [ROUNDS] [RUNS]" >&2
  exit 2
fi
old=$1 new=$2 rounds=${3:-20} runs=${4:-200}
plan="$(cd "$(dirname "$0")/.." && pwd)/demo-site/plan.yaml"
for build in "$old" "$new"; do
  if [ ! -x "$build/bench/fillcast_step_count" ]; then
    echo "alternate.sh: no $build/bench/fillcast_step_count; build it first" >&2
    exit 2
  fi
done
for _ in $(seq "$rounds"); do
  for build in "$old" "$new"; do
    t=$({ /usr/bin/time -f "%U" "$build/bench/fillcast_step_count" "$plan" "$runs" \
          >/dev/null; } 2>&1)
    echo "$build $t"
  done
done | python3 -c '
import statistics, sys
times = {}
for line in sys.stdin:
    build, t = line.split()
    times.setdefault(build, []).append(float(t))
for build, t in times.items():
    print(f"{build:40s} min {min(t):6.3f} s   median {statistics.median(t):6.3f} s")
'
