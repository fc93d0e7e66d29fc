#!/usr/bin/env bash
# Set everything up on Debian 12, build, and open Canalwright on a demo case.
set -euo pipefail
cd "$(dirname "$0")/.."

bash tools/setup-debian.sh
[ -f build/build.ninja ] || meson setup build --buildtype=debugoptimized
ninja -C build
exec ./build/src/canalwright --check sample-cases/lower-molar-moderate.cwcase
