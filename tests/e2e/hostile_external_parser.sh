#!/usr/bin/env bash
# External-parser faults: a parser that crashes on one sentence, hangs (in a child process),
# prints garbage, too few or too many lines, megabytes on stderr, or exits before reading
# stdin. In batch and per-sentence mode: the affected cases are errors with a reason, the
# others pass, the run ends, and no parser process is left behind (orphan) or unreaped
# (zombie) - checked by sampling the process table while the run goes on.
source "$(dirname "$0")/lib/hostile.sh"
parser="$e2e_dir/lib/fault_parser.py"
marker="tg-fault-$$-$RANDOM"

words=("alpha beta" "gamma delta epsilon" "zeta eta" "a boom b" "c hang d" "e junk f"
       "g twice h" "i noisy j" "k l" "m n o")
{
  echo "suite: faults"
  echo "cases:"
  for i in "${!words[@]}"; do
    tree="(ROOT (S"
    for w in ${words[$i]}; do tree+=" (X $w)"; done
    echo "  - id: c$((i + 1))"
    echo "    tree: \"$tree))\""
  done
} >faults.yaml

# run_mode NAME MODE BATCH: runs the suite with the fault parser; leaves results in NAME.jsonl
run_mode() {
  local name=$1 mode=$2 batch=$3
  cat >"$name.yaml" <<YAML
suites: [faults.yaml]
jobs: 1
parser:
  command: [/usr/bin/python3, "$parser", $mode, "$marker"]
  mode: $batch
  timeout_seconds: 5
YAML
  local start=$SECONDS rc=0 zombies=0
  "$TREEGATE" run --config "$name.yaml" --results "$name.jsonl" --no-timings \
    >"$name.out" 2>"$name.err" &
  local pid=$!
  while kill -0 "$pid" 2>/dev/null; do
    # Children of treegate that have exited but were not reaped; one may be caught between
    # its exit and the wait, but never more than one with one job.
    local z
    z=$(ps -o stat= --ppid "$pid" 2>/dev/null | grep -c '^Z' || true)
    [ "$z" -gt "$zombies" ] && zombies=$z
    [ $((SECONDS - start)) -gt 120 ] && { fail "$name: run still going after 120 s"; kill -9 "$pid"; }
    sleep 0.1
  done
  wait "$pid" || rc=$?
  [ "$rc" -le 1 ] || fail "$name: exit $rc: $(head -c 300 "$name.err")"
  [ "$zombies" -le 1 ] || fail "$name: $zombies unreaped parser processes at once"
  sleep 0.2
  if ps -eo pid,stat,args | grep -v grep | grep -q "$marker"; then
    fail "$name: parser processes left behind: $(ps -eo pid,stat,args | grep "$marker" | grep -v grep)"
  fi
}

# expect NAME "ERRORS" : the ids that must be errors (with a reason); all others must pass.
expect() {
  local name=$1 errors=$2
  [ -f "$name.jsonl" ] || { fail "$name: no results file"; return; }
  if /usr/bin/python3 - "$name.jsonl" "$errors" <<'PY'; then
import json, sys
cases = [json.loads(l) for l in open(sys.argv[1], encoding="utf-8").read().splitlines()[1:]]
want = set(sys.argv[2].split())
errs = [c["id"] + ": " + c["reason"] for c in cases if c["outcome"] == "error"]
ok = len(cases) == 10 and all(
    (c["outcome"] == "error" and c["reason"]) if c["id"] in want else c["outcome"] == "pass"
    for c in cases)
print(("ok: " if ok else "FAIL: ") + sys.argv[1][:-6] + f" ({len(cases) - len(errs)} passed, "
      f"{len(errs)} errors: " + " | ".join(errs)[:200] + ")", file=sys.stdout if ok else sys.stderr)
sys.exit(0 if ok else 1)
PY
    :
  else
    failures=$((failures + 1))
  fi
}

for batch in batch per-sentence; do
  run_mode "crash-$batch" crash $batch && expect "crash-$batch" "c4"
  run_mode "hang-$batch" hang $batch && expect "hang-$batch" "c5"
  run_mode "garbage-$batch" garbage $batch && expect "garbage-$batch" "c6"
  run_mode "stderr-$batch" stderr $batch && expect "stderr-$batch" ""
  run_mode "noread-$batch" noread $batch && expect "noread-$batch" "c1 c2 c3 c4 c5 c6 c7 c8 c9 c10"
done
# One line short: no line can be matched to its sentence, so the whole batch is in error.
run_mode few-batch few batch && expect few-batch "c1 c2 c3 c4 c5 c6 c7 c8 c9 c10"
# Two lines for c7: one line too many, so again no line can be matched to its sentence.
run_mode many-batch many batch && expect many-batch "c1 c2 c3 c4 c5 c6 c7 c8 c9 c10"
finish
