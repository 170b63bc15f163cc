#!/usr/bin/env bash
# Hostile bytes in bracketed trees: NUL bytes, invalid UTF-8, CRLF line ends, empty and blank
# files, unreadable paths. Errors are one line with file:line:col; words are bytes, so invalid
# UTF-8 is scored, and the JSON report stays valid JSON (such bytes become U+FFFD there).
source "$(dirname "$0")/lib/hostile.sh"

printf '(S (NN a) (VB b))\n' >ok.trees
printf '(S (NN a\0b) (VB b))\n' >nul.trees
expect_error "NUL byte in a word" 2 \
  "treegate score: nul.trees:1:9: tree 1: found a NUL byte; expected a word, '(' or ')'" \
  -- "$TREEGATE" score nul.trees ok.trees
printf '(S (\0NN a))\n' >nul-label.trees
expect_error "NUL byte for a label" 2 \
  "treegate score: nul-label.trees:1:5: tree 1: expected a label or '(' after '(' but found a NUL byte" \
  -- "$TREEGATE" score ok.trees nul-label.trees

: >empty.trees
expect_error "empty file" 2 "treegate score: empty.trees: no trees found (the file is empty)" \
  -- "$TREEGATE" score empty.trees empty.trees
printf '\r\n \t\n\n' >blank.trees
expect_error "blank file" 2 "treegate score: blank.trees: no trees found (the file is empty)" \
  -- "$TREEGATE" score blank.trees blank.trees
expect_error "empty test file" 2 \
  "treegate score: different numbers of trees: ok.trees has 1, empty.trees has 0" \
  -- "$TREEGATE" score ok.trees empty.trees
expect_error "missing file" 2 "treegate score: no-such.trees: cannot open file for reading" \
  -- "$TREEGATE" score ok.trees no-such.trees

# CRLF line ends: the same figures as LF, and errors at the same line:col.
printf '(S (NP (DT the) (NN cat)) (VP (VB sat)))\n(S (NN a) (VB b))\n' >lf.trees
sed 's/$/\r/' lf.trees >crlf.trees
"$TREEGATE" score lf.trees lf.trees --format json >lf.json
"$TREEGATE" score crlf.trees lf.trees --format json >crlf.json
cmp -s lf.json crlf.json || fail "CRLF: figures differ from LF: $(diff lf.json crlf.json | head -5)"
echo "ok: CRLF file scores as LF"
printf '(S (NN a) (VB b))\r\n(S (NN a)\r\n  (VB b)\r\n' >crlf-bad.trees
expect_error "CRLF, unclosed tree" 2 \
  "treegate score: crlf-bad.trees:4:1: tree 2: expected ')' to close '(S' opened at 2:1 but found end of file" \
  -- "$TREEGATE" score crlf-bad.trees crlf-bad.trees
printf '(S (NN a) (VB b))\r\n(S (NN a)) x\r\n' >crlf-word.trees
expect_error "CRLF, stray word" 2 \
  "treegate score: crlf-word.trees:2:12: tree 3: expected '(' to start a tree but found 'x'" \
  -- "$TREEGATE" score crlf-word.trees crlf-word.trees

# Invalid UTF-8 (a lone continuation byte, a truncated sequence, 0xff) in words and labels.
printf '(S\xff (NN \x80x) (VB \xe6\x97))\n' >bad-utf8.trees
rc=0
"$TREEGATE" score bad-utf8.trees bad-utf8.trees --format json >bad.json || rc=$?
[ "$rc" -eq 0 ] || fail "invalid UTF-8: exit $rc"
/usr/bin/python3 - <<'PY' || fail "invalid UTF-8: JSON report not valid UTF-8 JSON"
import json
data = open("bad.json", "rb").read()
j = json.loads(data.decode("utf-8"))  # strict: raises on invalid UTF-8
assert j["totals"]["f1"] == 100.0, j["totals"]
assert list(j["per_label"]) == ["S\ufffd"], list(j["per_label"])
PY
echo "ok: invalid UTF-8 scored, JSON valid with U+FFFD"
printf '(S (NN \x80x) (VB b))\n' >g.trees
printf '(S (NN \xffx) (VB b))\n' >t.trees
"$TREEGATE" score g.trees t.trees --format json >mismatch.json
/usr/bin/python3 - <<'PY' || fail "invalid UTF-8 yield mismatch: wrong JSON"
import json
j = json.loads(open("mismatch.json", "rb").read().decode("utf-8"))
s = j["per_sentence"][0]
assert s["status"] == "yield_mismatch", s
assert s["reason"] == "word 1 differs: gold '\ufffdx', test '\ufffdx'", s["reason"]
PY
echo "ok: invalid UTF-8 in a yield-mismatch reason"
finish
