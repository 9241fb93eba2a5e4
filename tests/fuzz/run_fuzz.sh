#!/usr/bin/env bash
# Builds the readers' libFuzzer targets and runs each for a while.
#
#   bash tests/fuzz/run_fuzz.sh [SECONDS]   seconds per target (default 50)
#
# Installs clang and libclang-rt-dev from Debian if missing (like
# .ci/setup), builds into build-fuzz/ (or $FILLCAST_FUZZ_BUILD_DIR) and runs
# fuzz_plan, fuzz_site_model, fuzz_met_csv and fuzz_records_csv, each on a
# copy of its seed
# corpus (tests/fuzz/corpus/<target>/) in a temporary folder, so the
# repository stays as it is. Any finding (crash, uncaught exception other
# than planner::InputError, hang, leak, sanitizer report) stops the script
# with a non-zero status; the input that caused it is saved in
# build-fuzz/findings/. DEVELOPERS.md ("Fuzzing") says how to go on from there.
set -euo pipefail
cd "$(dirname "$0")/../.."
seconds="${1:-50}"
build_dir="${FILLCAST_FUZZ_BUILD_DIR:-build-fuzz}"

missing=()
for p in clang libclang-rt-dev cmake make libyaml-cpp-dev libeigen3-dev libboost-dev; do
  if ! dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed"; then
    missing+=("$p")
  fi
done
if ((${#missing[@]})); then
  echo "fillcast fuzz: installing ${missing[*]}"
  sudo_cmd=()
  if [ "$(id -u)" -ne 0 ]; then sudo_cmd=(sudo); fi
  "${sudo_cmd[@]}" apt-get update -qq
  DEBIAN_FRONTEND=noninteractive "${sudo_cmd[@]}" apt-get install -y -qq "${missing[@]}"
fi

jobs="$(nproc 2>/dev/null || echo 2)"
CC=clang CXX=clang++ cmake -S . -B "$build_dir" -DFILLCAST_FUZZ=ON \
  -DFILLCAST_BUILD_TESTS=OFF -DFILLCAST_BUILD_BENCH=OFF \
  -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
cmake --build "$build_dir" -j "$jobs" --target fuzz_plan fuzz_site_model fuzz_met_csv \
  fuzz_records_csv

findings="$build_dir/findings"
mkdir -p "$findings"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
for target in plan site_model met_csv records_csv; do
  dict=tests/fuzz/yaml.dict
  case "$target" in *_csv) dict=tests/fuzz/csv.dict ;; esac
  cp -r "tests/fuzz/corpus/$target" "$work/$target"
  echo "fillcast fuzz: fuzz_$target for ${seconds} s"
  # -timeout: one input taking this long is a hang; -rss_limit_mb: memory.
  if ! "$build_dir/fuzz/fuzz_$target" "$work/$target" -dict="$dict" \
      -max_total_time="$seconds" -timeout=10 -rss_limit_mb=2048 -max_len=8192 \
      -print_final_stats=1 -artifact_prefix="$findings/${target}-" \
      >"$work/$target.log" 2>&1; then
    tail -n 60 "$work/$target.log"
    echo "fillcast fuzz: fuzz_$target found a problem; input saved in $findings/" >&2
    exit 1
  fi
  grep -E "^stat::number_of_executed_units|^stat::new_units_added" "$work/$target.log" || true
done
echo "fillcast fuzz: no findings"
