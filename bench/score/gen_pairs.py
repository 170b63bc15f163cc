"""Writes N random gold/test tree pairs (about 25 words each) for the score benchmark.

The test tree re-brackets a random part of the gold tree, so scores are realistic (not 100).
Usage: gen_pairs.py N GOLD_OUT TEST_OUT [SEED]
"""
import random
import sys

LABELS = ["S", "NP", "VP", "PP", "SBAR", "ADJP", "ADVP", "NP-SBJ", "QP"]
TAGS = ["DT", "NN", "NNS", "VBZ", "VBD", "IN", "JJ", "RB", "PRP", "CC", "CD"]
WORDS = ["harbour", "the", "crane", "lifts", "crates", "with", "a", "hook", "and", "nets",
         "pier", "tide", "rose", "slowly", "ferry", "boats", "of", "at", "dawn", "seven"]


def bracket(rng, items, labels):
    items = list(items)
    while len(items) > 1:
        start = rng.randrange(len(items))
        length = 1 + rng.randrange(min(4, len(items) - start))
        joined = "(%s %s)" % (rng.choice(labels), " ".join(items[start:start + length]))
        items[start:start + length] = [joined]
    return items[0]


def main():
    n, gold_path, test_path = int(sys.argv[1]), sys.argv[2], sys.argv[3]
    rng = random.Random(int(sys.argv[4]) if len(sys.argv) > 4 else 7)
    with open(gold_path, "w") as gold, open(test_path, "w") as test:
        for _ in range(n):
            length = rng.randint(15, 35)
            leaves = ["(%s %s)" % (rng.choice(TAGS), rng.choice(WORDS)) for _ in range(length)]
            leaves.append("(. .)")
            cut = rng.randrange(1, length)
            left = bracket(rng, leaves[:cut], LABELS)
            gold.write("(ROOT (S %s %s))\n" % (left, bracket(rng, leaves[cut:], LABELS)))
            test.write("(ROOT (S %s %s))\n" % (left, bracket(rng, leaves[cut:], LABELS)))


if __name__ == "__main__":
    main()
