"""Cross-check of treegate's CKY against Debian's python3-nltk (run by pcfg_nltk.sh).

For a few hundred random small PCFGs (unary rules, ternary rules, terminals inside longer rules,
ambiguous words; no unary cycles, which NLTK's parsers do not handle) and sentences sampled
from them (plus random word strings that may have no parse):
  - the Viterbi log probability equals nltk.parse.ViterbiParser's within 1e-9 relative, and the
    trees are equal where the best parse is unique;
  - the inside probability equals the sum of the probabilities of all trees enumerated by
    nltk.parse.chart.ChartParser, and the parse count equals their number;
  - the k best trees are distinct trees of NLTK's list, with NLTK's probabilities, best first.
Usage: pcfg_nltk.py TREEGATE WORKDIR [GRAMMARS] [SEED]
"""
import json
import math
import random
import subprocess
import sys
from itertools import islice

import nltk
from nltk.parse.chart import ChartParser
from nltk.parse.viterbi import ViterbiParser

MAX_TREES = 3000  # sentences with more NLTK trees are skipped (enumeration gets slow)


def random_grammar(rng):
    nts = ["S"] + ["X%d" % i for i in range(rng.randint(2, 4))]
    words = ["w%d" % i for i in range(rng.randint(3, 6))]
    rules = {}
    for idx, lhs in enumerate(nts):
        rhss = set()
        for w in rng.sample(words, rng.randint(1, 2)):
            rhss.add(("'%s'" % w,))
        for _ in range(rng.randint(1, 4)):
            arity = rng.choice([1, 2, 2, 2, 3, 3])
            if arity == 1:
                later = nts[idx + 1:]  # unary rules point down the order: no cycles
                if not later:
                    continue
                rhss.add((rng.choice(later),))
                continue
            rhs = [rng.choice(nts) for _ in range(arity)]
            if rng.random() < 0.15:
                rhs[rng.randrange(arity)] = "'%s'" % rng.choice(words)
            rhss.add(tuple(rhs))
        rhss = sorted(rhss)
        weights = [rng.uniform(0.05, 1.0) for _ in rhss]
        # Keep trees small: lexical rules get extra weight.
        weights = [w * (3.0 if r[0].startswith("'") and len(r) == 1 else 1.0) for w, r in zip(weights, rhss)]
        total = sum(weights)
        rules[lhs] = [(r, w / total) for r, w in zip(rhss, weights)]
    return nts, words, rules


def nltk_grammar(rules):
    lines = []
    for lhs in rules:
        for rhs, p in rules[lhs]:
            lines.append("%s -> %s [%r]" % (lhs, " ".join(rhs), p))
    return nltk.PCFG.fromstring("\n".join(lines))


def treegate_grammar(rules):
    out = ["@start S"]
    for lhs in rules:
        for rhs, p in rules[lhs]:
            items = ['"%s"' % r[1:-1] if r.startswith("'") else r for r in rhs]
            out.append("%s -> %s %r" % (lhs, " ".join(items), p))
    return "\n".join(out) + "\n"


def sample(rules, rng, symbol="S", depth=0):
    if depth > 12:
        raise RecursionError
    rhss = rules[symbol]
    r = rng.random()
    for rhs, p in rhss:
        r -= p
        if r <= 0:
            break
    words = []
    for item in rhs:
        if item.startswith("'"):
            words.append(item[1:-1])
        else:
            words += sample(rules, rng, item, depth + 1)
    return words


def flat(tree):
    return tree._pformat_flat("", "()", False)


def tree_prob(tree, probs):
    p = 1.0
    for prod in tree.productions():
        p *= probs[prod]
    return p


