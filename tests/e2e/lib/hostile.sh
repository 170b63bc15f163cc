# Helpers for the hostile-input script tests (tests/e2e/hostile_*.sh), sourced, not a test.
# Each test runs in a fresh temp folder (removed on exit) with $TREEGATE the binary under test.
set -euo pipefail
: "${TREEGATE:?set TREEGATE to the treegate binary}"
e2e_dir=$(cd "$(dirname "$0")" && pwd)  # tests/e2e, for the helpers in lib/
work=$(mktemp -d "${TMPDIR:-/tmp}/tg-hostile.XXXXXX")
trap 'rm -rf "$work"' EXIT
cd "$work"
failures=0

fail() {
  echo "FAIL: $*" >&2
  failures=$((failures + 1))
}

# expect_error NAME EXIT_CODE EXPECTED_STDERR_LINE -- COMMAND...
# Runs COMMAND; checks its exit code, that stderr is exactly the one expected line and that
# stdout is empty (a refused input writes no partial report).
expect_error() {
  local name=$1 code=$2 expected=$3
  shift 4
  local rc=0
  "$@" >out.txt 2>err.txt || rc=$?
  [ "$rc" -eq "$code" ] || fail "$name: exit $rc, expected $code (stderr: $(head -c 300 err.txt))"
  local got
  got=$(cat err.txt)
  [ "$got" = "$expected" ] || fail "$name: stderr is
  $got
expected
  $expected"
  [ "$(wc -l <err.txt)" -eq 1 ] || fail "$name: stderr has $(wc -l <err.txt) lines, expected 1"
  [ ! -s out.txt ] || fail "$name: stdout not empty: $(head -c 200 out.txt)"
  echo "ok: $name"
}

# Peak resident memory of a finished command in KB, read from GNU time's -v report in FILE.
peak_kb() { sed -n 's/^\s*Maximum resident set size (kbytes): //p' "$1"; }

finish() {
  if [ "$failures" -ne 0 ]; then
    echo "$failures check(s) failed" >&2
    exit 1
  fi
  echo "all checks passed"
}
