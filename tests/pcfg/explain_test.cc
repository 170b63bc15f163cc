// explain on the worked example of Manning & Schuetze, Foundations of Statistical Natural
// Language Processing (1999), ch. 11, "astronomers saw stars with ears". The grammar is recalled
// from the book (not copied from a file); the tree probabilities 0.0009072 (PP on the noun
// phrase, the Viterbi tree) and 0.0006804 (PP on the verb phrase) are re-derived by exact
// arithmetic in tests/pcfg/parser_test.cc.
#include "harness/pcfg/explain.h"

#include <doctest/doctest.h>

#include <cmath>

#include <sstream>
#include "evaluator/bracket_io.h"
#include "harness/pcfg/estimate.h"

namespace treegate::pcfg {
namespace {

std::string grammar_text(double vp_vp_pp) {
  // VP's two rules are renormalised: VP -> V NP takes what VP -> VP PP leaves.
  return "@start S\nS -> NP VP 1.0\nPP -> P NP 1.0\nVP -> V NP " + format_weight(1 - vp_vp_pp) +
         "\nVP -> VP PP " + format_weight(vp_vp_pp) +
         "\nP -> \"with\" 1.0\nV -> \"saw\" 1.0\nNP -> NP PP 0.4\nNP -> \"astronomers\" 0.1\n"
         "NP -> \"ears\" 0.18\nNP -> \"saw\" 0.04\nNP -> \"stars\" 0.18\nNP -> \"telescopes\" "
         "0.1\n";
}

std::shared_ptr<const CompiledGrammar> compile(const std::string& text) {
  return std::make_shared<const CompiledGrammar>(read_grammar_string(text, "ms.pcfg"));
}

const char* kVerbAttachment =
    "(S (NP astronomers) (VP (VP (V saw) (NP stars)) (PP (P with) (NP ears))))";

TEST_CASE("explain: gold = verb-phrase attachment in the Manning & Schuetze example") {
  const Tree gold = parse_tree(kVerbAttachment);
  const Explanation e = explain_tree(compile(grammar_text(0.3)), gold);
  REQUIRE(e.parse.status == ParseStatus::parsed);
  REQUIRE(e.gold_score.derivable);
  CHECK_FALSE(e.gold_is_best);
  // The gap is ln(0.0009072 / 0.0006804) = ln(4/3).
  CHECK(e.gap == doctest::Approx(std::log(0.0009072 / 0.0006804)).epsilon(1e-12));
  // Rules only gold uses: VP -> VP PP (its parts V NP, PP -> P NP ... are used by both trees
  // once each); only the best tree uses NP -> NP PP.
  REQUIRE(e.differences.size() == 2);
  const RuleDifference& gold_only = e.differences[0];  // gold pays ln 0.3: the larger share
  CHECK(gold_only.rule == "VP -> VP PP");
  CHECK(gold_only.gold_uses == 1);
  CHECK(gold_only.best_uses == 0);
  CHECK(gold_only.gap_share == doctest::Approx(-std::log(0.3)));
  CHECK(e.differences[1].rule == "NP -> NP PP");
  CHECK(e.differences[1].gap_share == doctest::Approx(std::log(0.4)));
  CHECK_FALSE(e.differences[1].needed.has_value());
  REQUIRE(gold_only.needed.has_value());
  // All else fixed, 0.3 * 4/3 = 0.4 makes the two trees equally likely.
  CHECK(*gold_only.needed == doctest::Approx(0.4).epsilon(1e-12));
  CHECK(e.gold_rank == 2);
  const std::string text = explanation_text(e);
  CHECK(text.find("gap: log P(best) - log P(gold) = 0.287682 nats") != std::string::npos);
  CHECK(text.find("gold is number 2 among the 2 best trees") != std::string::npos);
}

TEST_CASE("explain: the needed probability plus a small epsilon makes gold win on re-parsing") {
  const Tree gold = parse_tree(kVerbAttachment);
  const Explanation before = explain_tree(compile(grammar_text(0.3)), gold);
  REQUIRE(before.differences.size() == 2);
  REQUIRE(before.differences[0].needed.has_value());
  const double needed = *before.differences[0].needed;
  // VP -> V NP is used once by both trees, so renormalising it changes both equally.
  const Explanation after = explain_tree(compile(grammar_text(needed + 1e-6)), gold);
  REQUIRE(after.parse.status == ParseStatus::parsed);
  CHECK(to_bracketed(after.parse.tree) == to_bracketed(gold));
  CHECK(after.gold_is_best);
  // Just below the needed probability the noun-phrase attachment still wins.
  const Explanation below = explain_tree(compile(grammar_text(needed - 1e-6)), gold);
  CHECK_FALSE(below.gold_is_best);
}

TEST_CASE("explain: a gold tree the grammar cannot derive lists the missing rules and where") {
  const Tree gold = parse_tree("(S (NP astronomers) (VP (V saw) (NP (DT the) (NP stars))))");
  const Explanation e = explain_tree(compile(grammar_text(0.3)), gold);
  CHECK_FALSE(e.gold_score.derivable);
  REQUIRE(e.gold_score.missing.size() == 2);
  CHECK(e.gold_score.missing[0].rule == "NP -> DT NP");
  const std::string text = explanation_text(e);
  CHECK(text.find("NP -> DT NP   at words 3-4") != std::string::npos);
  CHECK(text.find("DT -> \"the\"   at words 3-3") != std::string::npos);
}

TEST_CASE("explain: the drawing marks the brackets the other tree lacks") {
  const Explanation e = explain_tree(compile(grammar_text(0.3)), parse_tree(kVerbAttachment));
  const std::string text = explanation_text(e);
  // Best tree: NP over "stars with ears" is not in gold; gold: VP over "saw stars" is not in best.
  CHECK(text.find("*     NP                       stars with ears") != std::string::npos);
  CHECK(text.find("*     VP                       saw stars\n") != std::string::npos);
}

}  // namespace
}  // namespace treegate::pcfg

