#!/usr/bin/env bash
# `treegate estimate --plain` against nltk.induce_pcfg, rule for rule: on the demo treebank
# and on the open trees of gum-ccby-train (when the shared folder is present).
set -euo pipefail
. "$SOURCE_DIR/tests/reference/lib/require_nltk.bash"
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
script="$SOURCE_DIR/tests/reference/estimate_nltk.py"
echo "demo treebank:"
$py "$script" "$TREEGATE" "$work" "$SOURCE_DIR"/suites/demo/treebank/*.trees
gum="${TREEGATE_SHARED:-$SOURCE_DIR/../shared}/data/gum-ccby-train/trees"
if [ ! -d "$gum" ]; then
  if [ -n "${CI:-}" ]; then echo "missing: $gum"; exit 1; fi
  echo "not run: $gum not found (set TREEGATE_SHARED)"; exit 0
fi
echo "gum-ccby-train:"
$py "$script" "$TREEGATE" "$work" "$gum"/*.ptb
