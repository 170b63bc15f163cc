#!/usr/bin/env bash
# Builds the Debian package with cpack, checks its Depends against the libraries the binary
# links against (ldd + dpkg -S: Debian's own file-to-package map), unpacks it with dpkg -x into
# a temporary root and runs the unpacked treegate on the unpacked demo files.
set -euo pipefail
: "${TREEGATE:?}" "${BUILD_DIR:?}"
for tool in cpack dpkg-deb dpkg-shlibdeps ldd; do
  if ! command -v "$tool" >/dev/null; then
    [ -n "${CI:-}" ] && { echo "FAIL: $tool missing (ci/install-deps installs it)"; exit 1; }
    echo "not run: $tool is not installed"; exit 0
  fi
done
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT

cpack --config "$BUILD_DIR/CPackConfig.cmake" -B "$tmp/pkg" >"$tmp/cpack.log" 2>&1 || {
  cat "$tmp/cpack.log"; echo "FAIL: cpack"; exit 1; }
deb=$(ls "$tmp"/pkg/treegate_*.deb)
echo "package: $(basename "$deb")"

# Depends must name exactly the packages that own the shared libraries treegate loads.
expected=$(ldd "$TREEGATE" | awk '/=> \//{print $3}' | while read -r lib; do
  dpkg -S "$(readlink -f "$lib")" 2>/dev/null || dpkg -S "$lib"; done |
  cut -d: -f1 | sort -u)
depends=$(dpkg-deb -f "$deb" Depends | tr ',' '\n' | sed 's/^ *//; s/ .*//' | sort -u)
echo "libraries' packages: $(echo $expected)"
echo "Depends:             $(echo $depends)"
if [ "$expected" != "$depends" ]; then
  echo "FAIL: Depends differs from the packages of the linked libraries"; exit 1
fi

dpkg -x "$deb" "$tmp/root"
bin="$tmp/root/usr/bin/treegate"
share="$tmp/root/usr/share/treegate/suites"
for f in "$bin" "$tmp/root/usr/share/doc/treegate/README.md" "$tmp/root/usr/share/doc/treegate/LICENSE" \
  "$share/demo/v1.pcfg" "$share/demo/treegate.yaml"; do
  [ -e "$f" ] || { echo "FAIL: $f is not in the package"; exit 1; }
done
"$bin" --help >"$tmp/help.txt"
grep -q "score" "$tmp/help.txt" || { echo "FAIL: unpacked treegate --help lists no subcommands"; exit 1; }
"$bin" score "$share/examples/gold.trees" "$share/examples/test.trees" >"$tmp/score.txt"
grep -qi "f1" "$tmp/score.txt" || { echo "FAIL: unpacked treegate score printed no F1"; cat "$tmp/score.txt"; exit 1; }
# Once the run subcommand exists, the unpacked binary runs the unpacked demo.
if "$bin" run --help >/dev/null 2>&1; then
  cp -r "$share/demo" "$tmp/demo"
  set +e
  (cd "$tmp/demo" && "$bin" run --results "$tmp/demo.results" >"$tmp/run.txt" 2>&1)
  code=$?
  set -e
  if [ "$code" -ge 2 ] || [ ! -s "$tmp/demo.results" ]; then
    cat "$tmp/run.txt"; echo "FAIL: unpacked treegate run on the demo exited $code"; exit 1
  fi
  echo "unpacked treegate run on the demo: exit $code"
else
  echo "note: run subcommand not built yet; checked --help and score only"
fi
echo "ok: package installs into a temporary root and runs"
