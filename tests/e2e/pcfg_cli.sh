#!/usr/bin/env bash
# `treegate parse` and `treegate lint` end to end: the JSON-lines contract, text output, tagged
# input, --jobs keeping the input order, no_parse reasons, exit codes, --normalize.
set -euo pipefail
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
fail() { echo "FAIL: $*"; exit 1; }

# Manning & Schuetze (1999) ch. 11 grammar, recalled from the book (see tests/pcfg/parser_test.cc).
cat > "$tmp/g.pcfg" <<'G'
@start S
S -> NP VP 1.0
PP -> P NP 1.0
VP -> V NP 0.7
VP -> VP PP 0.3
P -> "with" 1.0
V -> "saw" 1.0
NP -> NP PP 0.4
NP -> "astronomers" 0.1
NP -> "ears" 0.18
NP -> "saw" 0.04
NP -> "stars" 0.18
NP -> "telescopes" 0.1
G
printf 'astronomers saw stars with ears\nastronomers saw comets\nstars saw astronomers\n' > "$tmp/in.txt"

"$TREEGATE" parse --grammar "$tmp/g.pcfg" "$tmp/in.txt" > "$tmp/out.txt" 2> "$tmp/err.txt"
[ "$(sed -n 1p "$tmp/out.txt")" = "(S (NP astronomers) (VP (V saw) (NP (NP stars) (PP (P with) (NP ears)))))" ] || fail "text tree"
[ "$(sed -n 2p "$tmp/out.txt")" = "()" ] || fail "no parse marker"
grep -q "line 2: no_parse: unknown word 'comets' (word 3)" "$tmp/err.txt" || fail "reason on stderr: $(cat "$tmp/err.txt")"

"$TREEGATE" parse --grammar "$tmp/g.pcfg" --format json --kbest 3 < "$tmp/in.txt" > "$tmp/out.json"
/usr/bin/python3 - "$tmp/out.json" <<'PY'
import json, math, sys
rows = [json.loads(l) for l in open(sys.argv[1])]
keys = ["line", "status", "reason", "tree", "logprob", "inside_logprob", "parses", "parses_exact",
        "parses_infinite", "kbest", "seconds"]
assert all(list(r) == keys for r in rows), [list(r) for r in rows]
a, b, c = rows
assert (a["line"], a["status"], a["parses"], a["parses_exact"]) == (1, "parsed", 2, True), a
assert abs(a["logprob"] - math.log(0.0009072)) < 1e-12 and abs(a["inside_logprob"] - math.log(0.0015876)) < 1e-12, a
assert [round(math.exp(k["logprob"]), 10) for k in a["kbest"]] == [0.0009072, 0.0006804], a["kbest"]
assert b["status"] == "no_parse" and b["tree"] is None and "comets" in b["reason"], b
assert c["status"] == "parsed" and c["line"] == 3, c
PY

# Tagged input (WORD_TAG, split at the last underscore) and a malformed token.
printf 'astronomers_NP saw_V stars_NP\nastronomers saw_V stars_NP\n' | "$TREEGATE" parse --grammar "$tmp/g.pcfg" --tags --format json > "$tmp/tags.json"
/usr/bin/python3 - "$tmp/tags.json" <<'PY'
import json, sys
a, b = [json.loads(l) for l in open(sys.argv[1])]
assert a["status"] == "parsed" and a["tree"] == "(S (NP astronomers) (VP (V saw) (NP stars)))", a
assert b["status"] == "error" and b["reason"] == "column 1: expected WORD_TAG, not 'astronomers'", b
PY

# --jobs 2 gives the same output in the same order as one thread.
for i in $(seq 1 40); do echo "astronomers saw stars with ears with telescopes"; echo "stars saw ears"; done > "$tmp/many.txt"
"$TREEGATE" parse --grammar "$tmp/g.pcfg" "$tmp/many.txt" > "$tmp/one.txt"
"$TREEGATE" parse --grammar "$tmp/g.pcfg" "$tmp/many.txt" --jobs 2 > "$tmp/two.txt"
cmp -s "$tmp/one.txt" "$tmp/two.txt" || fail "--jobs 2 changed the output"

# Bad usage and unreadable grammar: exit 2, nothing on stdout.
set +e
printf 'S -> NP\n' > "$tmp/bad.pcfg"
echo x | "$TREEGATE" parse --grammar "$tmp/bad.pcfg" > "$tmp/o" 2> "$tmp/e"; code=$?
[ $code -eq 2 ] || fail "bad grammar exit $code"
[ ! -s "$tmp/o" ] || fail "output on bad grammar"
grep -q "bad.pcfg:1:6: expected a weight" "$tmp/e" || fail "grammar error message: $(cat "$tmp/e")"
"$TREEGATE" parse --grammar "$tmp/g.pcfg" --format xml < /dev/null 2>/dev/null; [ $? -eq 2 ] || fail "--format xml"

# lint: clean grammar exits 0; a defective one exits 0, or 1 with --strict; unreadable 2.
"$TREEGATE" lint "$tmp/g.pcfg" --strict > "$tmp/lint.txt"; [ $? -eq 0 ] || fail "lint clean"
grep -q "0 warnings; spectral radius" "$tmp/lint.txt" || fail "lint summary"
printf '@start S\nS -> A 0.5\nS -> "s" 0.3\nA -> "a" 2\nZ -> "z" 1\n' > "$tmp/d.pcfg"
"$TREEGATE" lint "$tmp/d.pcfg" > "$tmp/lint.txt"; [ $? -eq 0 ] || fail "lint without --strict"
"$TREEGATE" lint "$tmp/d.pcfg" --strict > /dev/null; [ $? -eq 1 ] || fail "lint --strict"
grep -q "d.pcfg:2: warning \[sum\]: probabilities of the 2 rules of 'S' sum to 0.8" "$tmp/lint.txt" || fail "sum finding"
grep -q "d.pcfg:5: warning \[unreachable\]" "$tmp/lint.txt" || fail "unreachable finding"
"$TREEGATE" lint "$tmp/missing.pcfg" 2>/dev/null; [ $? -eq 2 ] || fail "lint unreadable"
set -e
"$TREEGATE" lint "$tmp/d.pcfg" --normalize "$tmp/fixed.pcfg" > /dev/null
ls "$tmp" | grep -v -E '^(g|bad|d|fixed)\.pcfg$|\.(txt|json)$|^[oe]$' && fail "temp file left behind"
grep -q '^S -> A 0.625$' "$tmp/fixed.pcfg" || fail "normalized weight: $(cat "$tmp/fixed.pcfg")"
"$TREEGATE" lint "$tmp/fixed.pcfg" | grep -q "sum" && fail "normalized copy still has a sum warning"
echo "ok"
