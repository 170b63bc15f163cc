#!/usr/bin/env bash
# Benchmark of `treegate score`: throughput beside `wc -w` on the same files, and peak memory
# for 10,000 and 50,000 sentence pairs (it should stay flat: the files are streamed).
# Usage: bench/score/run.sh [BUILD_DIR]   (default: build)
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
build=${1:-$here/../../build}
tg=$build/treegate
[ -x "$tg" ] || { echo "build treegate first (ci/build)"; exit 2; }
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
py=$(command -v /usr/bin/python3 || command -v python3)

# CPU seconds (user + system) rather than wall time: the machine is shared, and CPU time is
# far less disturbed by other processes.
measure() {  # command... -> prints "cpu_seconds peak_kb"
  /usr/bin/time -f "%U %S %M" -o "$tmp/time" "$@" > /dev/null
  awk '{printf "%.3f %d\n", $1 + $2, $3}' "$tmp/time"
}
best_of() {  # runs a command 3 times, prints the fastest "seconds peak_kb"
  local best=""
  for _ in 1 2 3; do
    local r; r=$(measure "$@")
    if [ -z "$best" ] || awk -v a="${r% *}" -v b="${best% *}" 'BEGIN{exit !(a<b)}'; then best=$r; fi
  done
  echo "$best"
}

for n in 10000 50000; do
  $py "$here/gen_pairs.py" "$n" "$tmp/gold$n" "$tmp/test$n"
done
bytes=$(( $(stat -c %s "$tmp/gold50000") + $(stat -c %s "$tmp/test50000") ))
mb=$(awk -v b="$bytes" 'BEGIN{printf "%.1f", b/1e6}')
words=$(cat "$tmp/gold50000" | wc -l)

tg_r=$(best_of "$tg" score "$tmp/gold50000" "$tmp/test50000")
tj_r=$(best_of "$tg" score "$tmp/gold50000" "$tmp/test50000" --format json)
wc_r=$(best_of wc -w "$tmp/gold50000" "$tmp/test50000")
tg_s=${tg_r% *}; wc_s=${wc_r% *}; tj_s=${tj_r% *}
echo "score benchmark: 50,000 sentence pairs ($words per file), $mb MB of bracketed input"
awk -v t="$tg_s" -v j="$tj_s" -v w="$wc_s" -v mb="$mb" 'BEGIN{
  printf "  treegate score : %6.2f s CPU  %7.1f MB/s  (text summary)\n", t, mb/t;
  printf "  treegate score : %6.2f s CPU  %7.1f MB/s  (--format json, every sentence listed)\n", j, mb/j;
  printf "  wc -w          : %6.2f s CPU  %7.1f MB/s\n", w, mb/w;
  printf "  ratio treegate/wc: %.2fx (target: within 5x; throughput target >= 100 MB/s)\n", t/w }'
for n in 10000 50000; do
  r=$(measure "$tg" score "$tmp/gold$n" "$tmp/test$n")
  echo "  peak memory, $n pairs: $(( ${r#* } / 1024 )) MiB (text output)"
done
