#!/usr/bin/env bash
# Hostile input: a 1 GB treebank (TREEGATE_HUGE_MB, default 1024; ci/sanitize uses less) is
# generated here and scored against itself in bounded memory: the peak resident memory for it
# stays within 32 MB of the peak for its first 1 MB (not checked under the sanitizers, see
# ci/sanitize). Needs GNU time (/usr/bin/time).
source "$(dirname "$0")/lib/hostile.sh"
mb=${TREEGATE_HUGE_MB:-1024}
[ -x /usr/bin/time ] || { fail "/usr/bin/time missing (ci/install-deps installs 'time')"; finish; }

# About 1 MB of random trees of 5-45 words, whole lines, then the same block $mb times.
/usr/bin/python3 - <<'PY'
import random
random.seed(20261201)
tags = ["DT", "NN", "VB", "JJ", "IN", "NNS", "RB", ",", "."]
def tree(n):
    parts = ["(%s w%d)" % (random.choice(tags), random.randrange(5000)) for _ in range(n)]
    while len(parts) > 1:
        i = random.randrange(len(parts) - 1)
        k = random.randint(2, min(3, len(parts) - i))
        parts[i:i + k] = ["(%s %s)" % (random.choice(["NP", "VP", "PP", "S"]), " ".join(parts[i:i + k]))]
    return "(ROOT %s)\n" % parts[0]
with open("block.trees", "w") as f:
    size = 0
    while size < (1 << 20):
        line = tree(random.randint(5, 45))
        f.write(line)
        size += len(line)
PY
for ((i = 0; i < mb; i++)); do cat block.trees; done >huge.trees
block_trees=$(wc -l <block.trees)
bytes=$(stat -c %s huge.trees)

/usr/bin/time -v "$TREEGATE" score block.trees block.trees >small.txt 2>small.time ||
  fail "1 MB block: exit $?"
start=$(date +%s.%N)
/usr/bin/time -v "$TREEGATE" score huge.trees huge.trees >huge.txt 2>huge.time ||
  fail "huge treebank: exit $? ($(head -c 300 huge.time))"
end=$(date +%s.%N)
expected="$((block_trees * mb)) sentences: $((block_trees * mb)) scored, 0 errors, 0 without a parse"
[ "$(sed -n 2p huge.txt)" = "$expected" ] || fail "huge treebank: '$(sed -n 2p huge.txt)', expected '$expected'"
small_kb=$(peak_kb small.time)
huge_kb=$(peak_kb huge.time)
/usr/bin/python3 -c "
b, s, h, t = $bytes, $small_kb, $huge_kb, $end - $start
print(f'huge treebank: {b / 2**20:.0f} MB x 2 read in {t:.1f} s ({2 * b / 2**20 / t:.0f} MB/s); '
      f'peak RSS {h} KB vs {s} KB for 1 MB (ratio {h / s:.2f})')"
if [ -n "${TREEGATE_SANITIZED:-}" ]; then
  # AddressSanitizer's quarantine keeps freed memory for a while, so RSS says nothing there.
  echo "not checked: the memory bound (sanitizer build); ${mb} MB read without a sanitizer error"
elif [ "$huge_kb" -le $((small_kb + 32768)) ]; then
  echo "ok: ${mb} MB treebank scored in bounded memory"
else
  fail "memory grows with the input: peak ${huge_kb} KB for ${mb} MB vs ${small_kb} KB for 1 MB"
fi
finish
