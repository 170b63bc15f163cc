#!/usr/bin/env bash
# The README's first command ends with ci/demo: it must run the demo end to end, print the gate
# decisions (v1 passes against itself, v2 fails against v1) and list reports that exist.
set -euo pipefail
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
TREEGATE="$TREEGATE" "$SOURCE_DIR/ci/demo" "$tmp/out" > "$tmp/log" 2>&1 || { cat "$tmp/log"; echo "FAIL: ci/demo exited $?"; exit 1; }
grep -q "v1: gate PASSED   v2 against v1: gate FAILED   compare: gate FAILED" "$tmp/log" || { tail -20 "$tmp/log"; echo "FAIL: decisions"; exit 1; }
for f in v1.html v2.html compare.html v1.junit.xml v2.junit.xml v1.summary.json v2.results.jsonl; do
  [ -s "$tmp/out/$f" ] || { echo "FAIL: $f missing"; exit 1; }
  grep -q "    $tmp/out/$f" "$tmp/log" || { echo "FAIL: $f not listed"; exit 1; }
done
echo "ci/demo ok"
