#!/usr/bin/env python3
"""Print 'N passed, N failed, N skipped' from one or more meson testlog.json.

    test-tally.py build/meson-logs/testlog.json [build-asan/meson-logs/testlog.json ...]

Counts GTest cases (TAP lines) where a test program reports them, so the
tally reflects every check, not just every program.  A case marked
incomplete ('not ok N ... # TODO', a known problem awaiting a fix) counts as
skipped and is named on stderr.  Each further log adds its counts to the
same single line.  Exits 1 on any failure, when a log is missing, or when no
test ran."""
import json
import re
import sys

OK = re.compile(r"^ok \d+(?!.*# SKIP)", re.M)
SKIP = re.compile(r"^ok \d+.*# SKIP", re.M)
TODO = re.compile(r"^not ok \d+ ?(.*?)# TODO(.*)$", re.M)
BAD = re.compile(r"^not ok \d+(?!.*# TODO)", re.M)


def tally(path, counts, todos):
    with open(path, encoding="utf-8") as log:
        for line in log:
            entry = json.loads(line)
            result = entry.get("result")
            stdout = entry.get("stdout") or ""
            oks = len(OK.findall(stdout))
            skips = len(SKIP.findall(stdout))
            bad = len(BAD.findall(stdout))
            for name, why in TODO.findall(stdout):
                todos.append(f"{entry.get('name')}: {name.strip()}:{why}")
            skips += len(TODO.findall(stdout))
            if result in ("OK", "EXPECTEDFAIL"):
                counts[0] += max(oks, 1) if not skips else oks
                counts[2] += skips
            elif result == "SKIP":
                counts[2] += max(skips, 1)
            else:
                counts[0] += oks
                counts[2] += skips
                counts[1] += max(bad, 1)


def main(paths):
    counts = [0, 0, 0]
    todos = []
    missing = False
    for path in paths:
        try:
            tally(path, counts, todos)
        except FileNotFoundError:
            print(f"test-tally: no test log {path}", file=sys.stderr)
            missing = True
    for todo in todos:
        print(f"incomplete (counted as skipped): {todo}", file=sys.stderr)
    passed, failed, skipped = counts
    print(f"{passed} passed, {failed} failed, {skipped} skipped")
    return 1 if failed or missing or passed == 0 else 0


if __name__ == "__main__":
    if len(sys.argv) < 2:
        sys.exit("usage: test-tally.py TESTLOG.json [TESTLOG.json ...]")
    sys.exit(main(sys.argv[1:]))
