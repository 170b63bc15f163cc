"""Cross-check of `treegate estimate --plain` against nltk.induce_pcfg (Debian's python3-nltk).

For each treebank given, treegate estimates a grammar without transforms; NLTK reads the same
trees (nltk.Tree.fromstring), takes every tree's productions (Tree.productions) and estimates
a PCFG with nltk.induce_pcfg(Nonterminal(start), productions), i.e. relative frequency per
left-hand side. The two rule sets must be equal and every probability equal within 1e-12
(relative). Usage: estimate_nltk.py TREEGATE WORKDIR TREEBANK...
"""
import os
import re
import subprocess
import sys

from nltk import Nonterminal, induce_pcfg

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "lib"))
from treebank_text import read_nltk_trees  # noqa: E402

ITEM = re.compile(r'"((?:[^"\\]|\\.)*)"|(\S+)')


def read_treegate_grammar(path):
    """Rules of a .pcfg file as {(lhs, rhs tuple): probability}; terminals are plain strings,
    nonterminals are Nonterminal objects, as in NLTK."""
    rules = {}
    for line in open(path, encoding="utf-8"):
        line = line.rstrip("\n")
        if not line or line.startswith("@"):
            continue
        items = [(m.group(1), m.group(2)) for m in ITEM.finditer(line)]
        assert items[1] == (None, "->"), line
        if items[-1][1] and items[-1][1].startswith("count="):
            items.pop()
        weight = float(items[-1][1])
        rhs = []
        for quoted, bare in items[2:-1]:
            if quoted is not None:
                rhs.append(re.sub(r"\\(.)", r"\1", quoted))
            else:
                assert not bare.startswith("<unk:"), "--plain must not write unknown classes"
                rhs.append(Nonterminal(bare))
        rules[(Nonterminal(items[0][1]), tuple(rhs))] = weight
    return rules


read_trees = read_nltk_trees


def main():
    treegate, workdir, paths = sys.argv[1], sys.argv[2], sys.argv[3:]
    grammar_path = workdir + "/plain.pcfg"
    subprocess.run([treegate, "estimate", "--plain", "--start", "ROOT", "-o", grammar_path] + paths,
                   check=True, stdout=subprocess.DEVNULL)
    ours = read_treegate_grammar(grammar_path)
    trees = read_trees(paths)
    productions = [p for t in trees for p in t.productions()]
    theirs = {(p.lhs(), p.rhs()): p.prob() for p in induce_pcfg(Nonterminal("ROOT"), productions).productions()}
    missing = set(theirs) - set(ours)
    extra = set(ours) - set(theirs)
    worst = 0.0
    for key, p in theirs.items():
        if key in ours:
            worst = max(worst, abs(ours[key] - p) / p)
    print("trees: %d, NLTK rules: %d, treegate rules: %d, missing: %d, extra: %d, "
          "largest relative difference: %.3g" % (len(trees), len(theirs), len(ours), len(missing),
                                                 len(extra), worst))
    for key in list(missing)[:5]:
        print("  missing in treegate:", key)
    for key in list(extra)[:5]:
        print("  extra in treegate:", key)
    if missing or extra or worst > 1e-12:
        sys.exit(1)


if __name__ == "__main__":
    main()
