#!/usr/bin/env bash
# Benchmark of the built-in CKY parser (`treegate parse`), all figures in one run:
#  1. a plain treebank grammar read off the GUM trees (every fifth document held out, see
#     gum_grammar.py); held-out sentences of 2-40 words with gold tags: sentences/s and binary
#     rule applications/s on one thread (CPU time), beside a straightforward dense CKY on the
#     same grammar and sentences (dense_cky.cc), whose Viterbi scores must agree;
#  2. peak memory of `treegate parse` by sentence length 10, 20, 40, 80;
#  3. --jobs 2 against --jobs 1 (wall time);
#  4. the speed ratio against nltk.parse.ViterbiParser on the small demo grammar.
# Usage: bench/pcfg/run.sh [BUILD_DIR]   (default: build). Needs the shared data folder
# (${TREEGATE_SHARED:-<source>/../shared}); without it, prints "not run" and exits 0.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
src=$(cd "$here/../.." && pwd)
build=${1:-$src/build}
tg=$build/treegate
bench=$build/bench/pcfg/pcfg_bench
[ -x "$tg" ] && [ -x "$bench" ] || { echo "build treegate first (ci/build)"; exit 2; }
shared=${TREEGATE_SHARED:-$src/../shared}
trees=$shared/data/gum-ccby-train/trees
if [ ! -d "$trees" ]; then
  echo "not run: $trees is missing (set TREEGATE_SHARED)"
  exit 0
fi
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
py=/usr/bin/python3

echo "== grammar read off gum-ccby-train (train: 4 of every 5 documents) =="
$py "$here/gum_grammar.py" "$trees" "$tmp" 2 40
echo
echo "== 1. one thread, gold tags, held-out sentences of 2-40 words =="
"$bench" "$tmp/train.pcfg" "$tmp/heldout.tagged" --tags --baseline --rounds 3

echo
echo "== 2. peak memory of treegate parse by sentence length (gold tags) =="
awk 'NF == 2 && !a {print; a = 1}' "$tmp/heldout.tagged" > "$tmp/len2"
for n in 10 20 40; do awk -v n=$n 'NF == n && !a {print; a = 1}' "$tmp/heldout.tagged" > "$tmp/len$n"; done
# 80 words: the first 80 tokens of the held-out sentences of 30 words or more, run together.
awk 'NF >= 30 {for (i = 1; i <= NF && c < 80; i++) printf "%s%s", (c++ ? " " : ""), $i} END {print ""}' "$tmp/heldout.tagged" > "$tmp/len80"
base_kb=$(/usr/bin/time -f %M "$tg" parse --grammar "$tmp/train.pcfg" --tags "$tmp/len2" 2>&1 >/dev/null | tail -1)
printf "%6s %10s %16s %10s %s\n" words "peak MiB" "over 2 words MiB" seconds status
for n in 10 20 40 80; do
  start=$(date +%s.%N)
  kb=$(/usr/bin/time -f %M "$tg" parse --grammar "$tmp/train.pcfg" --tags "$tmp/len$n" --format json 2>&1 >"$tmp/out$n" | tail -1)
  secs=$($py -c "import json,sys; r = json.loads(open(sys.argv[1]).readline()); print('%.3f %s' % (r['seconds'], r['status']))" "$tmp/out$n")
  awk -v n=$n -v kb=$kb -v b=$base_kb -v s="$secs" 'BEGIN {split(s, p, " "); printf "%6d %10.1f %16.1f %10s %s\n", n, kb/1024, (kb-b)/1024, p[1], p[2]}'
done

echo
echo "== 3. treegate parse --jobs 1 and --jobs 2 (wall seconds, best of 3) =="
wall() {
  local best=""
  for _ in 1 2 3; do
    local s e
    s=$(date +%s.%N)
    "$@" > /dev/null 2>&1
    e=$(date +%s.%N)
    best=$(awk -v a="$best" -v d="$(awk -v s=$s -v e=$e 'BEGIN{print e-s}')" 'BEGIN{print (a == "" || d < a) ? d : a}')
  done
  echo "$best"
}
j1=$(wall "$tg" parse --grammar "$tmp/train.pcfg" --tags "$tmp/heldout.tagged" --jobs 1)
j2=$(wall "$tg" parse --grammar "$tmp/train.pcfg" --tags "$tmp/heldout.tagged" --jobs 2)
awk -v a=$j1 -v b=$j2 'BEGIN {printf "jobs 1: %.3f s   jobs 2: %.3f s   speed-up %.2fx (machine load: see uptime)\n", a, b, a/b}'
uptime

echo
echo "== 4. against nltk.parse.ViterbiParser (demo grammar suites/demo/v1.pcfg, held-out demo sentences) =="
for f in "$src"/suites/demo/held-out/*.trees; do
  $py -c "import sys
from nltk import Tree
for l in open(sys.argv[1]):
    if l.strip(): print(' '.join(Tree.fromstring(l).leaves()))" "$f"
done > "$tmp/demo.txt"
$py "$here/nltk_speed.py" "$tg" "$src/suites/demo/v1.pcfg" "$tmp/demo.txt"
