#!/usr/bin/python3
"""Generates the run benchmark's data: a random mid-size PCFG (acyclic nonterminal order, so
sampling ends) and a suite of trees sampled from it. Usage: gen_bench.py OUT_DIR CASES SEED"""
import os, random, sys

out, cases, seed = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
rng = random.Random(seed)
N, T, W = 60, 40, 3000          # nonterminals, tags, words
nts = ["S"] + ["X%d" % i for i in range(1, N)]
tags = ["T%d" % i for i in range(T)]
rules = {}
for i, lhs in enumerate(nts):
    later = nts[i + 1:]
    rhs_set = set()
    while len(rhs_set) < 8:
        k = rng.choice([1, 2, 2, 2, 3])
        pool = later + tags if later else tags
        rhs = tuple(rng.choice(pool) for _ in range(k))
        if k == 1 and rhs[0] in nts:
            continue
        rhs_set.add(rhs)
    weights = [rng.random() + 0.1 for _ in rhs_set]
    total = sum(weights)
    rules[lhs] = [(rhs, 0.97 * w / total) for rhs, w in zip(sorted(rhs_set), weights)]
    # Rare recursive rules over any nonterminal: ambiguity for the parser, while sampling
    # still ends (expected branching stays below one).
    extra = set()
    while len(extra) < 12:
        rhs = (rng.choice(nts), rng.choice(nts))
        if rhs not in rhs_set:
            extra.add(rhs)
    rules[lhs] += [(rhs, 0.03 / len(extra)) for rhs in sorted(extra)]
lex = {t: [] for t in tags}
for w in range(W):
    for t in rng.sample(tags, rng.choice([1, 2, 3])):
        lex[t].append("w%d" % w)
for t in tags:
    if not lex[t]:
        lex[t].append("w0")

os.makedirs(out, exist_ok=True)
with open(os.path.join(out, "bench.pcfg"), "w") as g:
    g.write("@start S\n")
    for lhs in nts:
        for rhs, p in rules[lhs]:
            g.write("%s -> %s %.6f\n" % (lhs, " ".join(rhs), p))
    for t in tags:
        for w in lex[t]:
            g.write('%s -> "%s" %.6f\n' % (t, w, 1.0 / len(lex[t])))

def sample(sym):
    if sym in lex:
        return "(%s %s)" % (sym, rng.choice(lex[sym])), 1
    rhs_list, probs = zip(*rules[sym])
    rhs = rng.choices(rhs_list, probs)[0]
    parts, n = [], 0
    for s in rhs:
        t, k = sample(s)
        parts.append(t)
        n += k
    return "(%s %s)" % (sym, " ".join(parts)), n

with open(os.path.join(out, "bench.yaml"), "w") as f:
    f.write("suite: bench\nconstructions: [generated]\ncases:\n")
    made = 0
    while made < cases:
        tree, n = sample("S")
        if not 10 <= n <= 25:
            continue
        made += 1
        f.write('  - id: c%d\n    tree: "%s"\n' % (made, tree))
        if made % 5 == 0:
            f.write("    constructions: [fifth]\n")
with open(os.path.join(out, "treegate.yaml"), "w") as f:
    f.write("grammar: bench.pcfg\nsuites: [bench.yaml]\ncase_min_f1: 0\n")
