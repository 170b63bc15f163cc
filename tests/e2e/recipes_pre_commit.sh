#!/usr/bin/env bash
# Exercises ci/recipes/pre-commit in a throwaway grammar repository made from the demo:
# the first commit (grammar v1) passes and leaves a baseline; staging a grammar edit that breaks
# cases (v2's weights) is refused and HEAD does not move; the hook tests the staged files, not
# unstaged edits; a commit that touches no grammar file does not run treegate at all.
set -euo pipefail
: "${TREEGATE:?}" "${SOURCE_DIR:?}"
if ! "$TREEGATE" run --help >/dev/null 2>&1; then
  echo "not run: subcommand run not built yet"
  exit 0
fi
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
export GIT_AUTHOR_NAME=tester GIT_AUTHOR_EMAIL=tester@localhost GIT_COMMITTER_NAME=tester \
  GIT_COMMITTER_EMAIL=tester@localhost GIT_CONFIG_NOSYSTEM=1 HOME="$tmp" TREEGATE
fail() { echo "FAIL: $*"; exit 1; }

repo="$tmp/grammar-repo"
cp -r "$SOURCE_DIR/suites/demo" "$repo"
cd "$repo"
git init -q -b main .
cp "$SOURCE_DIR/ci/recipes/pre-commit" .git/hooks/pre-commit
chmod +x .git/hooks/pre-commit

git add -A
git commit -q -m "grammar v1" >"$tmp/c1.log" 2>&1 || { cat "$tmp/c1.log"; fail "first commit (v1) refused"; }
[ -f .git/treegate/baseline.jsonl ] || fail "no baseline kept after a passing commit"
echo "ok: v1 commit passes and keeps .git/treegate/baseline.jsonl"
head1=$(git rev-parse HEAD)

cp v2.pcfg v1.pcfg   # the grammar edit of v2, made to the grammar the config names
git add v1.pcfg
if git commit -q -m "re-weight attachment" >"$tmp/c2.log" 2>&1; then
  cat "$tmp/c2.log"; fail "a grammar edit that breaks cases was committed"
fi
grep -q "commit refused" "$tmp/c2.log" || { cat "$tmp/c2.log"; fail "no refusal message"; }
[ "$(git rev-parse HEAD)" = "$head1" ] || fail "HEAD moved although the hook refused"
echo "ok: staged v2 edit refused; HEAD unchanged"

# Stage the original grammar again but leave the breaking edit in the working tree.
git show HEAD:v1.pcfg >"$tmp/v1.orig"
cp "$tmp/v1.orig" v1.pcfg && git add v1.pcfg && cp v2.pcfg v1.pcfg
echo "# a comment" >>pp-verb.yaml && git add pp-verb.yaml
git commit -q -m "comment in a suite" >"$tmp/c3.log" 2>&1 || { cat "$tmp/c3.log"; fail "staged files pass but the hook read the working tree"; }
echo "ok: the hook runs on the staged files, not on unstaged edits"

cp "$tmp/v1.orig" v1.pcfg
echo "notes" >NOTES.txt && git add NOTES.txt
TREEGATE=/nonexistent/treegate git commit -q -m "notes" >"$tmp/c4.log" 2>&1 || { cat "$tmp/c4.log"; fail "a commit without grammar files ran treegate"; }
echo "ok: commits that touch no grammar, suite or config file skip the run"
