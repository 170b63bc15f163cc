#!/usr/bin/env bash
# Escaping everywhere: case ids, words, labels and tags holding <, &, ", ]]>, control
# characters, non-ASCII and bytes that are not UTF-8 go into the JUnit XML (valid against the
# published schema ${TREEGATE_SHARED:-../shared}/reference/junit/junit-10.xsd, and readable by
# python3-junitparser), the HTML report (shown as text, never as markup) and the JSON files
# (strict UTF-8 JSON; bytes that are not UTF-8 become U+FFFD).
source "$(dirname "$0")/lib/hostile.sh"
demo="${SOURCE_DIR:-$e2e_dir/../..}/suites/demo"
shared=${TREEGATE_SHARED:-${SOURCE_DIR:-$e2e_dir/../..}/../shared}
xsd="$shared/reference/junit/junit-10.xsd"
cp "$demo/v1.pcfg" g.pcfg
cat >hostile.yaml <<'YAML'
suite: hostile
about: "text <b>&amp; \"q\" ]]> \u0001"
cases:
  - id: "lt<amp&q\"cdata]]>ctl\u0001\u001b[31m é"
    tree: "(ROOT (S (NP (DT The) (NN cr<ane&)) (VP (VBD li]]>fted) (NP (DT \"the\") (NN cr\u0001ate\u007f))) (. .)))"
    constructions: ["<script>alert(1)</script>", "ü&"]
  - id: plain
    tree: "(ROOT (S (NP (DT The) (NN crew)) (VP (VBD saw)) (. .)))"
    known_failure: "fails <because> & \"why\" ]]>"
YAML
printf '(ROOT (S (NP (DT Th\xffe) (NN a\x01b<]]>)) (VP (VBD s\xc3\xa9w)) (. .)))\n' >bytes.trees
printf 'suite: bytes\ntreebank:\n  - files: bytes.trees\n' >bytes.yaml
rc=0
"$TREEGATE" run --grammar g.pcfg --suite hostile.yaml --suite bytes.yaml --results r.jsonl \
  --junit j.xml --summary-json s.json --no-timings >run.out 2>run.err || rc=$?
[ "$rc" -le 1 ] || fail "run: exit $rc: $(head -c 300 run.err)"
rc=0
"$TREEGATE" report r.jsonl --html h.html --no-timings >/dev/null 2>report.err || rc=$?
[ "$rc" -le 1 ] || fail "report --html: exit $rc: $(head -c 300 report.err)"

if [ -f "$xsd" ]; then
  xmllint --noout --schema "$xsd" j.xml 2>xmllint.err || fail "JUnit: $(head -3 xmllint.err)"
  echo "ok: JUnit XML valid against junit-10.xsd"
elif [ -n "${CI:-}" ]; then
  fail "JUnit schema missing: $xsd"
else
  echo "not run: JUnit schema check ($xsd missing; set TREEGATE_SHARED)"
fi
/usr/bin/python3 - <<'PY' || fail "JSON or JUnit content"
import json
from junitparser import JUnitXml
rows = [json.loads(l) for l in open("r.jsonl", "rb").read().decode("utf-8").splitlines()]
summary = json.loads(open("s.json", "rb").read().decode("utf-8"))
words = {c["id"]: c["words"] for c in rows[1:]}
assert words["bytes:1"] == ["Th\ufffde", "a\x01b<]]>", "s\u00e9w", "."], words["bytes:1"]
hostile_id = "lt<amp&q\"cdata]]>ctl\x01\x1b[31m \u00e9"
assert words[hostile_id][1:4] == ["cr<ane&", "li]]>fted", "\"the\""], words[hostile_id]
# JUnit: the same case count as the summary; ids are there with the characters XML 1.0
# forbids (U+0001, U+001B) removed and everything else kept.
xml = JUnitXml.fromfile("j.xml")
names = [c.name for s in xml for c in s]
assert any(n.startswith("lt<amp&q\"cdata]]>ctl[31m \u00e9") for n in names), names
cases = sum(1 for s in xml for c in s if s.name in ("hostile", "bytes"))
assert cases == summary["cases"] == 3, (cases, summary["cases"])
PY
echo "ok: JSON strict UTF-8 (U+FFFD for bad bytes), JUnit names and counts"
# HTML: hostile text appears escaped, never as markup.
grep -aq 'alert(1)</script>' h.html && fail "HTML: a construction tag became a script element"
grep -aq '&lt;script&gt;alert(1)&lt;/script&gt;' h.html || fail "HTML: escaped tag text missing"
grep -aq 'cr&lt;ane&amp;' h.html || fail "HTML: escaped word missing"
grep -aq '<ane&' h.html && fail "HTML: raw word text with < and &"
iconv -f UTF-8 -t UTF-8 h.html >/dev/null 2>&1 || fail "HTML: not valid UTF-8"
echo "ok: HTML shows hostile text as text"
finish
