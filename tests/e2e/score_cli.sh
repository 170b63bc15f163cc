#!/usr/bin/env bash
# `treegate score` end to end: the JSON contract, exit codes, and bad input (message on
# stderr naming file and position, nothing on stdout).
set -euo pipefail
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
fail() { echo "FAIL: $*"; exit 1; }

printf '(ROOT (S (NP (DT a) (NN b)) (VP (VB c) (NP (DT d) (NN e))) (. .)))\n(S (NP (NN f)) (VP (VB g)))\n(S (NN h) (NN i))\n' > "$tmp/gold"
printf '(ROOT (S (NP (DT a) (NN b)) (VP (VB c)) (NP (DT d) (NN e)) (. .)))\n()\n(S (NN h) (NN x))\n' > "$tmp/test"

"$TREEGATE" score "$tmp/gold" "$tmp/test" --format json > "$tmp/out.json"
/usr/bin/python3 - "$tmp/out.json" <<'PY'
import json, sys
j = json.load(open(sys.argv[1]))
want_totals = ["sentences", "scored", "errors", "unparsed", "gold_brackets", "test_brackets",
               "matched", "precision", "recall", "f1", "exact_match", "crossing_avg",
               "zero_crossing_pct", "le2_crossing_pct", "tag_accuracy"]
assert list(j) == ["totals", "per_sentence", "per_label", "cutoff"], list(j)
assert list(j["totals"]) == want_totals, list(j["totals"])
t = j["totals"]
# Sentence 1: gold S NP VP NP(d e) = 4; test S NP VP NP NP = 4 with VP[2,3] not in gold: 3 matched.
# Sentence 2 unparsed: gold S NP VP = 3, test 0. Sentence 3: a yield mismatch (error).
assert (t["sentences"], t["scored"], t["errors"], t["unparsed"]) == (3, 2, 1, 1), t
assert (t["gold_brackets"], t["test_brackets"], t["matched"]) == (7, 4, 3), t
assert abs(t["precision"] - 75.0) < 1e-9 and abs(t["recall"] - 300 / 7) < 1e-9, t
ps = j["per_sentence"]
assert [p["status"] for p in ps] == ["scored", "no_parse", "yield_mismatch"], ps
for p in ps:
    for k in ["index", "status", "gold_brackets", "test_brackets", "matched", "crossing", "words", "tags_correct"]:
        assert k in p, (k, p)
assert set(j["per_label"]["NP"]) >= {"gold", "test", "matched", "precision", "recall", "f1"}
assert j["cutoff"]["max_length"] == 40 and "f1" in j["cutoff"]
print("json contract ok")
PY

"$TREEGATE" score "$tmp/gold" "$tmp/test" --per-sentence > "$tmp/out.txt"
grep -q "sentence 3: yield_mismatch: word 2 differs: gold 'i', test 'x'" "$tmp/out.txt" || fail "text lists the error"

check_bad() {  # expected-message args...
  local want=$1; shift
  set +e
  "$TREEGATE" score "$@" > "$tmp/stdout" 2> "$tmp/stderr"
  local rc=$?
  set -e
  [ "$rc" = 2 ] || fail "exit $rc for $*"
  [ ! -s "$tmp/stdout" ] || fail "stdout not empty for $*"
  grep -qF -- "$want" "$tmp/stderr" || { cat "$tmp/stderr"; fail "message for $*"; }
}
printf '(S (NN a)\n' > "$tmp/unbalanced"
check_bad "$tmp/unbalanced:2:1: tree 1: expected ')' to close '(S' opened at 1:1 but found end of file" "$tmp/unbalanced" "$tmp/unbalanced"
: > "$tmp/empty"
check_bad "$tmp/empty: no trees found (the file is empty)" "$tmp/empty" "$tmp/empty"
check_bad "different numbers of trees: $tmp/gold has 3, $tmp/empty has 0" "$tmp/gold" "$tmp/empty"
check_bad "cannot open file for reading" "$tmp/missing" "$tmp/gold"
check_bad "the option '--test' is required but missing" "$tmp/gold"
check_bad "--format must be text or json" "$tmp/gold" "$tmp/gold" --format xml
printf 'length_cutof: 10\n' > "$tmp/scheme.yaml"
check_bad "$tmp/scheme.yaml:1:1: unknown key 'length_cutof' in the scoring settings; did you mean 'length_cutoff'?" "$tmp/gold" "$tmp/gold" --scheme "$tmp/scheme.yaml"
echo "score cli ok"
