#!/usr/bin/env bash
# Nothing lost: `treegate run` killed with SIGKILL at random moments (until 24 kills hit a
# running process, a third of them aimed near the end, where the results are written) always leaves the previous results file
# byte-identical and loadable; Ctrl-C (SIGINT) stops a run within a second, says so, and
# leaves no results, reports or temp files behind.
source "$(dirname "$0")/lib/hostile.sh"
source "$e2e_dir/lib/signals.sh"
demo="${SOURCE_DIR:-$e2e_dir/../..}/suites/demo"
copies=${TREEGATE_KILL_COPIES:-300}
mkdir -p tb out
for ((i = 0; i < copies; i++)); do
  cp "$demo/held-out/logbook.trees" "tb/l$i.trees"
  cp "$demo/held-out/notices.trees" "tb/n$i.trees"
done
printf 'suite: many\ntreebank:\n  - files: tb/*.trees\n' >many.yaml
cp "$demo/v1.pcfg" grammar.pcfg
run=("$TREEGATE" run --grammar grammar.pcfg --suite many.yaml --no-timings --jobs 2)

"${run[@]}" --results out/results.jsonl --junit out/junit.xml >/dev/null || [ $? -eq 1 ] ||
  fail "first run failed"
# The kill delays are drawn within the run time of a warm run (the first one is slower).
start=$(date +%s.%N)
"${run[@]}" --results out/results.jsonl --junit out/junit.xml >/dev/null || [ $? -eq 1 ] ||
  fail "second run failed"
end=$(date +%s.%N)
cp out/results.jsonl previous.jsonl
cp out/junit.xml previous.xml
cases=$(($(wc -l <previous.jsonl) - 1))
duration=$(/usr/bin/python3 -c "print(round($end - $start, 3))")
echo "one run: $cases cases in $duration s"

kills=0 intact=0 completed=0
for ((k = 0; kills < 24 && k < 60; k++)); do
  # Uniform over the run for two thirds of the kills, the last 30% of it for the rest.
  delay=$(/usr/bin/python3 -c "import random; d=$duration; k=$k
print(round(random.uniform(0.02, d) if k % 3 else random.uniform(d * 0.7, d), 3))")
  "${run[@]}" --results out/results.jsonl --junit out/junit.xml >/dev/null 2>&1 &
  pid=$!
  sleep "$delay"
  if kill -9 "$pid" 2>/dev/null; then kills=$((kills + 1)); else completed=$((completed + 1)); fi
  wait "$pid" 2>/dev/null || true
  # With --no-timings a finished run writes the same bytes, so the file must equal the old one.
  if cmp -s out/results.jsonl previous.jsonl && cmp -s out/junit.xml previous.xml; then
    intact=$((intact + 1))
  else
    fail "attempt $k, killed after $delay s: results or JUnit file changed"
  fi
  "$TREEGATE" report out/results.jsonl >/dev/null 2>report.err || [ $? -eq 1 ] ||
    fail "attempt $k: the results file does not load: $(head -c 200 report.err)"
done
[ "$kills" -ge 20 ] || fail "only $kills of $k attempts killed a running process"
leftovers=$(find out -name '*.tmp*' -o -name '.*' -type f | wc -l)
echo "ok: $kills SIGKILLs of running runs ($completed more finished first): $intact/$k results" \
  "files intact and loadable, 0 lost; $leftovers temp files left by killed writers"

# SIGINT: a fresh output folder must stay empty.
rm -rf out2 && mkdir out2
failures_before=$failures
# One worker (about twice the run time above) and the signal 20 ms after the handler is in
# place: the run is still loading or parsing (a warm run of all cases took under 0.2 s on 2
# cores, so a delay taken from the first, cold run could land after the run had finished).
"$TREEGATE" run --grammar grammar.pcfg --suite many.yaml --no-timings --jobs 1 \
  --results out2/results.jsonl --junit out2/junit.xml --summary-json out2/s.json \
  >sigint.out 2>sigint.err &
pid=$!
wait_for_handler "$pid" 2 || fail "SIGINT: the run never installed its handler"
sleep 0.02
sent=$(date +%s.%N)
kill -INT "$pid" 2>/dev/null || fail "SIGINT: the run ended before the signal"
rc=0
wait "$pid" || rc=$?
stopped=$(date +%s.%N)
took=$(/usr/bin/python3 -c "print(round($stopped - $sent, 3))")
[ "$rc" -eq 2 ] || fail "SIGINT: exit $rc, expected 2"
[ "$(cat sigint.err)" = "treegate run: interrupted; no results or reports were written" ] ||
  fail "SIGINT: stderr: $(head -c 300 sigint.err)"
[ -z "$(ls -A out2)" ] || fail "SIGINT: files left: $(ls -A out2)"
/usr/bin/python3 -c "import sys; sys.exit(0 if $took <= 1.0 else 1)" ||
  fail "SIGINT: took $took s to stop (more than 1 s)"
[ "$failures" -ne "$failures_before" ] ||
  echo "ok: SIGINT stopped the run in $took s with exit 2, no files written"
finish
