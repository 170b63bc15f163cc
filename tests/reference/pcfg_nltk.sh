#!/usr/bin/env bash
# treegate's CKY (Viterbi log probability and tree, inside probability, parse count, k best)
# against Debian's python3-nltk on random small PCFGs; see pcfg_nltk.py.
set -euo pipefail
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
/usr/bin/python3 "$SOURCE_DIR/tests/reference/pcfg_nltk.py" "$TREEGATE" "$tmp" 300
