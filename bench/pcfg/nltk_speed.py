"""Speed of treegate's CKY beside nltk.parse.ViterbiParser on the same grammar and sentences.

Converts a treegate grammar (@weights probabilities, no unknown-word classes) to NLTK's PCFG
form, parses the sentences with NLTK's ViterbiParser and with `treegate parse --format json`,
checks that both find the same best log probabilities, and prints per-sentence times and the
ratio (treegate's in-process parse time, and its whole-process wall time).
Usage: nltk_speed.py TREEGATE GRAMMAR SENTENCES
"""
import json
import math
import subprocess
import sys
import time

import nltk
from nltk.parse.viterbi import ViterbiParser


def nltk_grammar(path):
    lines, start, names = [], None, {}
    safe = lambda n: names.setdefault(n, "N%d" % len(names))  # NLTK wants word-like names
    for raw in open(path, encoding="utf-8"):
        line = raw.split("#")[0].strip() if '"#' not in raw else raw.strip()
        if not line:
            continue
        if line.startswith("@start"):
            start = safe(line.split()[1])
            continue
        if line.startswith("@"):
            continue
        lhs, rest = line.split("->", 1)
        items = rest.split()
        weight = items.pop()
        if items and items[-1].startswith("count="):
            weight = items.pop()
        rhs = []
        for item in items:
            if item.startswith('"'):
                word = item[1:-1].replace('\\"', '"').replace("\\\\", "\\")
                rhs.append("'%s'" % word.replace("'", "\\'"))
            else:
                rhs.append(safe(item))
        lines.append("%s -> %s [%s]" % (safe(lhs.strip()), " ".join(rhs), weight))
    lines.sort(key=lambda l: not l.startswith(start + " "))  # the start symbol's rules first
    return nltk.PCFG.fromstring("\n".join(lines))


def main():
    treegate, grammar_path, sentences_path = sys.argv[1:4]
    sentences = [l.split() for l in open(sentences_path, encoding="utf-8") if l.strip()]
    started = time.perf_counter()
    run = subprocess.run([treegate, "parse", "--grammar", grammar_path, "--format", "json", sentences_path],
                         capture_output=True, text=True, check=True)
    tg_wall = time.perf_counter() - started
    results = [json.loads(l) for l in run.stdout.splitlines()]
    tg_parse = sum(r["seconds"] for r in results)
    parser = ViterbiParser(nltk_grammar(grammar_path))
    started = time.perf_counter()
    agree = 0
    for words, r in zip(sentences, results):
        trees = list(parser.parse(words))
        if trees and r["status"] == "parsed" and abs(math.log(trees[0].prob()) - r["logprob"]) <= 1e-9 * abs(r["logprob"]):
            agree += 1
    nltk_time = time.perf_counter() - started
    n = len(sentences)
    words = sum(len(s) for s in sentences)
    print("nltk comparison: %d sentences (%.1f words on average), same best log probability for %d" % (n, words / n, agree))
    print("  nltk ViterbiParser: %.4f s per sentence" % (nltk_time / n))
    print("  treegate parse:     %.6f s per sentence parsing, %.4f s per sentence with process start and grammar load"
          % (tg_parse / n, tg_wall / n))
    print("  speed ratio treegate / nltk: %.0fx (parsing), %.0fx (whole process)" % (nltk_time / tg_parse, nltk_time / tg_wall))


if __name__ == "__main__":
    main()
