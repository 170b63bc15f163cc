#!/usr/bin/env bash
# Benchmark of `treegate estimate`: 40,000 trees sampled from a grammar read off
# gum-ccby-train (or the demo treebank when the shared folder is missing), estimated with
# several transform settings. Prints CPU seconds (user + system, best of 3: the machine is
# shared), wall seconds, trees/s, words/s and peak memory, beside `wc -w` on the same file.
# Usage: bench/estimate/speed.sh [BUILD_DIR]   (default: build)
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
build=${1:-$here/../../build}
tg=$build/treegate
[ -x "$tg" ] || { echo "build treegate first (ci/build)"; exit 2; }
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
n=${TREES:-40000}

measure() {  # command... -> "cpu_seconds wall_seconds peak_kb"
  /usr/bin/time -f "%U %S %e %M" -o "$tmp/time" "$@" > /dev/null
  awk '{printf "%.3f %.3f %d\n", $1 + $2, $3, $4}' "$tmp/time"
}
best_of() {  # the run with the least CPU time of 3
  local best=""
  for _ in 1 2 3; do
    local r; r=$(measure "$@")
    if [ -z "$best" ] || awk -v a="${r%% *}" -v b="${best%% *}" 'BEGIN{exit !(a<b)}'; then best=$r; fi
  done
  echo "$best"
}

gum="${TREEGATE_SHARED:-$here/../../../shared}/data/gum-ccby-train/trees"
if [ -d "$gum" ]; then source_trees=("$gum"/*.ptb); from="gum-ccby-train"
else source_trees=("$here"/../../suites/demo/treebank/*.trees); from="the demo treebank (shared folder missing)"; fi
"$tg" estimate "${source_trees[@]}" -o "$tmp/source.pcfg" --rare-words 0 > /dev/null
"$tg" sample --grammar "$tmp/source.pcfg" -n "$n" --seed 1 -o "$tmp/sample.trees"
words=$(grep -o ' [^ ()]*)' "$tmp/sample.trees" | wc -l)
mb=$(awk -v b="$(stat -c %s "$tmp/sample.trees")" 'BEGIN{printf "%.1f", b/1e6}')
echo "estimate benchmark: $n trees sampled from a grammar read off $from"
echo "  $words words, $mb MB of bracketed trees; target: under 2 s on one core"
wc_r=$(best_of wc -w "$tmp/sample.trees")
printf "  %-28s %8s %8s %10s %11s %9s %8s\n" "setting" "cpu s" "wall s" "trees/s" "words/s" "peak MB" "x wc -w"
row() {  # name, estimate options...
  local name=$1; shift
  local r; r=$(best_of "$tg" estimate "$tmp/sample.trees" -o "$tmp/out.pcfg" "$@")
  read -r cpu wall kb <<< "$r"
  awk -v name="$name" -v cpu="$cpu" -v wall="$wall" -v kb="$kb" -v n="$n" -v w="$words" \
      -v wc="${wc_r%% *}" 'BEGIN{c = cpu > 0 ? cpu : 0.001;
      printf "  %-28s %8.2f %8.2f %10.0f %11.0f %9.1f %8.1f\n", name, cpu, wall, n / c, w / c,
             kb / 1024, c / (wc > 0 ? wc : 0.001)}'
}
row "no transforms (--plain)" --plain
row "default (functions, rare=1)"
row "v=2" --parent 2
row "v=2 h=1" --parent 2 --horizontal 1
row "v=3 h=2 unary collapse" --parent 3 --horizontal 2 --collapse-unary
echo "  (wc -w on the same file: ${wc_r%% *} cpu s)"
