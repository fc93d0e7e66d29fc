#!/usr/bin/env python3
"""Print 'N passed, N failed, N skipped' from meson's testlog.json.

Counts GTest cases (TAP lines) where a test program reports them, so the
tally reflects every check, not just every program.  Exits 1 on any failure
or when no test ran."""
import json
import re
import sys

passed = failed = skipped = 0
with open(sys.argv[1], encoding="utf-8") as log:
    for line in log:
        entry = json.loads(line)
        result = entry.get("result")
        stdout = entry.get("stdout") or ""
        oks = len(re.findall(r"^ok \d+(?! # SKIP)", stdout, re.M))
        skips = len(re.findall(r"^ok \d+.*# SKIP", stdout, re.M))
        bad = len(re.findall(r"^not ok \d+", stdout, re.M))
        if result in ("OK", "EXPECTEDFAIL"):
            passed += max(oks, 1) if not skips else oks
            skipped += skips
        elif result == "SKIP":
            skipped += max(skips, 1)
        else:
            passed += oks
            skipped += skips
            failed += max(bad, 1)
print(f"{passed} passed, {failed} failed, {skipped} skipped")
sys.exit(1 if failed or passed == 0 else 0)
