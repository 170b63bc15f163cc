"""Cross-checks the HTML report's tree marks against brackets computed by python3-nltk.

For every scored case of a results file, nltk reads the gold and predicted trees; the brackets
are formed by the scoring scheme's default rules (root wrapper and preterminals are not
brackets; positions whose gold tag is punctuation are ignored; function tags stripped; ADVP and
PRT one label; multisets). The number of nodes the report marks "missing" in the gold panel and
"wrong" in the predicted panel must equal the multiset differences. Prints one line per
failure and a closing "N passed, N failed" line; exits 1 on any failure.

usage: /usr/bin/python3 html_marks.py REPORT.html RESULTS.jsonl
"""
import collections
import html.parser
import json
import sys

from nltk import Tree

IGNORED = {",", ":", "``", "''", "."}
ROOTS = {"", "TOP", "ROOT"}


def canonical(label):
    if label and label[0] != "-":
        for i, ch in enumerate(label):
            if i > 0 and ch in "-=":
                label = label[:i]
                break
    return "ADVP" if label == "PRT" else label


def brackets(tree, gold_tags):
    """Multiset of (label, start, end) over scored positions; positions from gold's tags."""
    position, nxt = [], 0
    for tag in gold_tags:
        position.append(None if tag in IGNORED else nxt)
        nxt += tag not in IGNORED
    out = collections.Counter()
    # Walk with explicit spans: treepositions in pre-order, leaves numbered left to right.
    leaves = {p: i for i, p in enumerate(tree.treepositions("leaves"))}
    for pos in tree.treepositions():
        node = tree[pos]
        if not isinstance(node, Tree) or node.height() == 2:
            continue
        if pos == () and node.label() in ROOTS:
            continue
        kept = [position[leaves[pos + lp]] for lp in node.treepositions("leaves")]
        kept = [k for k in kept if k is not None]
        if kept:
            out[(canonical(node.label()), min(kept), max(kept) + 1)] += 1
    return out


class Marks(html.parser.HTMLParser):
    """Per case (suite, id): per panel title, the number of m-missing and m-wrong nodes."""

    def __init__(self):
        super().__init__()
        self.cases, self.case, self.panel, self.in_caption = {}, None, None, False

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        cls = (a.get("class") or "").split()
        if tag == "details" and "case" in cls:
            self.case = self.cases.setdefault((a["data-suite"], a["data-id"]), {})
        elif tag == "figure" and "panel" in cls and self.case is not None:
            self.panel = None
            self.in_caption = False
        elif tag == "figcaption" and self.case is not None:
            self.in_caption = True
        elif tag == "g" and "node" in cls and self.panel is not None:
            self.panel["missing"] += "m-missing" in cls
            self.panel["wrong"] += "m-wrong" in cls

    def handle_endtag(self, tag):
        if tag == "figcaption":
            self.in_caption = False

    def handle_data(self, data):
        if self.in_caption and self.panel is None and data.strip():
            self.panel = self.case.setdefault(data.strip(), {"missing": 0, "wrong": 0})


def main():
    report, results = sys.argv[1], sys.argv[2]
    parser = Marks()
    with open(report, encoding="utf-8") as f:
        parser.feed(f.read())
    passed = failed = 0
    with open(results, encoding="utf-8") as f:
        lines = [json.loads(l) for l in f if l.strip()][1:]
    for c in lines:
        if c["score"] != "scored":
            continue
        gold, test = Tree.fromstring(c["gold"]), Tree.fromstring(c["predicted"])
        tags = [t for _, t in gold.pos()]
        g, t = brackets(gold, tags), brackets(test, tags)
        missing, wrong = sum((g - t).values()), sum((t - g).values())
        panels = parser.cases.get((c["suite"], c["id"]), {})
        new = panels.get("predicted") or panels.get("this run") or panels.get("new") or {}
        got = (panels.get("gold", {}).get("missing"), new.get("wrong"))
        if got == (missing, wrong):
            passed += 1
        else:
            failed += 1
            print(f"FAIL {c['suite']}#{c['id']}: nltk missing {missing}, wrong {wrong}; "
                  f"report {got}")
    print(f"html marks against nltk: {passed} passed, {failed} failed")
    return 1 if failed or passed == 0 else 0


if __name__ == "__main__":
    sys.exit(main())
