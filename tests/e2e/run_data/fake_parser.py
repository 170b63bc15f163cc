#!/usr/bin/python3
"""A stand-in parser for the run tests: reads one tokenised sentence per line and writes one
bracketed tree per line. With --oracle FILE it answers with the tree of FILE whose words match
(else a flat tree); words named after faults make it misbehave on purpose:
CRASHWORD (killed by SIGSEGV), HANGWORD (sleeps), GARBAGEWORD (not a tree), TWICEWORD (two
lines), NOPARSEWORD (no parse), NOISEWORD (a megabyte on stderr)."""
import os, signal, sys, time

def words_of(tree):
    out, i = [], 0
    toks = tree.replace("(", " ( ").replace(")", " ) ").split()
    for k, t in enumerate(toks):
        if t not in "()" and toks[k - 1] != "(":
            out.append(t)
    return out

oracle = {}
if len(sys.argv) > 2 and sys.argv[1] == "--oracle":
    for line in open(sys.argv[2], encoding="utf-8", errors="surrogateescape"):
        line = line.strip()
        if line:
            oracle[" ".join(words_of(line))] = line

for line in sys.stdin.buffer:
    text = line.decode("utf-8", "surrogateescape").rstrip("\n")
    words = text.split(" ")
    if "CRASHWORD" in words:
        os.kill(os.getpid(), signal.SIGSEGV)
    if "HANGWORD" in words:
        time.sleep(1000)
    if "NOISEWORD" in words:
        sys.stderr.write("x" * (1 << 20) + "\n")
    if "GARBAGEWORD" in words:
        out = "(((S"
    elif "NOPARSEWORD" in words:
        out = "()"
    elif text in oracle:
        out = oracle[text]
    else:
        out = "(S " + " ".join("(X %s)" % w for w in words) + ")"
    if "TWICEWORD" in words:
        out = out + "\n" + out
    sys.stdout.buffer.write((out + "\n").encode("utf-8", "surrogateescape"))
    sys.stdout.flush()
