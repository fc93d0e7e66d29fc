#!/bin/sh
# check-install.sh BUILDDIR [PREFIX BINDIR DATADIR]: install BUILDDIR into a
# temporary DESTDIR (no rebuild) and check that every file the desktop needs
# is where it belongs. Without the last three arguments they are read from
# the build's introspection data. BUILDDIR's install log is put back as it was.
set -u
builddir=$(cd "$1" && pwd) || exit 1
meson=${MESON:-meson}
app_id=org.canalwright.Canalwright

if [ $# -ge 4 ]; then
  prefix=$2 bindir=$3 datadir=$4
else
  opts=$(python3 -c '
import json, sys
opts = {o["name"]: o["value"] for o in json.load(open(sys.argv[1]))}
print(opts["prefix"], opts["bindir"], opts["datadir"], sep="\n")
' "$builddir/meson-info/intro-buildoptions.json") || exit 1
  prefix=$(echo "$opts" | sed -n 1p)
  bindir=$(echo "$opts" | sed -n 2p)
  datadir=$(echo "$opts" | sed -n 3p)
fi
case $bindir in /*) ;; *) bindir=$prefix/$bindir ;; esac
case $datadir in /*) ;; *) datadir=$prefix/$datadir ;; esac

tmp=$(mktemp -d) || exit 1
log=$builddir/meson-logs/install-log.txt
if [ -f "$log" ]; then cp -p "$log" "$tmp/install-log.saved"; fi
# shellcheck disable=SC2317  # called through the trap
restore_log () {
  if [ -f "$tmp/install-log.saved" ]; then cp -p "$tmp/install-log.saved" "$log"; else rm -f "$log"; fi
  rm -rf "$tmp"
}
trap restore_log EXIT

root=$tmp/root
echo "$meson install -C $builddir --destdir $root --no-rebuild --quiet"
if ! "$meson" install -C "$builddir" --destdir "$root" --no-rebuild --quiet; then
  echo "FAIL: meson install failed"
  exit 1
fi

echo "Installed:"
(cd "$root" && find . \( -type f -o -type l \) | sed 's|^\.||' | sort | sed 's|^|  |')

failed=0
for path in \
  "$bindir/canalwright" \
  "$datadir/applications/$app_id.desktop" \
  "$datadir/metainfo/$app_id.metainfo.xml" \
  "$datadir/glib-2.0/schemas/$app_id.gschema.xml" \
  "$datadir/icons/hicolor/scalable/apps/$app_id.svg" \
  "$datadir/icons/hicolor/symbolic/apps/$app_id-symbolic.svg" \
  "$datadir/mime/packages/$app_id.mime.xml"
do
  if [ -f "$root$path" ] && [ -s "$root$path" ]; then
    echo "ok      $path"
  else
    echo "MISSING $path"
    failed=1
  fi
done
if [ ! -x "$root$bindir/canalwright" ]; then
  echo "FAIL: $bindir/canalwright is not executable"
  failed=1
fi

# Nothing may land outside the prefix, and no cache may be written into the
# staged tree (the post-install steps run on the target machine).
outside=$(cd "$root" && find . -type f | sed 's|^\.||' | grep -v "^$prefix/")
if [ -n "$outside" ]; then
  echo "FAIL: installed outside $prefix:"
  echo "$outside"
  failed=1
fi
for cache in "$datadir/glib-2.0/schemas/gschemas.compiled" "$datadir/mime/mime.cache" \
             "$datadir/icons/hicolor/icon-theme.cache" "$datadir/applications/mimeinfo.cache"; do
  if [ -e "$root$cache" ]; then
    echo "FAIL: $cache was written into the staged install"
    failed=1
  fi
done

[ "$failed" -eq 0 ] && echo "PASS"
exit "$failed"
