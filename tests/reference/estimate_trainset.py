"""Training-set sanity check: a grammar estimated from a treebank parses that treebank's own
sentences far better than a right-branching baseline.

Estimates a grammar with `treegate estimate` (default transforms, and v=2 h=1), parses the
sentences of up to MAX_WORDS words with `treegate parse`, and scores with `treegate score`.
The right-branching baseline (each constituent = one word + everything to its right, the
usual trivial baseline for English; e.g. Klein & Manning 2002, "A generative
constituent-context model", recalled from memory) has no labels, so both it and the grammar's
trees are also scored unlabeled: every phrase label (and the gold's) is replaced by X.
The grammar's unlabeled F1 must beat the baseline's by at least MARGIN points.
Usage: estimate_trainset.py TREEGATE WORKDIR MAX_SENTENCES TREEBANK...
"""
import json
import os
import subprocess
import sys

from nltk import Tree

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "lib"))
from treebank_text import read_nltk_trees  # noqa: E402

MAX_WORDS = 25
MARGIN = 15.0


read_trees = read_nltk_trees


def one_line(tree):
    return tree.pformat(margin=10**9) if isinstance(tree, Tree) else tree


def unlabeled(tree):
    """Phrase labels (not the root, not tags) replaced by X."""
    out = tree.copy(deep=True)
    for pos in out.treepositions():
        node = out[pos]
        if isinstance(node, Tree) and pos != () and node.height() > 2:
            node.set_label("X")
    return out


def right_branching(tree):
    """ROOT over (X t1 (X t2 (... (X tn-1 tn)))) with the gold tags as preterminals."""
    tagged = [Tree(tag, [word]) for word, tag in tree.pos()]
    node = tagged[-1]
    for pre in reversed(tagged[:-1]):
        node = Tree("X", [pre, node])
    return Tree("ROOT", [node])


def score(treegate, workdir, name, gold, test):
    with open(f"{workdir}/{name}.gold", "w", encoding="utf-8") as g, \
         open(f"{workdir}/{name}.test", "w", encoding="utf-8") as t:
        g.writelines(one_line(x) + "\n" for x in gold)
        t.writelines((x if isinstance(x, str) else one_line(x)) + "\n" for x in test)
    out = subprocess.run([treegate, "score", f"{workdir}/{name}.gold", f"{workdir}/{name}.test",
                          "--format", "json"], check=True, capture_output=True, text=True).stdout
    return json.loads(out)["totals"]


def main():
    treegate, workdir, limit, paths = sys.argv[1], sys.argv[2], int(sys.argv[3]), sys.argv[4:]
    gold = [t for t in read_trees(paths) if 2 <= len(t.leaves()) <= MAX_WORDS][:limit]
    with open(f"{workdir}/sentences.txt", "w", encoding="utf-8") as f:
        f.writelines(" ".join(t.leaves()) + "\n" for t in gold)
    baseline = score(treegate, workdir, "rb", [unlabeled(t) for t in gold],
                     [right_branching(t) for t in gold])["f1"]
    print(f"{len(gold)} sentences of 2-{MAX_WORDS} words; right-branching baseline, "
          f"unlabeled F1 {baseline:.2f}")
    failed = False
    for name, options in [("default", []), ("v2h1", ["--parent", "2", "--horizontal", "1"])]:
        grammar = f"{workdir}/{name}.pcfg"
        subprocess.run([treegate, "estimate", "-o", grammar] + options + paths, check=True,
                       stdout=subprocess.DEVNULL)
        parsed = subprocess.run([treegate, "parse", "--grammar", grammar,
                                 f"{workdir}/sentences.txt"], check=True, capture_output=True,
                                text=True).stdout.splitlines()
        labeled = score(treegate, workdir, name, gold, parsed)
        test = [unlabeled(Tree.fromstring(p)) if p != "()" else "()" for p in parsed]
        plain = score(treegate, workdir, name + "-x", [unlabeled(t) for t in gold], test)
        print(f"  grammar {name:8s} labeled F1 {labeled['f1']:6.2f}, unlabeled F1 {plain['f1']:6.2f}"
              f", unparsed {labeled['unparsed']}")
        if plain["f1"] < baseline + MARGIN:
            print(f"  FAILED: {name} is not {MARGIN} points above the baseline")
            failed = True
    sys.exit(1 if failed else 0)


if __name__ == "__main__":
    main()
