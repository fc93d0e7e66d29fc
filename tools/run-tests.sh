#!/usr/bin/env bash
# Set everything up on Debian 12, build, run every test and print the tally
# ('N passed, N failed, N skipped'); exits non-zero on any failure.
#
# After the normal suite come the hardening stages, each counted in the same
# tally: the whole suite under AddressSanitizer + UndefinedBehaviorSanitizer
# (build-asan), the engine and io tests under valgrind, and a short libFuzzer
# run of each fuzz target (build-fuzz).  CW_QUICK=1 skips those three for a
# quick run while developing; CW_FUZZ_SECONDS (default 60) sets the fuzzing
# time a target.  Extra arguments go to the normal suite's meson test.
set -euo pipefail
cd "$(dirname "$0")/.."

bash tools/setup-debian.sh
if [ ! -f build/build.ninja ]; then
  rm -rf build
  meson setup build --buildtype=debugoptimized
fi
ninja -C build

status=0
logs=(build/meson-logs/testlog.json)
meson test -C build --print-errorlogs --num-processes 2 "$@" || status=$?

# A stage that fails before meson test writes its log still counts once,
# as a failed "test" named after the stage, in build/meson-logs/stages.json.
stages_log=build/meson-logs/stages.json
: >"$stages_log"
logs+=("$stages_log")

stage() {
  local name=$1 log=$2 rc=0 start=$SECONDS
  shift 2
  echo "=== $name"
  rm -f "$log"
  "$@" || rc=$?
  echo "=== $name: exit $rc after $((SECONDS - start)) s"
  if [ -f "$log" ]; then
    logs+=("$log")
  fi
  if [ "$rc" -ne 0 ]; then
    status=1
    if [ ! -f "$log" ]; then
      printf '{"name": "%s", "result": "FAIL", "stdout": ""}\n' "$name" >>"$stages_log"
    fi
  fi
}

if [ "${CW_QUICK:-0}" != 1 ]; then
  stage "sanitizers (build-asan)" build-asan/meson-logs/testlog.json \
    bash tools/run-sanitizers.sh
  stage "valgrind (unit, reference)" build/meson-logs/testlog-valgrind.json \
    bash tools/run-valgrind.sh
  stage "fuzzing (build-fuzz)" build-fuzz/meson-logs/fuzz.json \
    bash tools/run-fuzz.sh "${CW_FUZZ_SECONDS:-60}"
fi

python3 tools/test-tally.py "${logs[@]}" || status=1
exit $status
