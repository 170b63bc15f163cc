#!/usr/bin/env bash
# External parser faults and interrupted runs: a crash, a hang, garbage, too many lines and a
# flood on stderr each make only the affected case an error (with the reason) and the rest of
# the run completes; no parser process is left behind; SIGKILL during a run leaves the previous
# results file intact; SIGINT stops the run within about a second and writes no files. The
# built-in parser's time limit and stop flag are checked at the end.
set -euo pipefail
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
fail() { echo "FAIL: $*"; exit 1; }
source "$SOURCE_DIR/tests/e2e/lib/signals.sh"
parser=fault_parser_$$.py  # a unique name, so the leftover check sees only our processes
cp "$SOURCE_DIR/tests/e2e/run_data/fake_parser.py" "$tmp/$parser"
cd "$tmp"
mkdir suites
{
  echo "suite: faults"
  echo "cases:"
  for i in 1 2 3 4 5 6 7 8 9 10 11 12; do
    word=w$i
    case $i in 2) word=CRASHWORD;; 5) word=GARBAGEWORD;; 7) word=TWICEWORD;; 9) word=NOISEWORD;; 11) word=HANGWORD;; esac
    echo "  - id: c$i"
    echo "    tree: \"(S (NN $word) (NN tail))\""
  done
} > suites/faults.yaml
for mode in batch per-sentence; do
  cat > treegate.yaml <<Y
suites: [suites/]
parser:
  command: [./$parser]
  mode: $mode
  batch_size: 3
  timeout_seconds: 2
gate:
  min_f1: 100
Y
  set +e
  "$TREEGATE" run --jobs 2 --no-timings --results r-$mode.jsonl > out-$mode.txt 2> err-$mode.txt
  code=$?
  set -e
  [ "$code" = 1 ] || fail "$mode: exit $code: $(cat err-$mode.txt)"
  /usr/bin/python3 - r-$mode.jsonl $mode <<'PY'
import json, sys
rows = [json.loads(l) for l in open(sys.argv[1])][1:]
by_id = {r["id"]: r for r in rows}
assert len(rows) == 12, len(rows)
def reason(i): return by_id["c%d" % i]["reason"]
assert "crashed (signal 11" in reason(2), reason(2)
assert "not a tree" in reason(5), reason(5)
assert "timed out" in reason(11), reason(11)
if sys.argv[2] == "per-sentence":
    assert "wrote 2 lines for 1 sentences" in reason(7), reason(7)
    expected_errors = {2, 5, 7, 11}
else:
    # Batches of 3; too many lines: no line of that batch can be matched to its sentence.
    assert "wrote 4 lines for 3 sentences" in reason(7), reason(7)
    expected_errors = {2, 5, 7, 8, 9, 11}
    # Cases of the batch after the crash were parsed by a restarted process.
    assert by_id["c3"]["outcome"] == "pass" and by_id["c3"]["predicted"], by_id["c3"]
errors = {int(r["id"][1:]) for r in rows if r["outcome"] == "error"}
assert errors == expected_errors, (sorted(errors), sorted(expected_errors))
for i in set(range(1, 13)) - errors:
    assert by_id["c%d" % i]["outcome"] == "pass" and by_id["c%d" % i]["predicted"], by_id["c%d" % i]
PY
done
# No stand-in parser survives (each is in its own process group and is killed and reaped).
sleep 0.3
if pgrep -f "$parser" > /dev/null; then fail "a parser process is left"; fi
if ps -o stat= --ppid $$ | grep -q Z; then fail "zombie processes"; fi

# SIGKILL while a run is going on leaves the previous results file intact. (No hanging
# sentence here: children of a SIGKILLed run are not killed by anyone.)
mkdir plain
{
  echo "suite: plain"
  echo "cases:"
  for i in $(seq 1 40); do echo "  - {id: p$i, tree: \"(S (NN w$i) (NN tail))\"}"; done
} > plain/plain.yaml
cat > treegate.yaml <<Y
suites: [plain/]
parser:
  command: [./$parser]
  mode: per-sentence
  timeout_seconds: 1
Y
cp r-batch.jsonl results.jsonl
cp results.jsonl before.jsonl
for delay in 0.05 0.2 0.5 1.0 1.5; do
  "$TREEGATE" run --jobs 2 --results results.jsonl > /dev/null 2>&1 &
  pid=$!
  sleep $delay
  kill -9 $pid 2>/dev/null || true
  wait $pid 2>/dev/null || true
  if cmp -s results.jsonl before.jsonl; then continue; fi
  # The run finished before the kill: the new file must then be complete.
  "$TREEGATE" report results.jsonl > /dev/null || [ $? = 1 ] || fail "results unreadable after kill at $delay s"
  cp results.jsonl before.jsonl
