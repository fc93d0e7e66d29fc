#!/usr/bin/env bash
# Run the engine and io tests (suites unit and reference) of the plain build
# under valgrind memcheck: any memory error or definite leak fails the test.
# Extra arguments go to meson test.
set -euo pipefail
cd "$(dirname "$0")/.."

build=${CW_BUILD:-build}
if [ ! -f "$build/build.ninja" ]; then
  rm -rf "$build"
  meson setup "$build" --buildtype=debugoptimized
fi
ninja -C "$build"

# GLib's slice allocator and GC-friendly mode keep valgrind's view exact.
export G_SLICE=always-malloc G_DEBUG=gc-friendly
# Tests with time limits stretch them by this factor (tests/hardening).
export CW_TEST_TIME_SCALE=${CW_TEST_TIME_SCALE:-10}
meson test -C "$build" --suite unit --suite reference --num-processes 2 \
  --timeout-multiplier 10 --print-errorlogs \
  --wrapper 'valgrind --leak-check=full --errors-for-leak-kinds=definite --error-exitcode=1 --quiet' \
  "$@"
