#!/usr/bin/env bash
# Training-set sanity: grammars estimated from a treebank parse its own sentences far above a
# right-branching baseline (demo treebank always; gum-ccby-train when the shared folder exists).
set -euo pipefail
. "$SOURCE_DIR/tests/reference/lib/require_nltk.bash"
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
script="$SOURCE_DIR/tests/reference/estimate_trainset.py"
echo "demo treebank:"
$py "$script" "$TREEGATE" "$work" 1000 "$SOURCE_DIR"/suites/demo/treebank/*.trees
gum="${TREEGATE_SHARED:-$SOURCE_DIR/../shared}/data/gum-ccby-train/trees"
if [ ! -d "$gum" ]; then
  if [ -n "${CI:-}" ]; then echo "missing: $gum"; exit 1; fi
  echo "not run: $gum not found (set TREEGATE_SHARED)"; exit 0
fi
echo "gum-ccby-train (first 400 sentences of 2-25 words):"
$py "$script" "$TREEGATE" "$work" 400 "$gum"/*.ptb
