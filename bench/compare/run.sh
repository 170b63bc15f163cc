#!/usr/bin/env bash
# Times `compare` on two generated 50,000-case results files (library, one thread), then the
# same through the CLI. Usage: bench/compare/run.sh [CASES]  (build first: ci/build)
set -euo pipefail
cd "$(dirname "$0")/../.."
build=${BUILD_DIR:-build}
n=${1:-50000}
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
"$build/bench/compare/compare_bench" "$n" "$tmp"
start=$(date +%s.%N)
"$build/treegate" compare "$tmp/compare-bench-old.jsonl" "$tmp/compare-bench-new.jsonl" > /dev/null || true
end=$(date +%s.%N)
printf '  CLI treegate compare (text output) %.3f s\n' "$(echo "$end - $start" | bc)"
