# A misbehaving external parser for tests/e2e/hostile_external_parser.sh (not a test itself).
# Reads tokenised sentences on stdin; answers each with a flat tree that equals the suite's
# gold tree, except for trigger words that make it fail as MODE says:
#   crash   "boom": the process kills itself with SIGSEGV
#   hang    "hang": waits forever in a child process (checks that the group is killed)
#   garbage "junk": prints a line that is not a tree
#   few     answers every sentence but the last, then exits 0
#   many    "twice": prints its tree twice
#   stderr  "noisy": writes 4 MB to stderr first
#   noread  exits with status 3 before reading anything
import os
import signal
import subprocess
import sys

mode = sys.argv[1]
marker = sys.argv[2]  # unique text in every process's arguments, to look for leftovers
if mode == "noread":
    sys.exit(3)
lines = sys.stdin.read().splitlines() if mode == "few" else None


def tree(words):
    return "(ROOT (S " + " ".join("(X %s)" % w for w in words) + "))"


def answer(line):
    words = line.split()
    if mode == "crash" and "boom" in words:
        sys.stdout.flush()
        os.kill(os.getpid(), signal.SIGSEGV)
    if mode == "hang" and "hang" in words:
        sys.stdout.flush()
        subprocess.run([sys.executable, "-c", "import time; time.sleep(1000)", marker])
    if mode == "garbage" and "junk" in words:
        return "%%% not a tree ((("
    if mode == "stderr" and "noisy" in words:
        sys.stderr.write("x" * (4 << 20))
        sys.stderr.flush()
    if mode == "many" and "twice" in words:
        return tree(words) + "\n" + tree(words)
    return tree(words)


if lines is not None:
    for line in lines[:-1]:
        print(answer(line))
    sys.exit(0)
for line in sys.stdin:
    print(answer(line.rstrip("\n")), flush=True)
