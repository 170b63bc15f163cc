"""Held-out benchmark of estimated grammars on gum-ccby-train.

Documents in name order; every fifth (the 5th, 10th, ...) is held out, the rest (about 80%)
train. For each transform setting: `treegate estimate` on the training documents, `treegate
parse` on the held-out sentences of up to 40 words (words only, no tags), `treegate score`
against the held-out trees. Prints labeled F1 (the scoring scheme's defaults), coverage
(sentences with a parse), parse speed (sentences/s, CPU and wall) and grammar size.
Usage: heldout.py TREEGATE GUM_TREES_DIR WORKDIR [JOBS]
"""
import glob
import json
import os
import resource
import subprocess
import sys
import time

# The shared treebank-splitting helper (the reference checks use it too).
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "tests",
                                "reference", "lib"))
from treebank_text import split_bracketed  # noqa: E402

MAX_WORDS = 40
SETTINGS = [
    ("no transforms", []),
    ("v=2", ["--parent", "2"]),
    ("v=2 h=1", ["--parent", "2", "--horizontal", "1"]),
    ("v=2 h=2", ["--parent", "2", "--horizontal", "2"]),
]


def split_trees(text):
    return [" ".join(t.split()) for t in split_bracketed(text)]


def words_of(tree):
    # Leaves are the tokens right before a ')' that do not follow '('.
    out = []
    for token in tree.replace("(", " ( ").replace(")", " ) ").split():
        out.append(token)
    leaves = [out[i] for i in range(1, len(out)) if out[i] not in "()" and out[i - 1] != "("]
    return leaves


def run_timed(argv, stdout):
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    start = time.time()
    subprocess.run(argv, check=True, stdout=stdout, stderr=subprocess.DEVNULL)
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    cpu = (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)
    return cpu, time.time() - start


def main():
    treegate, gum, work = sys.argv[1], sys.argv[2], sys.argv[3]
    jobs = sys.argv[4] if len(sys.argv) > 4 else "1"
    docs = sorted(glob.glob(os.path.join(gum, "*.ptb")))
    test_docs = [d for i, d in enumerate(docs) if i % 5 == 4]
    train_docs = [d for i, d in enumerate(docs) if i % 5 != 4]
    gold = []
    for d in test_docs:
        gold += [t for t in split_trees(open(d, encoding="utf-8").read())
                 if len(words_of(t)) <= MAX_WORDS]
    with open(f"{work}/gold.trees", "w", encoding="utf-8") as f:
        f.writelines(t + "\n" for t in gold)
    with open(f"{work}/sentences.txt", "w", encoding="utf-8") as f:
        f.writelines(" ".join(words_of(t)) + "\n" for t in gold)
    words = sum(len(words_of(t)) for t in gold)
    print(f"held-out benchmark on gum-ccby-train: {len(train_docs)} training documents, "
          f"{len(test_docs)} held-out documents (every fifth in name order)")
    print(f"  {len(gold)} held-out sentences of 1-{MAX_WORDS} words ({words} words); parse "
          f"--jobs {jobs}, words only")
    print(f"  {'setting':14s} {'F1':>6s} {'P':>6s} {'R':>6s} {'cover':>7s} {'sent/s cpu':>10s} "
          f"{'sent/s wall':>11s} {'rules':>7s} {'symbols':>8s} {'est. s':>7s}")
    for name, options in SETTINGS:
        grammar = f"{work}/g.pcfg"
        est_cpu, _ = run_timed([treegate, "estimate", "-o", grammar] + options + train_docs,
                               subprocess.DEVNULL)
        rules = sum(1 for line in open(grammar, encoding="utf-8") if not line.startswith("@"))
        symbols = len({line.split()[0] for line in open(grammar, encoding="utf-8")
                       if not line.startswith("@")})
        with open(f"{work}/parsed.trees", "w", encoding="utf-8") as out:
            cpu, wall = run_timed([treegate, "parse", "--grammar", grammar, "--jobs", jobs,
                                   f"{work}/sentences.txt"], out)
        score = subprocess.run([treegate, "score", f"{work}/gold.trees", f"{work}/parsed.trees",
                                "--format", "json"], check=True, capture_output=True,
                               text=True).stdout
        totals = json.loads(score)["totals"]
        covered = 100.0 * (totals["scored"] - totals["unparsed"]) / max(1, totals["scored"])
        print(f"  {name:14s} {totals['f1']:6.2f} {totals['precision']:6.2f} "
              f"{totals['recall']:6.2f} {covered:6.1f}% {len(gold) / max(cpu, 1e-3):10.1f} "
              f"{len(gold) / max(wall, 1e-3):11.1f} {rules:7d} {symbols:8d} {est_cpu:7.2f}")


if __name__ == "__main__":
    main()
