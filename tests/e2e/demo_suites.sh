#!/usr/bin/env bash
# Checks the demo data (suites/demo) with tools the project did not write: python3-nltk reads
# every gold tree (balanced brackets, one tree per case), PyYAML reads every suite. Checks:
# yield == text, unique ids, require brackets present in gold and forbid brackets absent,
# only the usual treebank labels (also in treebank/*.trees), >= 80 cases, several checks, >= 1 known_failure; and that
# each hand-written demo grammar lists every suite word and has rule weights summing to 1 per left side.
set -euo pipefail
SOURCE_DIR=${SOURCE_DIR:-$(cd "$(dirname "$0")/../.." && pwd)}
exec /usr/bin/python3 - "$SOURCE_DIR/suites/demo" <<'PY'
import glob, os, re, sys
from collections import defaultdict
import yaml
from nltk import Tree

demo = sys.argv[1]
phrase = {"ROOT", "S", "SBAR", "SBARQ", "SQ", "NP", "VP", "PP", "ADJP", "ADVP", "QP", "PRT",
          "WHNP", "WHADVP", "WHPP"}
tags = {"DT", "NN", "NNS", "NNP", "NNPS", "VB", "VBD", "VBZ", "VBP", "VBG", "VBN", "IN", "TO",
        "CC", "JJ", "JJR", "JJS", "RB", "RP", "PRP", "PRP$", "MD", "CD", "WDT", "WP", "WP$",
        "WRB", "POS", "EX", ".", ",", ":"}
errors = []
words = set()

def spans(tree):
    """(label, from, to) of every phrase node, 1-based inclusive over the full yield."""
    out, stack = set(), [(tree, 0)]
    while stack:
        node, start = stack.pop()
        n = len(node.leaves())
        if isinstance(node[0], Tree):
            out.add((re.split(r"[-=]", node.label())[0] or node.label(), start + 1, start + n))
            pos = start
            for child in node:
                stack.append((child, pos))
                pos += len(child.leaves()) if isinstance(child, Tree) else 1
    return out

def check_tree(where, text, in_suite=True):
    try:
        tree = Tree.fromstring(text)
    except ValueError as e:
        errors.append(f"{where}: not one balanced tree: {e}")
        return None
    if tree.label() != "ROOT" or len(tree) != 1:
        errors.append(f"{where}: expected (ROOT (X ...)) with one child")
    for sub in tree.subtrees():
        label = sub.label()
        if isinstance(sub[0], Tree):
            if label not in phrase:
                errors.append(f"{where}: unexpected phrase label {label}")
            if any(not isinstance(c, Tree) for c in sub):
                errors.append(f"{where}: {label} mixes words and phrases")
        else:
            if label not in tags or len(sub) != 1:
                errors.append(f"{where}: bad preterminal ({label} {' '.join(sub)})")
    if in_suite:
        words.update(tree.leaves())
    return tree

cases = known = checks = 0
for path in sorted(glob.glob(os.path.join(demo, "*.yaml"))):
    if path.endswith("treegate.yaml"):
        continue
    doc = yaml.safe_load(open(path, encoding="utf-8"))
    name = os.path.basename(path)
    ids = set()
    for i, case in enumerate(doc.get("cases") or []):
        where = f"{name}#{case.get('id')}"
        cases += 1
        if case["id"] in ids:
            errors.append(f"{where}: duplicate id")
        ids.add(case["id"])
        tree = check_tree(where, case["tree"])
        if tree is None:
            continue
        if "text" in case and case["text"].split() != tree.leaves():
            errors.append(f"{where}: text {case['text']!r} != yield {' '.join(tree.leaves())!r}")
        have = spans(tree)
        for item in case.get("require", []):
            label, a, b = re.fullmatch(r"(\S+) (\d+)-(\d+)", item).groups()
            checks += 1
            if (label, int(a), int(b)) not in have:
                errors.append(f"{where}: required {item} is not in the gold tree")
        for item in case.get("forbid", []):
            label, a, b = re.fullmatch(r"(\S+) (\d+)-(\d+)", item).groups()
            checks += 1
            if (label, int(a), int(b)) in have:
                errors.append(f"{where}: forbidden {item} is in the gold tree")
        known += "known_failure" in case
    for source in doc.get("treebank") or []:
        for file in sorted(glob.glob(os.path.join(demo, source["files"]))):
            for n, line in enumerate(open(file, encoding="utf-8"), 1):
                if line.strip():
                    cases += 1
                    check_tree(f"{os.path.basename(file)}:{n}", line)

for path in sorted(glob.glob(os.path.join(demo, "treebank", "*.trees"))):
    for n, line in enumerate(open(path, encoding="utf-8"), 1):
        if line.strip():
            check_tree(f"treebank/{os.path.basename(path)}:{n}", line, False)

if cases < 80:
    errors.append(f"only {cases} demo cases (want >= 80)")
if known < 1 or checks < 10:
    errors.append(f"{known} known_failure cases and {checks} bracket checks (want >= 1 and >= 10)")

# The grammars: an independent reading of the .pcfg lines (formats.md), not treegate's reader.
rule_re = re.compile(r'^(\S+)\s*->\s*(.+?)\s+([0-9.eE+-]+)(\s+count=\d+)?$')
for path in sorted(glob.glob(os.path.join(demo, "*.pcfg"))):
    name = os.path.basename(path)
    totals, lexicon = defaultdict(float), set()
    for n, line in enumerate(open(path, encoding="utf-8"), 1):
        line = line.split("#", 1)[0].strip() if '"#' not in line else line.strip()
        if not line or line.startswith("@"):
            continue
        m = rule_re.match(line)
        if not m:
            errors.append(f"{name}:{n}: not a rule line: {line}")
            continue
        totals[m.group(1)] += float(m.group(3))
        lexicon.update(re.findall(r'"((?:[^"\\]|\\.)*)"', m.group(2)))
    for lhs, total in totals.items():
        if abs(total - 1) > 1e-6:
            errors.append(f"{name}: weights of {lhs} sum to {total:.6f}, not 1")
    if "estimated" not in name:
        missing = sorted(words - lexicon)
        if missing:
            errors.append(f"{name}: no lexical rule for {', '.join(missing)}")

for e in errors:
    print("FAIL", e)
print(f"demo data: {cases} cases, {checks} bracket checks, {known} known failures, "
      f"{len(words)} distinct words, {len(errors)} problems")
sys.exit(1 if errors else 0)
PY
