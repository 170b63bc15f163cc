#!/usr/bin/env bash
# Benchmark of `treegate run`: 5,000 generated cases on a generated mid-size grammar (60
# nonterminals, 40 tags, 3,000 words, ~7,000 rules). Prints cases/s with --jobs 1 and 2, the
# harness overhead (wall time minus the parse time the parser reports, as a share of the wall
# time; the fastest run and the median of five), and the load time of a 50,000-case results
# file. Usage: bench/run/run.sh [BUILD_DIR]
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
build=$(cd "${1:-$here/../../build}" && pwd)
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
/usr/bin/python3 "$here/gen_bench.py" "$tmp" 5000 7
cd "$tmp"
now() { date +%s%N; }
declare -A wall
: > overheads.txt
for jobs in 1 2; do
  best=""
  for rep in 1 2 3 4 5; do
    t0=$(now)
    "$build/treegate" run --jobs $jobs --results r$jobs.jsonl > /dev/null
    t=$(( $(now) - t0 ))
    if [ -z "$best" ] || [ "$t" -lt "$best" ]; then best=$t; cp r$jobs.jsonl best$jobs.jsonl; fi
    # The harness's share of each --jobs 1 run: its wall time minus the parse time it recorded.
    if [ "$jobs" = 1 ]; then
      /usr/bin/python3 -c "import json, sys
rows = [json.loads(l) for l in open(sys.argv[1])][1:]
w = int(sys.argv[2]) / 1e9
print(w - sum(r['seconds'] for r in rows), w)" r1.jsonl "$t" >> overheads.txt
    fi
  done
  wall[$jobs]=$best
done
# Fixed start-up (process, grammar load and compile) measured on a one-case suite.
head -5 bench.yaml | grep -v "constructions: \[fifth\]" > one.yaml
sed -i 's/^suite: bench/suite: one/' one.yaml
start=""
for rep in 1 2 3; do
  t0=$(now)
  "$build/treegate" run --jobs 1 --suite one.yaml > /dev/null
  t=$(( $(now) - t0 ))
  if [ -z "$start" ] || [ "$t" -lt "$start" ]; then start=$t; fi
done
/usr/bin/python3 - best1.jsonl best2.jsonl "${wall[1]}" "${wall[2]}" "$start" overheads.txt <<'PY'
import json, statistics, sys
def parse_seconds(path):
    rows = [json.loads(l) for l in open(path)][1:]
    return len(rows), sum(r["seconds"] for r in rows)
n1, p1 = parse_seconds(sys.argv[1])
n2, p2 = parse_seconds(sys.argv[2])
w1, w2 = int(sys.argv[3]) / 1e9, int(sys.argv[4]) / 1e9
print("cases: %d (best of 5 runs each; the machine is shared, so compare ratios)" % n1)
print("--jobs 1: %.3f s wall, %.0f cases/s" % (w1, n1 / w1))
print("--jobs 2: %.3f s wall, %.0f cases/s   (speed-up x%.2f)" % (w2, n2 / w2, w1 / w2))
s = int(sys.argv[5]) / 1e9
print("--jobs 1: parse time %.3f s, harness overhead %.3f s = %.1f%% of the fastest run (target < 10%%)"
      % (p1, w1 - p1, 100 * (w1 - p1) / w1))
shares = sorted(100 * o / w for o, w in (map(float, l.split()) for l in open(sys.argv[6])))
print("          over all 5 runs: median %.1f%%, min %.1f%%, max %.1f%%"
      % (statistics.median(shares), shares[0], shares[-1]))
s = int(sys.argv[5]) / 1e9
print("          start-up alone (process, grammar load, one-case run): %.3f s" % s)
PY
if [ -x "$build/bench/run/results_load_bench" ]; then
  "$build/bench/run/results_load_bench" best1.jsonl 50000 big.jsonl
else
  echo "results load: not run ($build/bench/run/results_load_bench missing; build first)"
fi
