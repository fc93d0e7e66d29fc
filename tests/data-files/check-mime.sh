#!/bin/sh
# check-mime.sh MIME_XML SAMPLE_DIR: build a MIME database holding only
# MIME_XML in a temporary folder and check that GIO names the sample case and
# library by their extension and by their content alone.
set -u
mime_xml=$1 samples=$2
for tool in update-mime-database:shared-mime-info gio:libglib2.0-bin; do
  if ! command -v "${tool%%:*}" >/dev/null 2>&1; then
    echo "SKIP: ${tool%%:*} is not installed (Debian package ${tool#*:})"
    exit 77
  fi
done

tmp=$(mktemp -d) || exit 1
trap 'rm -rf "$tmp"' EXIT
mkdir -p "$tmp/data/mime/packages" "$tmp/files"
cp "$mime_xml" "$tmp/data/mime/packages/"
update-mime-database "$tmp/data/mime" 2>/dev/null || { echo "FAIL: update-mime-database refused $mime_xml"; exit 1; }

set -- "$samples"/*.cwcase
case_file=$1
set -- "$samples"/*.cwlib
lib_file=$1
cp "$case_file" "$tmp/files/named.cwcase"
cp "$case_file" "$tmp/files/case-without-extension"
cp "$lib_file" "$tmp/files/named.cwlib"
cp "$lib_file" "$tmp/files/library-without-extension"
printf '{"format":"canalwright-case","version":1}\n' > "$tmp/files/compact-case"
printf '{\n  "format" : "canalwright-library"\n}\n' > "$tmp/files/spaced-library"
printf '{"format": "something-else"}\n' > "$tmp/files/other.json"

failed=0
expect () {
  got=$(XDG_DATA_HOME="$tmp/data" XDG_DATA_DIRS="$tmp/data:${XDG_DATA_DIRS:-/usr/local/share:/usr/share}" \
        gio info -a standard::content-type "$tmp/files/$1" | sed -n 's/.*standard::content-type: //p')
  if [ "$got" = "$2" ]; then
    echo "ok   $1: $got"
  else
    echo "FAIL $1: got '$got', expected '$2'"
    failed=1
  fi
}
expect named.cwcase application/x-canalwright-case
expect case-without-extension application/x-canalwright-case
expect compact-case application/x-canalwright-case
expect named.cwlib application/x-canalwright-library
expect library-without-extension application/x-canalwright-library
expect spaced-library application/x-canalwright-library
expect other.json application/json
[ "$failed" -eq 0 ] && echo "PASS"
exit "$failed"
