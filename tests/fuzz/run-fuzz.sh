#!/usr/bin/env bash
# Runs each libFuzzer target for TIME seconds and prints one figure line per target
# (executions, coverage, corpus, crashes). Builds build-asan/ first (ci/sanitize --build-only)
# unless FUZZ_NO_BUILD=1. The committed seeds in tests/fuzz/corpus/<name>/ are read, never
# written; new inputs go to build-asan/fuzz-work/<name>/ and crashes to
# build-asan/fuzz-artifacts/<name>/. Exit 1 when any target crashed, leaked or timed out.
# Usage: tests/fuzz/run-fuzz.sh TIME [NAME...]     (NAME: bracket_reader, grammar, ...)
# Environment: FUZZ_RUNS=N runs N inputs per target instead of TIME seconds; FUZZ_SEED=S fixes
# libFuzzer's random seed; FUZZ_FRESH=1 starts from the committed seeds only (a new, empty work
# folder). With all three a run is reproducible: the same binary tries the same inputs.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
root=$(cd "$here/../.." && pwd)
time_s=${1:?usage: run-fuzz.sh TIME [NAME...]}
shift
build=${ASAN_BUILD_DIR:-$root/build-asan}
[ "${FUZZ_NO_BUILD:-0}" = 1 ] || "$root/ci/sanitize" --build-only >/dev/null
names=("$@")
if [ ${#names[@]} -eq 0 ]; then
  for src in "$here"/fuzz_*.cc; do
    n=$(basename "$src" .cc)
    names+=("${n#fuzz_}")
  done
fi
export ASAN_OPTIONS=${ASAN_OPTIONS:-detect_leaks=1:abort_on_error=1}
export UBSAN_OPTIONS=${UBSAN_OPTIONS:-print_stacktrace=1:halt_on_error=1}
# Some paths depend on heap addresses; without address randomisation a seeded run repeats.
launch=()
if [ -n "${FUZZ_SEED:-}" ] && setarch "$(uname -m)" -R true 2>/dev/null; then
  launch=(setarch "$(uname -m)" -R)
fi
status=0
printf '%-16s %8s %12s %8s %8s %8s %8s\n' target seconds executions exec/s cov features crashes
for name in "${names[@]}"; do
  bin="$build/fuzz/fuzz_$name"
  [ -x "$bin" ] || { echo "run-fuzz: no target $bin" >&2; status=1; continue; }
  work="$build/fuzz-work/$name"
  [ "${FUZZ_FRESH:-0}" = 1 ] && rm -rf "$work"
  art="$build/fuzz-artifacts/$name"
  log="$build/fuzz-logs/$name.log"
  mkdir -p "$work" "$art" "$(dirname "$log")"
  args=(-timeout=30 -rss_limit_mb=2048 -max_len=16384 -print_final_stats=1
        -artifact_prefix="$art/")
  if [ -n "${FUZZ_RUNS:-}" ]; then args+=(-runs="$FUZZ_RUNS"); else args+=(-max_total_time="$time_s"); fi
  [ -n "${FUZZ_SEED:-}" ] && args+=(-seed="$FUZZ_SEED" -reload=0)
  [ -f "$here/$name.dict" ] && args+=(-dict="$here/$name.dict")
  seeds=()
  [ -d "$here/corpus/$name" ] && seeds=("$here/corpus/$name")
  rc=0
  started=$SECONDS
  "${launch[@]}" "$bin" "${args[@]}" "$work" "${seeds[@]}" >"$log" 2>&1 || rc=$?
  took=$((SECONDS - started))
  execs=$(sed -n 's/^stat::number_of_executed_units: *//p' "$log" | tail -1)
  speed=$(sed -n 's/^stat::average_exec_per_sec: *//p' "$log" | tail -1)
  cov=$(grep -oE 'cov: [0-9]+' "$log" | tail -1 | cut -d' ' -f2)
  ft=$(grep -oE 'ft: [0-9]+' "$log" | tail -1 | cut -d' ' -f2)
  crashes=$(find "$art" -type f | wc -l)
  printf '%-16s %8s %12s %8s %8s %8s %8s\n' "$name" "$took" "${execs:-?}" "${speed:-?}" \
    "${cov:-?}" "${ft:-?}" "$crashes"
  if [ "$rc" -ne 0 ] || [ "$crashes" -gt 0 ]; then
    echo "run-fuzz: $name failed (exit $rc); log: $log; inputs: $art" >&2
    grep -m4 -E 'ERROR|SUMMARY|property failed|terminate called|what\(\)' "$log" >&2 || true
    status=1
  fi
done
exit $status
