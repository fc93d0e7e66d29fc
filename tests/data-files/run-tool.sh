#!/bin/sh
# run-tool.sh PACKAGE TOOL [ARG...]: run TOOL, or skip (exit 77) naming the
# Debian package to install when it is missing.
package=$1 tool=$2
shift 2
if ! command -v "$tool" >/dev/null 2>&1; then
  echo "SKIP: $tool is not installed (Debian package $package)"
  exit 77
fi
echo "$tool $*"
"$tool" "$@"
status=$?
if [ "$status" -eq 0 ]; then echo "PASS"; else echo "FAIL: $tool exited $status"; fi
exit "$status"
