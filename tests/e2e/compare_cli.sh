#!/usr/bin/env bash
# `treegate compare` and `treegate explain` end to end on the demo: grammars run through the
# config, results files, the JSON shape, exit codes, and bad input.
set -euo pipefail
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
fail() { echo "FAIL: $*"; exit 1; }
demo="$SOURCE_DIR/suites/demo"

# Two grammars: the config's suites are run with each first. v2 breaks cases v1 passed and the
# demo gate allows no new failures, so the exit code is 1.
set +e
(cd "$demo" && "$TREEGATE" compare v1.pcfg v2.pcfg --format json --jobs 2) > "$tmp/c.json" 2> "$tmp/err"
code=$?
set -e
[ "$code" = 1 ] || { cat "$tmp/err"; fail "compare v1 v2: expected exit 1, got $code"; }
/usr/bin/python3 - "$tmp/c.json" <<'PY'
import json, sys
j = json.load(open(sys.argv[1]))
t = j["transitions"]
assert sum(t.values()) == j["paired"], (t, j["paired"])
assert len(j["cases"]) == j["paired"] - t["unchanged"], len(j["cases"])
assert t["broken"] > 0 and t["fixed"] > 0, t
assert not j["gate"]["passed"] and j["gate"]["reasons"], j["gate"]
s = j["significance"]
assert 0 < s["p"] <= 1 and s["iterations"] == 10000, s
for side in ("old", "new"):
    o = j["overall"][side]
    assert o["gold"] >= o["matched"] and o["test"] >= o["matched"], o
broken = [c for c in j["cases"] if c["transition"] == "broken"]
assert all(c["new"]["wrong"] for c in broken), broken[0]
PY

# Results files: a run compared with itself is all unchanged, p = 1, gate passed (exit 0).
(cd "$demo" && "$TREEGATE" run --results "$tmp/v1.jsonl" > /dev/null) || true
"$TREEGATE" compare "$tmp/v1.jsonl" "$tmp/v1.jsonl" > "$tmp/same.txt" || fail "self-compare exit $?"
grep -q "changed_same_f1 0, unchanged 102" "$tmp/same.txt" || fail "self-compare transitions"
grep -q "there is no difference to test (p = 1;" "$tmp/same.txt" || fail "self-compare p"
grep -q "^gate: passed" "$tmp/same.txt" || fail "self-compare gate"

# Bad input: exit 2 and a one-line message.
set +e
"$TREEGATE" compare "$tmp/v1.jsonl" "$tmp/missing.jsonl" > /dev/null 2> "$tmp/err"; code=$?
set -e
[ "$code" = 2 ] || fail "missing file: exit $code"
grep -q "missing.jsonl" "$tmp/err" || fail "missing file message: $(cat "$tmp/err")"

# explain: the demo's PP case under v2 is out-scored; a bad case reference is exit 2.
"$TREEGATE" explain --grammar "$demo/v2.pcfg" "$demo/pp-verb.yaml#moor-east-pier" > "$tmp/ex.txt"
grep -q "^gap: log P(best) - log P(gold) = " "$tmp/ex.txt" || fail "explain gap"
grep -q "p needed for gold to win" "$tmp/ex.txt" || fail "explain table"
# The estimated grammar lists @transform lines: rules are named in its labels (NP> is a
# binarization step), the trees in the treebank's.
"$TREEGATE" explain --grammar "$demo/estimated.pcfg" "$demo/pp-verb.yaml#moor-east-pier" > "$tmp/ex2.txt" ||
  fail "explain with a transformed grammar: exit $?"
grep -q "^  NP> -> JJ NN " "$tmp/ex2.txt" || fail "explain with transforms: $(cat "$tmp/ex2.txt")"
set +e
"$TREEGATE" explain --grammar "$demo/v2.pcfg" "$demo/pp-verb.yaml#no-such-case" 2> "$tmp/err"; code=$?
set -e
[ "$code" = 2 ] || fail "explain bad case: exit $code"
grep -q "no case with id" "$tmp/err" || fail "explain bad case message"
echo "ok"
