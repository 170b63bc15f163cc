#!/usr/bin/env bash
# The HTML report's wrong/missing marks against brackets computed with python3-nltk, on the
# demo's v1 and v2 runs (tests/reference/html_marks.py says how brackets are formed), and two
# page properties checked with outside tools: every drawn SVG is well-formed XML (xmllint), and
# with --no-timings the page is byte-identical for --jobs 1 and --jobs 2 and from `report`.
set -euo pipefail
: "${TREEGATE:?}" "${SOURCE_DIR:?}"
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cd "$SOURCE_DIR/suites/demo"
run() { "$TREEGATE" "$@" >/dev/null 2>&1 || [ $? -eq 1 ]; }
run run --config treegate.yaml --no-timings --jobs 1 --results "$work/v1.jsonl" --html "$work/v1.html"
run run --config treegate.yaml --no-timings --jobs 2 --results "$work/v1b.jsonl" --html "$work/v1b.html"
run run --config treegate.yaml --grammar v2.pcfg --no-timings --results "$work/v2.jsonl" --html "$work/v2.html"
run report "$work/v1.jsonl" --html "$work/v1c.html"

/usr/bin/python3 "$SOURCE_DIR/tests/reference/html_marks.py" "$work/v1.html" "$work/v1.jsonl"
/usr/bin/python3 "$SOURCE_DIR/tests/reference/html_marks.py" "$work/v2.html" "$work/v2.jsonl"

cmp "$work/v1.html" "$work/v1b.html" || { echo "FAIL: pages differ between --jobs 1 and 2"; exit 1; }
cmp "$work/v1.html" "$work/v1c.html" || { echo "FAIL: report --html differs from run --html"; exit 1; }

# Each inline SVG, cut out of the page, must be well-formed XML.
/usr/bin/python3 - "$work/v2.html" "$work/svg" <<'PY'
import os, re, sys
page = open(sys.argv[1], encoding="utf-8").read()
os.makedirs(sys.argv[2])
svgs = re.findall(r"<svg .*?</svg>", page, flags=re.S)
for i, s in enumerate(svgs):
    open(os.path.join(sys.argv[2], f"{i}.svg"), "w", encoding="utf-8").write(s)
print(f"{len(svgs)} SVG drawings cut out")
PY
xmllint --noout "$work"/svg/*.svg
echo "all SVG drawings well-formed; pages identical across --jobs and report"
