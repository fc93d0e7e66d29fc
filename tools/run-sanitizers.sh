#!/usr/bin/env bash
# Build with AddressSanitizer + UndefinedBehaviorSanitizer in build-asan and
# run the whole test suite there; extra arguments go to meson test.
# Exits non-zero on any failure; the tally comes from build-asan's testlog.
set -euo pipefail
cd "$(dirname "$0")/.."

build=${CW_ASAN_BUILD:-build-asan}
if [ ! -f "$build/build.ninja" ]; then
  rm -rf "$build"
  meson setup "$build" --buildtype=debugoptimized \
    -Db_sanitize=address,undefined -Db_lundef=false
fi
ninja -C "$build"

export ASAN_OPTIONS=${ASAN_OPTIONS:-detect_leaks=1:abort_on_error=1:detect_stack_use_after_return=1}
export LSAN_OPTIONS=suppressions=$PWD/tools/lsan.supp:print_suppressions=0
export UBSAN_OPTIONS=halt_on_error=1:print_stacktrace=1
# The GUI tests draw with cairo (GSK_RENDERER=cairo); without this GDK still
# probes OpenGL at start, and Mesa's software driver keeps 128 bytes that a
# suppression cannot name (the driver is unloaded before LeakSanitizer looks).
export GDK_DEBUG=${GDK_DEBUG:-gl-disable}
# Tests with time limits stretch them by this factor (tests/hardening).
export CW_TEST_TIME_SCALE=${CW_TEST_TIME_SCALE:-3}
# Timeouts stretched for the slower instrumented build.
# The benchmarks measure speed, which the instrumentation changes.
meson test -C "$build" --print-errorlogs --num-processes 2 --timeout-multiplier 3 \
  --no-suite bench "$@"