namespace treegate::pcfg {
namespace {

// A grammar estimated with transforms (parent annotation, binarization, root wrapper): explain
// transforms gold forward as the estimator did. Invariants, not data: a training tree is
// derivable, and no derivation beats the Viterbi tree. (The treebank is test data of our own.)
TEST_CASE("explain: a grammar with @transform lines (parent annotation, binarization)") {
  const std::string treebank =
      "(ROOT (S (NP (DT the) (NN crew)) (VP (VBD lifted) (NP (DT the) (NN crate)) (PP (IN with) "
      "(NP (DT the) (NN hook)))) (. .)))\n"
      "(ROOT (S (NP (DT the) (NN crew)) (VP (VBD saw) (NP (NP (DT the) (NN crate)) (PP (IN with) "
      "(NP (DT the) (NN label))))) (. .)))\n"
      "(ROOT (S (NP (DT the) (JJ old) (NN crew)) (VP (VBD slept)) (. .)))\n";
  TransformSpec spec;
  spec.parent = 2;
  spec.horizontal = 1;
  Estimator estimator(spec);
  std::istringstream in(treebank);
  BracketReader reader(in, "t.trees");
  std::vector<Tree> trees;
  for (Tree t; reader.next(t);) {
    REQUIRE_FALSE(estimator.add(t));
    trees.push_back(t);
  }
  const auto grammar = std::make_shared<const CompiledGrammar>(
      read_grammar_string(write_grammar(estimator.grammar()), "est.pcfg"));
  REQUIRE_FALSE(grammar->header().transforms.empty());
  for (const Tree& gold : trees) {
    CAPTURE(to_bracketed(gold));
    const Explanation e = explain_tree(grammar, gold);
    REQUIRE(e.parse.status == ParseStatus::parsed);
    CHECK(e.gold_score.derivable);
    CHECK(e.gold_score.logprob <= e.parse.logprob + 1e-9);
    if (e.gold_is_best) {
      CHECK(e.gap == doctest::Approx(0).epsilon(1e-12));
      CHECK(e.differences.empty());
    } else {
      CHECK(e.gap >= 0);  // 0: a tie (here, the PP on the verb or on its object)
      // The rule differences account for the whole gap.
      double shares = 0;
      for (const RuleDifference& d : e.differences) shares += d.gap_share;
      CHECK(shares == doctest::Approx(e.gap).epsilon(1e-9));
    }
    // Rules are named in the grammar's labels (parent-annotated), trees shown in the original.
    bool annotated = false;
    for (const RuleUse& u : e.gold_score.used) annotated |= u.rule.find('^') != std::string::npos;
    CHECK(annotated);
    CHECK(to_bracketed(e.gold) == to_bracketed(gold));
  }
  // The third tree has no rival: its rules derive nothing else over its words.
  CHECK(explain_tree(grammar, trees[2]).gold_is_best);
}

}  // namespace
}  // namespace treegate::pcfg
