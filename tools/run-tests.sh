#!/usr/bin/env bash
# Set everything up on Debian 12, build, run every test and print the tally
# ('N passed, N failed, N skipped'); exits non-zero on any failure.
set -euo pipefail
cd "$(dirname "$0")/.."

bash tools/setup-debian.sh
if [ ! -f build/build.ninja ]; then
  rm -rf build
  meson setup build --buildtype=debugoptimized
fi
ninja -C build

status=0
meson test -C build --print-errorlogs --num-processes 2 "$@" || status=$?
python3 tools/test-tally.py build/meson-logs/testlog.json || status=1
exit $status
