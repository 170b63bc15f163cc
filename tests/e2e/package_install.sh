#!/usr/bin/env bash
# `cmake --install` into a temporary prefix puts the binary, the docs and the demo where the
# GNU install-dirs conventions say (bin/, share/doc/treegate/, share/treegate/suites/).
set -euo pipefail
: "${TREEGATE:?}" "${BUILD_DIR:?}" "${SOURCE_DIR:?}"
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
cmake --install "$BUILD_DIR" --prefix "$tmp/prefix" >"$tmp/install.log"
missing=0
for f in bin/treegate share/doc/treegate/README.md share/doc/treegate/DEVELOPERS.md \
  share/doc/treegate/LICENSE share/treegate/suites/demo/v1.pcfg \
  share/treegate/suites/demo/v2.pcfg share/treegate/suites/demo/treegate.yaml; do
  [ -e "$tmp/prefix/$f" ] || { echo "FAIL: $f not installed"; missing=1; }
done
for doc in "$SOURCE_DIR"/docs/*.md; do
  [ -e "$doc" ] || continue
  [ -e "$tmp/prefix/share/doc/treegate/$(basename "$doc")" ] || {
    echo "FAIL: docs/$(basename "$doc") not installed"; missing=1; }
done
[ "$missing" -eq 0 ] || exit 1
"$tmp/prefix/bin/treegate" --help >/dev/null
echo "ok: $(wc -l <"$tmp/install.log") files installed under a temporary prefix"
