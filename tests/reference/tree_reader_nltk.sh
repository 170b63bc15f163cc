#!/usr/bin/env bash
# Tree reading cross-checked against Debian's python3-nltk (nltk.Tree.fromstring).
set -euo pipefail
. "$SOURCE_DIR/tests/reference/lib/require_nltk.bash"
exec $py "$SOURCE_DIR/tests/reference/tree_reader_nltk.py" "$BUILD_DIR/tests/tree_roundtrip"
