#!/usr/bin/env bash
# Set everything up on Debian 12, build, and open Canalwright on a demo case.
# Runs from the build folder with nothing installed: the settings schema is
# the one compiled there.
set -euo pipefail
cd "$(dirname "$0")/.."

bash tools/setup-debian.sh
[ -f build/build.ninja ] || meson setup build --buildtype=debugoptimized
ninja -C build
export GSETTINGS_SCHEMA_DIR="$PWD/build/resources"
exec ./build/src/canalwright sample-cases/lower-molar-moderate.cwcase
