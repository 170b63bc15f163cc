#!/usr/bin/env bash
# `treegate estimate` and `treegate sample` end to end: globs, the summary, exit codes, the
# grammar left untouched on bad input, contradictory options named, sampling reproducible and
# in the treebank's labels, and parse undoing the transforms named in the header.
set -euo pipefail
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
fail() { echo "FAIL: $*"; exit 1; }
demo="$SOURCE_DIR/suites/demo/treebank"

# A glob in quotes is expanded by estimate itself; the summary names the figures.
"$TREEGATE" estimate "$demo/*.trees" -o "$tmp/g.pcfg" --parent 2 --horizontal 1 > "$tmp/out"
grep -q '^  trees read  *42$' "$tmp/out" || fail "summary: $(cat "$tmp/out")"
grep -q '^@transform parent=2$' "$tmp/g.pcfg" || fail "header lacks parent=2"
grep -q '^@transform horizontal=1$' "$tmp/g.pcfg" || fail "header lacks horizontal=1"
grep -q '^@unknown signatures$' "$tmp/g.pcfg" || fail "header lacks @unknown"

# parse and sample give trees in the treebank's labels (no ^ or > left).
echo "The crew lifted the crate with the torn label ." |
  "$TREEGATE" parse --grammar "$tmp/g.pcfg" > "$tmp/parsed"
grep -qE '\([^ ()]*[>^~]' "$tmp/parsed" && fail "parse output keeps transformed labels: $(cat "$tmp/parsed")"
"$TREEGATE" sample --grammar "$tmp/g.pcfg" -n 50 --seed 3 > "$tmp/s1"
"$TREEGATE" sample --grammar "$tmp/g.pcfg" -n 50 --seed 3 -o "$tmp/s2"
cmp -s "$tmp/s1" "$tmp/s2" || fail "same seed, different trees"
[ "$(wc -l < "$tmp/s1")" -eq 50 ] || fail "expected 50 trees"
grep -qE '\([^ ()]*[>^~]' "$tmp/s1" && fail "sample output keeps transformed labels"
"$TREEGATE" sample --grammar "$tmp/g.pcfg" -n 2 --seed 3 --raw | grep -q '\^' || fail "--raw lost ^"

# Bad input: exit 2, one line per bad tree with file:line:col, the old grammar untouched.
cp "$tmp/g.pcfg" "$tmp/before.pcfg"
printf '(ROOT (S (NN a)))\n(ROOT (S ( (NN b))))\n(ROOT dog)\n' > "$tmp/bad.trees"
set +e
"$TREEGATE" estimate "$tmp/bad.trees" -o "$tmp/g.pcfg" 2> "$tmp/err"; code=$?
set -e
[ $code -eq 2 ] || fail "bad trees: exit $code"
grep -qF "bad.trees:2:10: tree 2: constituent without a label" "$tmp/err" || fail "$(cat "$tmp/err")"
grep -qF "bad.trees:3:7: tree 3: word 'dog' has no tag of its own" "$tmp/err" || fail "$(cat "$tmp/err")"
grep -qF "2 unusable trees; nothing written" "$tmp/err" || fail "$(cat "$tmp/err")"
cmp -s "$tmp/g.pcfg" "$tmp/before.pcfg" || fail "grammar changed after bad input"
"$TREEGATE" estimate "$tmp/bad.trees" -o "$tmp/skip.pcfg" --skip-bad-trees > /dev/null 2>&1 ||
  fail "--skip-bad-trees should write"
[ -z "$(ls "$tmp" | grep -v -e '^g.pcfg$' -e '^before.pcfg$' -e '^skip.pcfg$' -e '^bad.trees$' -e '^err$' -e '^out$' -e '^parsed$' -e '^s1$' -e '^s2$')" ] ||
  fail "temporary files left: $(ls "$tmp")"

expect_error() {  # expect_error MESSAGE ARGS...
  local want=$1; shift
  set +e; "$TREEGATE" "$@" > /dev/null 2> "$tmp/err"; local code=$?; set -e
  [ $code -eq 2 ] || fail "$*: exit $code"
  grep -qF -- "$want" "$tmp/err" || fail "$*: expected '$want', got: $(cat "$tmp/err")"
}
: > "$tmp/empty.trees"
expect_error "no usable trees in the input; nothing written" estimate "$tmp/empty.trees" -o "$tmp/x.pcfg"
expect_error "--plain and --parent contradict each other" estimate "$demo/logbook.trees" -o "$tmp/x.pcfg" --plain --parent 2
expect_error "--keep-empties and --empty-tag contradict each other" estimate "$demo/logbook.trees" -o "$tmp/x.pcfg" --keep-empties --empty-tag X
expect_error "--parent must be 1, 2 or 3" estimate "$demo/logbook.trees" -o "$tmp/x.pcfg" --parent 4
expect_error "--horizontal must be none, all or a whole number, not 'two'" estimate "$demo/logbook.trees" -o "$tmp/x.pcfg" --horizontal two
expect_error "is one of the treebank files; choose another output" estimate "$tmp/bad.trees" -o "$tmp/bad.trees"
expect_error "no file matches this pattern" estimate "$tmp/nothing/*.trees" -o "$tmp/x.pcfg"
[ -e "$tmp/x.pcfg" ] && fail "a grammar was written after a usage error"
printf '@start S\nS -> "a" S 1\n' > "$tmp/endless.pcfg"
expect_error "20 draws in a row went deeper than 30 levels" sample --grammar "$tmp/endless.pcfg" -n 1 --max-depth 30 --max-attempts 20
echo "estimate/sample CLI: ok"
