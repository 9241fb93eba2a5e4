#!/bin/bash
# Compares two builds of fillcast on this noisy machine by alternating them:
# ROUNDS times, each build simulates RUNS demo-plan runs on one thread
# (fillcast_step_count); prints each build's minimum and median user time,
# and its rate in simulated steps per CPU second (what to compare when the
# two builds simulate different numbers of steps, as builds whose random
# streams differ do). The minimum is the least disturbed measurement; the
# ratio of the rates at the minima is the speed-up.
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
    out=$({ /usr/bin/time -f "%U" "$build/bench/fillcast_step_count" "$plan" "$runs"; } 2>&1)
    # out: "<steps> simulated steps in <runs> runs" and then the user time
    echo "$build $(echo "$out" | awk 'NR == 1 {print $1} END {print $1}' | tr '\n' ' ')"
  done
done | python3 -c '
import statistics, sys
times, steps = {}, {}
for line in sys.stdin:
    build, n, t = line.split()
    times.setdefault(build, []).append(float(t))
    steps[build] = int(n)
for build, t in times.items():
    rate = steps[build] / max(min(t), 1e-9) / 1e6
    print(f"{build:40s} min {min(t):6.3f} s   median {statistics.median(t):6.3f} s"
          f"   {steps[build]} steps, {rate:5.1f} M steps/s at the minimum")
'
