"""Cross-check of treegate's bracketed-tree reader against NLTK's (nltk.Tree.fromstring).

Generates a few thousand random trees (random depth and branching, labels with function tags,
words with punctuation-like and non-ASCII characters, trees spread over several lines, some
with an unlabeled root), lets treegate read them and write them back in one-line form, and
checks that NLTK reads the same labels, leaves and shape from the original text and from
treegate's output.
"""
import random
import subprocess
import sys
import tempfile

from nltk import Tree

LABELS = ["S", "NP", "VP", "PP", "NP-SBJ", "NP-SBJ-1", "SBAR", "-LRB-", "WHNP", "ADJP", "X", "PRT"]
TAGS = ["DT", "NN", "NNS", "VBZ", "IN", ",", ".", "-NONE-", "PRP$", "``", "''"]
WORDS = ["the", "dog", "caf\u00e9", "na\u00efve", "\u6e2f", "\u03bb", "3.14", "*T*-1", "e-mail",
         "'s", "&amp;", "<b>", "x{y}", "a\"b", "\U0001F600", "--", "\u00bd"]


def random_tree(rng, depth):
    if depth == 0 or rng.random() < 0.25:
        return "(%s %s)" % (rng.choice(TAGS), rng.choice(WORDS))
    kids = [random_tree(rng, depth - 1) for _ in range(rng.randint(1, 4))]
    sep = rng.choice([" ", "\n  ", "\n\t", "  "])
    return "(%s %s)" % (rng.choice(LABELS), sep.join(kids))


def main():
    tool = sys.argv[1]
    rng = random.Random(12345)
    texts = []
    for i in range(3000):
        t = random_tree(rng, rng.randint(1, 8))
        if i % 7 == 0:
            t = "( %s )" % t
        texts.append(t)
    with tempfile.NamedTemporaryFile("w", encoding="utf-8", suffix=".trees", delete=False) as f:
        f.write("\n\n".join(texts) + "\n")
        path = f.name
    out = subprocess.run([tool, path], capture_output=True, check=True).stdout.decode("utf-8")
    lines = out.splitlines()
    assert len(lines) == len(texts), "tree count: treegate %d, input %d" % (len(lines), len(texts))
    bad = 0
    for i, (text, line) in enumerate(zip(texts, lines)):
        expected = Tree.fromstring(text)
        got = Tree.fromstring(line)
        if expected != got or expected.leaves() != got.leaves():
            bad += 1
            if bad <= 5:
                print("tree %d differs:\n  nltk:     %s\n  treegate: %s" % (i + 1, expected, line))
    print("compared %d trees with nltk.Tree.fromstring: %d differ" % (len(texts), bad))
    sys.exit(1 if bad else 0)


if __name__ == "__main__":
    main()
