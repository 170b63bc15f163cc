#!/usr/bin/env bash
# Held-out F1, coverage and parse speed of grammars estimated from 80% of gum-ccby-train's
# documents, for: no transforms; v=2; v=2 h=1; v=2 h=2 (see heldout.py).
# Usage: bench/estimate/heldout.sh [BUILD_DIR] [JOBS]   (default: build, 1)
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
build=${1:-$here/../../build}
[ -x "$build/treegate" ] || { echo "build treegate first (ci/build)"; exit 2; }
gum="${TREEGATE_SHARED:-$here/../../../shared}/data/gum-ccby-train/trees"
[ -d "$gum" ] || { echo "not run: $gum not found (set TREEGATE_SHARED)"; exit 0; }
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
/usr/bin/python3 "$here/heldout.py" "$build/treegate" "$gum" "$tmp" "${2:-1}"
