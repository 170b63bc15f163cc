#!/usr/bin/env bash
# The HTML report in a real browser: Debian's chromium (driven by playwright-core, see
# tests/e2e/browser/) loads from file:// the demo run's report, the demo's v2-against-v1
# report, the demo's `compare` report and a report full of hostile text, and checks them (no console errors, no requests,
# one row per case of the summary JSON, opened cases show SVG trees with one word per word of
# the sentence, sorting, filtering, escaping). Screenshots: $BUILD_DIR/test-output/html/.
# Without chromium, node or playwright-core the test fails when CI is set, else says "not run".
set -euo pipefail
: "${TREEGATE:?}" "${SOURCE_DIR:?}" "${BUILD_DIR:?}"
chromium=${TREEGATE_CHROMIUM:-/usr/bin/chromium}
driver="$SOURCE_DIR/tests/e2e/browser"
out="$BUILD_DIR/test-output/html"

missing() {
  if [ -n "${CI:-}" ]; then
    echo "FAIL: $1 (ci/install-deps installs it)"
    exit 1
  fi
  echo "not run: $1 (run ci/install-deps)"
  exit 0
}
[ -x "$chromium" ] || missing "no browser at $chromium"
command -v node >/dev/null || missing "node is not installed"
[ -d "$driver/node_modules/playwright-core" ] || missing "playwright-core is not installed in $driver"

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
mkdir -p "$out"

# Runs treegate; exit 0 (gate passed) and 1 (gate failed) are both fine here.
run_treegate() {
  local rc=0
  "$TREEGATE" "$@" >"$work/console.txt" 2>&1 || rc=$?
  if [ "$rc" -gt 1 ]; then
    echo "FAIL: treegate $* exited $rc"
    cat "$work/console.txt"
    exit 1
  fi
}

check() {  # name report results summary [expected texts...]
  local name=$1 report=$2 results=$3 summary=$4
  shift 4
  local extra=()
  for t in "$@"; do extra+=(--expect-text "$t"); done
  node "$driver/check_report.mjs" --report "$report" --results "$results" --summary "$summary" \
    --out "$out" --name "$name" --chromium "$chromium" "${extra[@]}"
}

# 1. The demo: v1 alone, then v2 against v1 as the baseline (old beside new beside gold).
demo="$SOURCE_DIR/suites/demo"
(cd "$demo" && run_treegate run --config treegate.yaml --results "$work/v1.jsonl" \
  --summary-json "$work/v1.json" --html "$out/demo-run.html")
(cd "$demo" && run_treegate run --config treegate.yaml --grammar v2.pcfg \
  --baseline "$work/v1.jsonl" --results "$work/v2.jsonl" --summary-json "$work/v2.json" \
  --html "$out/demo-baseline.html")
# `compare` of the two results files: old beside new beside gold, error classes, significance.
run_treegate compare "$work/v1.jsonl" "$work/v2.jsonl" --html "$out/demo-compare.html"
# `report` renders the same page from the results file without parsing again.
run_treegate report "$work/v2.jsonl" --baseline "$work/v1.jsonl" --html "$work/again.html"
grep -q 'id="case-list"' "$work/again.html" || { echo "FAIL: report --html wrote no case list"; exit 1; }

# 2. Hostile text in words, labels, ids, suite names, constructions and the grammar's words.
# The grammar prefers a flat ending, so the right-branching gold trees fail and get marks.
cat >"$work/hostile.pcfg" <<'EOF'
@start S
S -> W S 0.5
S -> W 0.3
S -> W W 0.2
W -> "<script>alert" 0.2
W -> "</script>" 0.1
W -> "&amp;" 0.1
W -> "]]>" 0.1
W -> "\"quoted\"" 0.1
W -> "na\u00efve" 0.1
W -> "<img/src=x/onerror=alert>" 0.1
W -> "'single'" 0.1
W -> "漢字" 0.1
EOF
sed -i 's/na\\u00efve/naïve/' "$work/hostile.pcfg"
cat >"$work/hostile.yaml" <<'EOF'
suite: "<i>hostile</i>"
about: "<b>not bold</b>"
constructions: ["<u>tag</u>"]
cases:
  - id: "<script>id</script>"
    tree: '(S (W <script>alert) (S (W &amp;) (S (W ]]>) (S (W </script>)))))'
  - id: "q\"uote'"
    tree: '(S (W "quoted") (S (W naïve) (S (W 漢字))))'
  - id: img
    tree: '(S (W <img/src=x/onerror=alert>) (W ''single''))'
EOF
cat >"$work/treegate.yaml" <<'EOF'
grammar: hostile.pcfg
suites: [hostile.yaml]
EOF
(cd "$work" && run_treegate run --config treegate.yaml --results "$work/hostile.jsonl" \
  --summary-json "$work/hostile.json" --html "$out/hostile.html")

status=0
check demo-run "$out/demo-run.html" "$work/v1.jsonl" "$work/v1.json" || status=1
check demo-baseline "$out/demo-baseline.html" "$work/v2.jsonl" "$work/v2.json" || status=1
check demo-compare "$out/demo-compare.html" "$work/v2.jsonl" "$work/v2.json" || status=1
check hostile "$out/hostile.html" "$work/hostile.jsonl" "$work/hostile.json" \
  "<script>alert" "</script>" "&amp;" "]]>" '"quoted"' "<img/src=x/onerror=alert>" \
  "<i>hostile</i>" "<script>id</script>" "漢字" "naïve" "'single'" || status=1
echo "screenshots and reports: $out"
exit $status
