#!/usr/bin/env bash
# Keeps the demo's story true (docs/demo.md, docs/walkthrough.md): v1 passes its gate on its own
# and against itself as baseline; v2 against v1 fails it; compare finds fixed, broken and worse cases and a
# significance result; the narrower edit of the walkthrough (only VP -> VBD NP PP PP) passes.
# These are demo expectations, not checks of treegate's correctness.
set -euo pipefail
: "${TREEGATE:?}" "${SOURCE_DIR:?}"
for sub in run compare; do
  if ! "$TREEGATE" "$sub" --help >/dev/null 2>&1; then
    echo "not run: subcommand $sub not built yet"; exit 0
  fi
done
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
cp -r "$SOURCE_DIR/suites/demo" "$tmp/demo"
cd "$tmp/demo"
fail() { echo "FAIL: $*"; exit 1; }
status() { set +e; "$@" >"$tmp/out.txt" 2>&1; echo $?; set -e; }

[ "$(status "$TREEGATE" run --results v1.jsonl --no-timings)" = 0 ] || { cat "$tmp/out.txt"; fail "v1 without a baseline should pass (only the F1 rules apply; no case is newly failing)"; }
[ "$(status "$TREEGATE" run --baseline v1.jsonl --results v1.jsonl --no-timings)" = 0 ] || { cat "$tmp/out.txt"; fail "v1 against itself should pass"; }
[ "$(status "$TREEGATE" run --grammar v2.pcfg --baseline v1.jsonl --results v2.jsonl --summary-json v2.summary.json --no-timings)" = 1 ] || fail "v2 against v1 should fail the gate"
[ "$(status "$TREEGATE" compare v1.jsonl v2.jsonl --format json)" = 1 ] || fail "compare v1 v2 should exit 1"
/usr/bin/python3 - "$tmp/out.txt" <<'PY' || exit 1
import json, sys
d = json.load(open(sys.argv[1]))
t = d["transitions"]
print("v1 -> v2 transitions:", t)
ok = t["fixed"] > 0 and t["broken"] > 0 and t["worse"] + t["better"] + t["changed_same_f1"] > 0
# compare and the gate share one definition of fixed and broken.
gate = json.load(open("v2.summary.json"))
print("v2 against v1, gate:", len(gate["fixes"]), "fixes,", len(gate["regressions"]), "regressions")
ok = ok and t["fixed"] == len(gate["fixes"]) and t["broken"] == len(gate["regressions"])
ok = ok and "significance" in d and d["significance"]
sys.exit(0 if ok else 1)
PY
sed -i 's/^VP -> VBD NP 0.096154$/VP -> VBD NP 0.086154/; s/^VP -> VBD NP PP 0.028846$/VP -> VBD NP PP 0.028846\nVP -> VBD NP PP PP 0.01/' v1.pcfg
grep -q "^VP -> VBD NP PP PP 0.01$" v1.pcfg || fail "could not apply the walkthrough's narrower edit"
[ "$(status "$TREEGATE" run --baseline v1.jsonl --results v1b.jsonl --no-timings)" = 0 ] || { cat "$tmp/out.txt"; fail "the narrower edit should pass against v1"; }
echo "ok: v1 passes against itself, v2 fails against v1 with fixed/broken/worse cases, the narrower edit passes"