done
"$TREEGATE" report results.jsonl > /dev/null || [ $? = 1 ] || fail "results unreadable"
ls -a | grep -q '\.tmp-' && echo "note: temp files of killed runs remain: $(ls -a | grep '\.tmp-')"

# SIGKILL while the parser hangs: the parser process dies with treegate (parent-death signal)
# instead of sleeping on.
cat > treegate.yaml <<Y
suites: [suites/]
parser:
  command: [./$parser]
  mode: per-sentence
  timeout_seconds: 60
Y
"$TREEGATE" run --jobs 2 --results killed.jsonl > /dev/null 2>&1 &
pid=$!
for _ in $(seq 1 50); do pgrep -f "$parser.*" > /dev/null && break; sleep 0.1; done
sleep 1  # by now a worker waits on the hanging sentence (case c11, 60 s timeout)
kill -9 $pid
wait $pid 2>/dev/null || true
sleep 0.5
if pgrep -f "$parser" > /dev/null; then fail "a parser process outlived a SIGKILLed treegate"; fi

# SIGINT: stops within about a second, exit 2, says so, writes nothing.
cat > treegate.yaml <<Y
suites: [suites/]
parser:
  command: [./$parser]
  mode: per-sentence
  timeout_seconds: 30
Y
# interrupt_after SECONDS WHAT ARGS...: starts `treegate run ARGS` (stderr to int-err.txt),
# sends SIGINT after SECONDS, and checks exit code 2 within 1.5 s; sets $ms.
interrupt_after() {
  local after=$1 what=$2 pid code start
  shift 2
  "$TREEGATE" run "$@" > /dev/null 2> int-err.txt &
  pid=$!
  wait_for_handler $pid 2 || fail "SIGINT $what: the run never installed its handler"
  sleep "$after"
  start=$(date +%s%N)
  kill -INT $pid
  set +e
  wait $pid
  code=$?
  set -e
  ms=$(( ($(date +%s%N) - start) / 1000000 ))
  [ "$code" = 2 ] || fail "SIGINT $what: exit code $code"
  [ "$ms" -lt 1500 ] || fail "SIGINT $what took $ms ms"
}
rm -f int.jsonl
interrupt_after 1.5 "during a run" --jobs 2 --results int.jsonl --junit int.xml
grep -q "interrupted" int-err.txt || fail "no message: $(cat int-err.txt)"
[ ! -e int.jsonl ] && [ ! -e int.xml ] || fail "files written after SIGINT"
sleep 0.3
if pgrep -f "$parser" > /dev/null; then fail "a parser process is left after SIGINT"; fi
echo "ok (SIGINT stop took $ms ms)"

# Built-in parser: a sentence that would take hours under X -> X X | a is stopped by the time
# limit and is an error with the reason; the other cases are parsed. SIGINT during such a
# sentence stops the run at once (the parser checks the stop flag between chart cells).
printf '@start X\nX -> X X 0.5\nX -> "a" 0.5\n' > cyclic.pcfg
mkdir slow
long_tree=$(/usr/bin/python3 -c "print('(X ' * 2999 + '(X a) ' * 3000 + ')' * 2999)")
{
  echo "suite: slow"
  echo "cases:"
  echo "  - {id: short, tree: \"(X (X a) (X a))\"}"
  echo "  - {id: long, tree: \"$long_tree\"}"
} > slow/slow.yaml
cat > treegate.yaml <<Y
grammar: cyclic.pcfg
suites: [slow/]
parser:
  timeout_seconds: 0.5
Y
"$TREEGATE" run --jobs 2 --results slow.jsonl > slow-out.txt 2> slow-err.txt || true
/usr/bin/python3 - slow.jsonl <<'PY'
import json, sys
rows = {r["id"]: r for r in map(json.loads, list(open(sys.argv[1]))[1:])}
assert rows["short"]["outcome"] == "pass", rows["short"]
assert rows["long"]["outcome"] == "error", rows["long"]["outcome"]
assert rows["long"]["reason"].startswith(
    "sentence of 3000 words not parsed within the time limit of 0.5 s"), rows["long"]["reason"]
PY
sed -i 's/timeout_seconds: 0.5/timeout_seconds: 600/' treegate.yaml
interrupt_after 1.5 "during a built-in parse" --jobs 1 --results slow-int.jsonl
echo "ok (built-in parser: time limit; SIGINT during a long parse stopped in $ms ms)"
