#!/bin/sh
# check-xml.sh FILE...: every file is well-formed XML (xmllint when installed,
# Python's parser otherwise).
if command -v xmllint >/dev/null 2>&1; then
  echo "xmllint --noout $*"
  xmllint --noout "$@" || { echo "FAIL: not well-formed"; exit 1; }
else
  echo "xmllint not installed (libxml2-utils); using python3 xml.etree"
  python3 -c '
import sys, xml.etree.ElementTree as ET
for path in sys.argv[1:]:
    ET.parse(path)
' "$@" || { echo "FAIL: not well-formed"; exit 1; }
fi
echo "PASS: $# file(s) well-formed"