def main():
    treegate, workdir = sys.argv[1], sys.argv[2]
    count = int(sys.argv[3]) if len(sys.argv) > 3 else 300
    rng = random.Random(int(sys.argv[4]) if len(sys.argv) > 4 else 20261201)
    checked = skipped = unique_trees = no_parse = kbest_checked = 0
    failures = []
    for gi in range(count):
        nts, words, rules = random_grammar(rng)
        grammar = nltk_grammar(rules)
        probs = {prod: prod.prob() for prod in grammar.productions()}
        plain = {nltk.Production(prod.lhs(), prod.rhs()): prod.prob() for prod in grammar.productions()}
        sentences = []
        for _ in range(40):
            if len(sentences) >= 4:
                break
            try:
                s = sample(rules, rng)
            except RecursionError:
                continue
            if 1 <= len(s) <= 7:
                sentences.append(s)
        sentences.append([rng.choice(words) for _ in range(rng.randint(2, 5))])
        path = "%s/g%d.pcfg" % (workdir, gi)
        with open(path, "w") as f:
            f.write(treegate_grammar(rules))
        run = subprocess.run([treegate, "parse", "--grammar", path, "--format", "json", "--kbest", "8"],
                             input="\n".join(" ".join(s) for s in sentences) + "\n",
                             capture_output=True, text=True)
        if run.returncode != 0:
            failures.append("grammar %d: treegate exit %d: %s" % (gi, run.returncode, run.stderr))
            continue
        results = [json.loads(line) for line in run.stdout.splitlines()]
        for sentence, got in zip(sentences, results):
            where = "grammar %s sentence %r" % (path, " ".join(sentence))
            try:
                all_trees = list(islice(ChartParser(grammar).parse(sentence), MAX_TREES + 1))
            except ValueError:  # NLTK: "Grammar does not cover some of the input words"
                all_trees = []
            if len(all_trees) > MAX_TREES:
                skipped += 1
                continue
            checked += 1
            if not all_trees:
                no_parse += 1
                if got["status"] != "no_parse":
                    failures.append("%s: NLTK finds no tree, treegate says %s" % (where, got["status"]))
                continue
            if got["status"] != "parsed":
                failures.append("%s: NLTK finds %d trees, treegate says %s: %s" % (where, len(all_trees), got["status"], got["reason"]))
                continue
            tree_probs = sorted(((tree_prob(t, plain), flat(t)) for t in all_trees), reverse=True)
            if len({t for _, t in tree_probs}) != len(tree_probs):
                failures.append("%s: NLTK lists a tree twice" % where)
            best = list(ViterbiParser(grammar).parse(sentence))[0]
            want = math.log(best.prob())
            if abs(got["logprob"] - want) > 1e-9 * abs(want):
                failures.append("%s: Viterbi logprob %r, NLTK %r" % (where, got["logprob"], want))
            if len(tree_probs) == 1 or tree_probs[1][0] < tree_probs[0][0] * (1 - 1e-9):
                unique_trees += 1
                if got["tree"] != flat(best):
                    failures.append("%s: Viterbi tree %s, NLTK %s" % (where, got["tree"], flat(best)))
            inside = math.log(sum(p for p, _ in tree_probs))
            if abs(got["inside_logprob"] - inside) > 1e-9 * abs(inside):
                failures.append("%s: inside %r, NLTK sum over %d trees %r" % (where, got["inside_logprob"], len(all_trees), inside))
            if got["parses"] != len(all_trees) or not got["parses_exact"]:
                failures.append("%s: %r parses (exact %r), NLTK %d" % (where, got["parses"], got["parses_exact"], len(all_trees)))
            nltk_prob = {t: p for p, t in tree_probs}
            seen = set()
            last = 0.0
            for k in got["kbest"]:
                p = nltk_prob.get(k["tree"])
                ok = p is not None and k["tree"] not in seen and abs(k["logprob"] - math.log(p)) <= 1e-9 * abs(math.log(p)) and k["logprob"] <= last + 1e-12
                if not ok:
                    failures.append("%s: k-best tree %s logprob %r not in NLTK's list or out of order" % (where, k["tree"], k["logprob"]))
                    break
                seen.add(k["tree"])
                last = k["logprob"]
            kbest_checked += 1
            if got["kbest"] and abs(got["kbest"][0]["logprob"] - got["logprob"]) > 1e-9 * abs(got["logprob"]):
                failures.append("%s: first k-best tree is not the Viterbi tree" % where)
    print("grammars %d, sentences checked %d (no parse %d, unique best tree %d, k-best lists %d), skipped (over %d trees) %d"
          % (count, checked, no_parse, unique_trees, kbest_checked, MAX_TREES, skipped))
    for f in failures[:20]:
        print("FAIL:", f)
    if failures:
        print("%d failures" % len(failures))
        sys.exit(1)
    if checked < count:
        print("FAIL: too few sentences checked")
        sys.exit(1)


if __name__ == "__main__":
    main()
