#!/usr/bin/env bash
# Tree reading cross-checked against Debian's python3-nltk (nltk.Tree.fromstring).
set -euo pipefail
py=/usr/bin/python3
if ! $py -c 'import nltk' 2>/dev/null; then
  if [ -n "${CI:-}" ]; then echo "python3-nltk is missing (ci/install-deps installs it)"; exit 1; fi
  echo "not run: /usr/bin/python3 has no nltk (run ci/install-deps)"; exit 0
fi
exec $py "$SOURCE_DIR/tests/reference/tree_reader_nltk.py" "$BUILD_DIR/tests/tree_roundtrip"
