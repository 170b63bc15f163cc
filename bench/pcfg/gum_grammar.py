"""Reads a plain treebank PCFG off the GUM trees for the parser benchmark.

Documents (files) in name order; every fifth one (the 5th, 10th, ...) is held out, the others
train. Function tags and indices are stripped (NP-SBJ-1 -> NP; labels starting with '-' such as
-LRB- are kept), the ROOT wrapper is kept as the start symbol, no other transform. Writes:
  OUT/train.pcfg     the grammar (@weights counts: rule counts, normalised on load)
  OUT/heldout.tagged held-out sentences of MIN..MAX words, tokens WORD_TAG
  OUT/heldout.words  the same sentences, words only
Usage: gum_grammar.py TREES_DIR OUT [MIN] [MAX]
"""
import collections
import os
import re
import sys

# The shared treebank-splitting helper (the reference checks use it too).
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "tests",
                                "reference", "lib"))
from treebank_text import read_nltk_trees  # noqa: E402


def read_trees(path):
    return read_nltk_trees([path])


def strip(label):
    if label.startswith("-"):
        return label
    return re.split(r"[-=]", label)[0] or label


def quote(word):
    return '"' + word.replace("\\", "\\\\").replace('"', '\\"') + '"'


def main():
    trees_dir, out = sys.argv[1], sys.argv[2]
    lo = int(sys.argv[3]) if len(sys.argv) > 3 else 2
    hi = int(sys.argv[4]) if len(sys.argv) > 4 else 40
    os.makedirs(out, exist_ok=True)
    files = sorted(f for f in os.listdir(trees_dir) if not f.startswith("."))
    counts = collections.Counter()
    held = []
    for n, name in enumerate(files):
        for tree in read_trees(os.path.join(trees_dir, name)):
            if n % 5 == 4:
                held.append(tree.pos())
                continue
            for sub in tree.subtrees():
                kids = [quote(k) if isinstance(k, str) else strip(k.label()) for k in sub]
                counts[(strip(sub.label()), tuple(kids))] += 1
    with open(os.path.join(out, "train.pcfg"), "w", encoding="utf-8") as f:
        f.write("# Read off %s by bench/pcfg/gum_grammar.py (training documents)\n" % os.path.basename(os.path.dirname(trees_dir.rstrip("/"))))
        f.write("@start ROOT\n@weights counts\n")
        for (lhs, rhs), c in sorted(counts.items()):
            f.write("%s -> %s %d\n" % (lhs, " ".join(rhs), c))
    kept = [s for s in held if lo <= len(s) <= hi]
    with open(os.path.join(out, "heldout.tagged"), "w", encoding="utf-8") as t, \
            open(os.path.join(out, "heldout.words"), "w", encoding="utf-8") as w:
        for s in kept:
            t.write(" ".join("%s_%s" % (word, tag) for word, tag in s) + "\n")
            w.write(" ".join(word for word, _ in s) + "\n")
    print("rules %d (lhs %d), held-out sentences %d of %d-%d words (of %d)" % (
        len(counts), len({l for l, _ in counts}), len(kept), lo, hi, len(held)))


if __name__ == "__main__":
    main()
