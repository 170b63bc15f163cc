// Estimation: counts and relative frequencies on small treebanks, unknown-word classes, the
// header, the summary figures, and every bad-input message as an exact string.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "harness/pcfg/estimate_files.h"

namespace treegate::pcfg {
namespace {

Grammar estimate_text(const std::string& text, TransformSpec spec,
                      EstimateSummary* summary = nullptr) {
  Estimator estimator(std::move(spec));
  std::istringstream in(text);
  BracketReader reader(in, "t.trees");
  Tree tree;
  while (reader.next(tree)) REQUIRE(!estimator.add(tree));
  if (summary) *summary = estimator.summary();
  return estimator.grammar();
}

std::string rules_of(const Grammar& g) {
  std::string out;
  for (const Rule& r : g.rules) out += format_rule(r) + " " + format_weight(r.weight) + "\n";
  return out;
}

TEST_CASE("relative frequencies per left-hand side; start symbol first, then by name and count") {
  TransformSpec spec = identity_spec();
  const Grammar g = estimate_text(
      "(ROOT (S (NP (DT the) (NN dog)) (VP (VBZ barks))))\n"
      "(ROOT (S (NP (NN dog)) (VP (VBZ barks) (NP (DT the) (NN cat)))))\n",
      spec);
  CHECK(rules_of(g) ==
        "ROOT -> S 1\n"
        "DT -> \"the\" 1\n"
        "NN -> \"dog\" 0.6666666666666666\n"
        "NN -> \"cat\" 0.3333333333333333\n"
        "NP -> DT NN 0.6666666666666666\n"
        "NP -> NN 0.3333333333333333\n"
        "S -> NP VP 1\n"
        "VBZ -> \"barks\" 1\n"
        "VP -> VBZ 0.5\n"
        "VP -> VBZ NP 0.5\n");
  CHECK(g.header.start == "ROOT");
  CHECK(*g.rules[2].count == 2);
  CHECK(!g.header.unknown_signatures);
}

TEST_CASE("rare words also train unknown-word classes") {
  TransformSpec spec;
  spec.rare_words = 1;
  EstimateSummary s;
  const Grammar g = estimate_text(
      "(ROOT (S (NP (NNS Boats)) (VP (VBP float))))\n(ROOT (S (NP (NNS Boats)) (VP (VBP sink))))\n",
      spec, &s);
  CHECK(rules_of(g) ==
        "ROOT -> S 1\n"
        "NNS -> \"Boats\" 1\n"
        "NP -> NNS 1\n"
        "S -> NP VP 1\n"
        "VBP -> \"float\" 0.25\n"
        "VBP -> \"sink\" 0.25\n"
        "VBP -> <unk:lower> 0.5\n"
        "VP -> VBP 1\n");
  CHECK(g.header.unknown_signatures);
  CHECK(s.lexicon == 3);
  CHECK(s.rare_words == 2);
  CHECK(s.unknown_classes == 1);
  CHECK(s.unknown_rule_types == 1);
  CHECK(s.rule_types == 8);
  CHECK(s.rules_seen_once == 2);
}

TEST_CASE("the header records every transform and the treebank's wrapper style") {
  TransformSpec spec;
  spec.parent = 2;
  spec.horizontal = 1;
  spec.collapse_unary = true;
  spec.start = "TOP";
  const Grammar g = estimate_text("( (S (NN x) (NN y) (NN z)))\n( (S (NN x)))\n", spec);
  const TransformPairs expected{{"functions", "strip"}, {"empties", "drop"}, {"start", "TOP"},
                                {"wrapper", "empty"},   {"parent", "2"},     {"unary", "keep"},
                                {"horizontal", "1"},    {"rare-words", "0"}};
  CHECK(g.header.transforms[3] == expected[3]);
  CHECK(g.header.transforms[4] == expected[4]);
  CHECK(g.header.transforms[6] == expected[6]);
  CHECK(g.header.transforms[5].second == "collapse");
  CHECK(rules_of(g) ==
        "TOP -> S^TOP 1\n"
        "NN -> \"x\" 0.5\n"
        "NN -> \"y\" 0.25\n"
        "NN -> \"z\" 0.25\n"
        "S^TOP -> NN 0.5\n"
        "S^TOP -> NN S^TOP>NN 0.5\n"
        "S^TOP>NN -> NN NN 1\n");
  // The written grammar reads back with the same rules.
  const Grammar back = read_grammar_string(write_grammar(g), "back.pcfg");
  CHECK(rules_of(back) == rules_of(g));
  CHECK(back.header.transforms == g.header.transforms);
}

TEST_CASE("summary figures before and after transforms") {
  TransformSpec spec;
  spec.parent = 2;
  EstimateSummary s;
  estimate_text("(ROOT (S (NP-SBJ (DT the) (NN dog)) (VP (VBZ barks) (NP (-NONE- *)))))\n", spec,
                &s);
  CHECK(s.trees_read == 1);
  CHECK(s.words == 3);                // the empty element is gone
  CHECK(s.nonterminals_before == 5);  // ROOT S NP-SBJ VP NP
  CHECK(s.preterminals_before == 4);  // DT NN VBZ -NONE-
  CHECK(s.nonterminals_after == 4);   // ROOT S^ROOT NP^S VP^S
  CHECK(s.preterminals_after == 3);
}

struct TempFile {
  std::filesystem::path path;
  explicit TempFile(const std::string& text)
      : path(std::filesystem::temp_directory_path() / "treegate_estimate_test.trees") {
    std::ofstream(path, std::ios::binary) << text;
  }
  ~TempFile() { std::filesystem::remove(path); }
};

TEST_CASE("bad trees are reported with file:line:col and the other trees still count") {
  TempFile file(
      "(ROOT (S (NN a)))\n"
      "(ROOT\n  (S (NP (DT the)) ( (NN b))))\n"
      "(ROOT (S (NP (DT the) x (NN dog))))\n"
      "(ROOT dog)\n"
      "(ROOT (S (-NONE- *)))\n"
      "(ROOT (S (A^B (NN c))))\n"
      "(ROOT (S (NN d)))\n");
  Estimator estimator(TransformSpec{});
  std::vector<std::string> errors;
  add_treebank_file(estimator, file.path.string(), errors);
  const std::string f = file.path.string();
  REQUIRE(errors.size() == 5);
  CHECK(errors[0] == f + ":3:20: tree 2: constituent without a label: expected (LABEL child ...)");
  CHECK(errors[1] == f + ":4:23: tree 3: expected '(' or ')' inside '(NP' opened at 4:10 but "
                         "found word 'x' (a word must be the only child of its tag)");
  CHECK(errors[2] == f + ":5:7: tree 4: word 'dog' has no tag of its own: expected (TAG word)");
  CHECK(errors[3] ==
        f + ":6:1: tree 5: tree has no words once empty elements (-NONE-) are removed");
  CHECK(errors[4] == f + ":7:10: tree 6: label 'A^B' contains '^', which grammar transforms "
                         "reserve for their own labels");
  CHECK(estimator.summary().trees_used == 2);
  CHECK_THROWS_WITH(add_treebank_file(estimator, "/no/such.trees", errors),
                    "/no/such.trees: cannot open file for reading");
  CHECK_THROWS_WITH(expand_treebank_patterns({"/no/such/*.trees"}),
                    "/no/such/*.trees: no file matches this pattern");
}

}  // namespace
}  // namespace treegate::pcfg
