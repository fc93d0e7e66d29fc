#!/usr/bin/env bash
# Fuzz the case loader and load + evaluate + plan with libFuzzer.
#
#   bash tools/run-fuzz.sh [SECONDS]      # each target for SECONDS (default 60)
#
# Sets up build-fuzz (clang, AddressSanitizer + UndefinedBehaviorSanitizer),
# builds the two targets, runs each on a copy of the seed corpus
# (sample-cases/*.cwcase, tests/data/good/*, tests/data/bad/*), and copies any
# crash, timeout, leak or out-of-memory input to tests/fuzz/regressions/<target>/,
# where the fuzz-replay suite of the normal build feeds it again.  Exits 1 when
# a target found something.
#
# Longer runs (see tests/fuzz/README.md):
#   CW_FUZZ_CORPUS=$HOME/cw-fuzz CW_FUZZ_JOBS=2 bash tools/run-fuzz.sh 3600
# keeps the grown corpus in $CW_FUZZ_CORPUS/<target> from one run to the next
# and runs CW_FUZZ_JOBS fuzzing processes a target (libFuzzer -fork).
set -euo pipefail
cd "$(dirname "$0")/.."

seconds=${1:-60}
build=${CW_FUZZ_BUILD:-build-fuzz}
jobs=${CW_FUZZ_JOBS:-1}
targets=(fuzz-load fuzz-evaluate)

if [ ! -f "$build/build.ninja" ]; then
  rm -rf "$build"
  CC=clang meson setup "$build" --buildtype=debugoptimized -Dfuzzing=true \
    -Db_sanitize=address,undefined -Db_lundef=false
fi
ninja -C "$build" "${targets[@]/#/tests/fuzz/}"

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
export ASAN_OPTIONS=${ASAN_OPTIONS:-abort_on_error=1:detect_leaks=1:symbolize=1}
export UBSAN_OPTIONS=${UBSAN_OPTIONS:-halt_on_error=1:print_stacktrace=1}
export LSAN_OPTIONS=${LSAN_OPTIONS:-suppressions=$PWD/tools/lsan.supp:print_suppressions=0}

# One line a target in meson's testlog format, for tools/test-tally.py.
mkdir -p "$build/meson-logs"
tally_log=$build/meson-logs/fuzz.json
: >"$tally_log"

status=0
for target in "${targets[@]}"; do
  corpus=$work/$target/corpus
  artifacts=$work/$target/artifacts
  mkdir -p "$corpus" "$artifacts"
  cp sample-cases/*.cwcase tests/data/good/* tests/data/bad/* "$corpus"/
  if [ -n "${CW_FUZZ_CORPUS:-}" ]; then
    mkdir -p "$CW_FUZZ_CORPUS/$target"
    corpus_dirs=("$CW_FUZZ_CORPUS/$target" "$corpus")
  else
    corpus_dirs=("$corpus")
  fi
  fork=()
  if [ "$jobs" -gt 1 ]; then
    fork=(-fork="$jobs" -ignore_crashes=0)
  fi
  log=$work/$target/log
  echo "== $target: ${seconds}s, $jobs job(s)"
  rc=0
  "$build/tests/fuzz/$target" "${corpus_dirs[@]}" "${fork[@]}" \
    -max_total_time="$seconds" -max_len=65536 -timeout=5 -rss_limit_mb=2048 \
    -dict=tests/fuzz/case.dict -artifact_prefix="$artifacts/" \
    -print_final_stats=1 >"$log" 2>&1 || rc=$?
  grep -E '^(stat::number_of_executed_units|stat::peak_rss_mb|stat::new_units_added)|^#[0-9]+.*DONE' "$log" || true
  found=$(find "$artifacts" -type f | wc -l)
  result=OK
  if [ "$rc" -ne 0 ] || [ "$found" -gt 0 ]; then
    result=FAIL
  fi
  execs=$(sed -n 's/^stat::number_of_executed_units: *//p' "$log" | tail -1)
  printf '{"name": "%s (%ss, %s runs)", "result": "%s", "stdout": ""}\n' \
    "$target" "$seconds" "${execs:-0}" "$result" >>"$tally_log"
  if [ "$result" = FAIL ]; then
    status=1
    mkdir -p "tests/fuzz/regressions/$target"
    find "$artifacts" -type f -exec cp {} "tests/fuzz/regressions/$target/" \;
    echo "!! $target found a problem (exit $rc); inputs kept in tests/fuzz/regressions/$target/:"
    find "$artifacts" -type f -printf '   %f\n'
    grep -E -m1 -A30 'ERROR: (AddressSanitizer|LeakSanitizer|libFuzzer)|runtime error|^ERROR:|Bail out|ERROR \*\*|CRITICAL \*\*|WARNING \*\*' "$log" \
      | grep -v '^ *#[0-9]* 0x.* in fuzzer::' | head -40 || tail -40 "$log"
  fi
done
exit $status
