#!/usr/bin/env bash
# Hostile input: a tree nested 1,000,000 levels deep is an error with its position, never a
# stack overflow, in the gold and in the test file; a tree just under the depth limit
# (99,990 levels, and a right-branching one) is scored.
source "$(dirname "$0")/lib/hostile.sh"

nest() {  # nest N LABEL : one tree with N nested LABEL nodes over (NN a)
  /usr/bin/python3 -c "import sys; n=int(sys.argv[1]); l=sys.argv[2]
sys.stdout.write(('(%s ' % l) * n + '(NN a)' + ')' * n + '\n')" "$1" "$2"
}
nest 1000000 X >deep.trees
printf '(S (NN a))\n' >one.trees
# The 100,001st '(' opens at column 3 * 100000 + 1 (each level is "(X ").
expect_error "million-level gold tree" 2 \
  "treegate score: deep.trees:1:300001: tree 1: nested deeper than 100000 levels" \
  -- "$TREEGATE" score deep.trees one.trees
expect_error "million-level test tree" 2 \
  "treegate score: deep.trees:1:300001: tree 1: nested deeper than 100000 levels" \
  -- "$TREEGATE" score one.trees deep.trees
expect_error "million-level tree, json" 2 \
  "treegate score: deep.trees:1:300001: tree 1: nested deeper than 100000 levels" \
  -- "$TREEGATE" score deep.trees deep.trees --format json

nest 99990 X >deep99k.trees
rc=0
"$TREEGATE" score deep99k.trees deep99k.trees --format json >deep.json || rc=$?
[ "$rc" -eq 0 ] || fail "99,990-level tree: exit $rc"
/usr/bin/python3 - <<'PY' || fail "99,990-level tree: wrong figures"
import json
t = json.load(open("deep.json"))["totals"]
# Labeled brackets: the 99,990 X nodes all span the one word; the preterminal is not a bracket.
assert t["gold_brackets"] == 99990 and t["matched"] == 99990 and t["f1"] == 100.0, t
PY
echo "ok: 99,990-level tree scored"

/usr/bin/python3 -c "n=99990; print('(X (NN w) ' * n + '(NN a)' + ')' * n)" >right.trees
rc=0
"$TREEGATE" score right.trees right.trees >right.txt || rc=$?
[ "$rc" -eq 0 ] || fail "right-branching 99,990-level tree: exit $rc"
grep -q '^brackets: 99990 gold, 99990 test, 99990 matched$' right.txt ||
  fail "right-branching tree: $(sed -n 3p right.txt)"
echo "ok: right-branching 99,990-level tree scored"
finish
