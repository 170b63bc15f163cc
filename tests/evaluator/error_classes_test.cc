// Error classes on hand-built gold/test pairs, one per class. Each case says which class it
// should land in and why. The idea of sorting parser errors into types follows Kummerfeld, Hall,
// Curran & Klein, "Parser showdown at the Wall Street Corral: an empirical investigation of error
// types in parser output" (EMNLP 2012); the operational definitions tested here are ours
// (docs/compare.md, "Error classes").
#include "evaluator/error_classes.h"

#include <doctest/doctest.h>

#include <algorithm>
#include <sstream>
#include <string>

#include "evaluator/bracket_io.h"

namespace treegate {
namespace {

struct Expected {
  std::string name;
  std::size_t brackets;
};

// Classifies the pair and checks the errors (class name + number of wrong brackets, in order
// of class name) and that every wrong bracket is accounted for exactly once.
std::vector<Expected> classify(const std::string& gold_text, const std::string& test_text) {
  LabelTable labels;
  Scorer scorer(Scheme{}, labels);
  const Tree gold = parse_tree(gold_text, "gold", labels);
  const Tree test = parse_tree(test_text, "test", labels);
  ErrorClassifier classifier(scorer);
  const SentenceErrors errors = classifier.classify(gold, test);
  const SentenceScore score = scorer.score(gold, test);
  REQUIRE(errors.classified);
  std::size_t accounted = 0;
  std::vector<Expected> out;
  for (const ClassifiedError& e : errors.errors) {
    out.push_back({error_class_name(e, labels), e.brackets.size()});
    accounted += e.brackets.size();
  }
  CHECK(accounted == (score.gold_brackets - score.matched) + (score.test_brackets - score.matched));
  std::sort(out.begin(), out.end(), [](auto& a, auto& b) { return a.name < b.name; });
  return out;
}

void check_one(const std::vector<Expected>& got, const std::string& name, std::size_t brackets) {
  REQUIRE(got.size() == 1);
  CHECK(got[0].name == name);
  CHECK(got[0].brackets == brackets);
}

TEST_CASE("PP attached to the verb phrase instead of the noun phrase: PP attachment") {
  // Gold: the hook belongs to the crane (NP attachment). Test: the PP hangs from the VP. The PP
  // bracket (4-7) is right in both trees, but its parent is NP 2-7 in gold and VP 1-7 in test:
  // one PP attachment error, which accounts for the one wrong bracket (gold's NP 2-7).
  const auto got = classify(
      "(S (NP (PRP She)) (VP (VBD saw) (NP (NP (DT the) (NN crane)) (PP (IN with) (NP (DT a) "
      "(NN hook))))))",
      "(S (NP (PRP She)) (VP (VBD saw) (NP (DT the) (NN crane)) (PP (IN with) (NP (DT a) (NN "
      "hook)))))");
  check_one(got, "PP attachment", 1);
}

TEST_CASE("PP attached to the noun phrase instead of the verb phrase: PP attachment") {
  // The reverse: gold attaches the PP to the VP; test builds an extra NP 2-7 around it.
  const auto got = classify(
      "(S (NP (PRP She)) (VP (VBD cut) (NP (DT the) (NN rope)) (PP (IN with) (NP (DT a) (NN "
      "knife)))))",
      "(S (NP (PRP She)) (VP (VBD cut) (NP (NP (DT the) (NN rope)) (PP (IN with) (NP (DT a) "
      "(NN knife))))))");
  check_one(got, "PP attachment", 1);
}

TEST_CASE("PP moved past the verb phrase: one attachment error takes the resized VP too") {
  // Test attaches the PP to S, so gold's NP 2-7 and VP 1-7 are missing and test has VP 1-4,
  // which differs from gold's VP 1-7 only by the PP's words: all three go with the PP error.
  const auto got = classify(
      "(S (NP (PRP She)) (VP (VBD saw) (NP (NP (DT the) (NN crane)) (PP (IN with) (NP (DT a) "
      "(NN hook))))))",
      "(S (NP (PRP She)) (VP (VBD saw) (NP (DT the) (NN crane))) (PP (IN with) (NP (DT a) (NN "
      "hook))))");
  check_one(got, "PP attachment", 3);
}

TEST_CASE("relative clause attached to the wrong noun: clause attachment") {
  // Gold: the clause modifies "the crate"; test: it modifies "the crane ... crate" (the whole NP).
  const auto got = classify(
      "(S (NP (NP (DT the) (NN crane)) (PP (IN near) (NP (NP (DT the) (NN crate)) (SBAR (WHNP "
      "(WDT that)) (S (VP (VBD fell))))))) (VP (VBD stopped)))",
      "(S (NP (NP (NP (DT the) (NN crane)) (PP (IN near) (NP (DT the) (NN crate)))) (SBAR (WHNP "
      "(WDT that)) (S (VP (VBD fell))))) (VP (VBD stopped)))");
  // SBAR 5-7 is right in both; its parent is NP 3-7 in gold and NP 0-7 in test. Gold's NP 3-7
  // and PP 2-7 lie on its path up to the first right bracket (NP 0-7); test's PP 2-5 and NP 0-5
  // become gold's PP 2-7 and NP 0-7 when the clause's words are added: one error, 4 brackets.
  check_one(got, "clause attachment", 4);
}

TEST_CASE("coordination with the wrong scope: coordination") {
  // "old men and women": gold coordinates [old men] and [women]; test puts "old" outside and
  // coordinates [men] and [women]. Test's NP 1-4 has the conjunction child and is wrong, so it
  // is a coordination error; with it go its wrong conjunct NP 1-2 and gold's NP 0-2, which
  // crosses it.
  const auto got =
      classify("(S (NP (NP (JJ old) (NNS men)) (CC and) (NP (NNS women))) (VP (VBD waited)))",
               "(S (NP (JJ old) (NP (NP (NNS men)) (CC and) (NP (NNS women)))) (VP (VBD waited)))");
  check_one(got, "coordination", 3);
}

TEST_CASE("noun compound bracketed wrongly: NP-internal") {
  // Gold groups (cargo crane) cable; test groups cargo (crane cable). Both wrong brackets lie
  // strictly inside gold's base NP 0-4 (an NP with no NP below it): one NP-internal error.
  const auto got =
      classify("(S (NP (DT the) (NML (NN cargo) (NN crane)) (NN cable)) (VP (VBD snapped)))",
               "(S (NP (DT the) (NN cargo) (NML (NN crane) (NN cable))) (VP (VBD snapped)))");
  check_one(got, "NP-internal", 2);
}

TEST_CASE("right span, wrong label: label") {
  // "before the ship docked" is an SBAR in gold and a PP in test, over the same words.
  const auto got = classify(
      "(S (NP (NNS bells)) (VP (VBD rang) (SBAR (IN before) (S (NP (DT the) (NN ship)) (VP (VBD "
      "docked))))))",
      "(S (NP (NNS bells)) (VP (VBD rang) (PP (IN before) (S (NP (DT the) (NN ship)) (VP (VBD "
      "docked))))))");
  check_one(got, "label", 2);
}

TEST_CASE("dropped unary: unary") {
  // Gold has NP over the single word "cranes"; test leaves the tag directly under S.
  check_one(classify("(S (NP (NNS cranes)) (VP (VBP rust)))", "(S (NNS cranes) (VP (VBP rust)))"),
            "unary", 1);
}

TEST_CASE("extra unary over a right multi-word span: unary") {
  // Test adds an S over the verb phrase 1-3, a span gold has (as VP).
  check_one(classify("(S (NP (NNS cranes)) (VP (VBP lift) (NP (NNS crates))))",
                     "(S (NP (NNS cranes)) (S (VP (VBP lift) (NP (NNS crates)))))"),
            "unary", 1);
}

TEST_CASE("a wrong bracket that fits no class: other") {
  // Test groups "very fast" as a phrase: no right bracket moved, no conjunction, not inside a
  // base NP, no gold bracket over those words, more than one word.
  check_one(classify("(S (NP (PRP it)) (VP (VBD went) (RB very) (RB fast)))",
                     "(S (NP (PRP it)) (VP (VBD went) (X (RB very) (RB fast))))"),
            "other", 1);
}

TEST_CASE("identical trees have no errors; no parse is not classified") {
  const std::string t = "(S (NP (NNS cranes)) (VP (VBP rust)))";
  CHECK(classify(t, t).empty());
  LabelTable labels;
  Scorer scorer(Scheme{}, labels);
  ErrorClassifier classifier(scorer);
  CHECK_FALSE(classifier.classify(parse_tree(t, "g", labels), Tree(labels)).classified);
}

// 20,000 and not a million levels: Scorer::score's crossing count compares every test bracket
// with every gold bracket, which is quadratic in the bracket count.
TEST_CASE("a unary chain 20,000 levels deep is classified without deep recursion") {
  std::string gold, test;
  for (int i = 0; i < 20000; ++i) gold += "(A ";
  gold += "(NN x)";
  test = gold;
  for (int i = 0; i < 20000; ++i) gold += ")";
  test += ")";
  for (int i = 1; i < 20000; ++i) test += ")";
  LabelTable labels;
  Scorer scorer(Scheme{}, labels);
  ErrorClassifier classifier(scorer);
  ReadLimits limits;
  limits.max_depth = 2000000;
  std::istringstream gs(gold), ts(test);
  BracketReader gr(gs, "gold", labels, limits), tr(ts, "test", labels, limits);
  Tree g(labels), t(labels);
  REQUIRE(gr.next(g));
  REQUIRE(tr.next(t));
  // Identical trees: nothing wrong, and the call returns (strict parents are precomputed).
  const SentenceErrors errors = classifier.classify(g, t);
  CHECK(errors.classified);
  CHECK(errors.errors.empty());
}

TEST_CASE("tally counts errors and brackets per class") {
  LabelTable labels;
  Scorer scorer(Scheme{}, labels);
  ErrorClassifier classifier(scorer);
  ErrorTally tally;
  const Tree g = parse_tree("(S (NP (NNS cranes)) (VP (VBP rust)))", "g", labels);
  const Tree t = parse_tree("(S (NNS cranes) (VP (VBP rust)))", "t", labels);
  tally.add(classifier.classify(g, t), labels);
  tally.add(classifier.classify(g, t), labels);
  REQUIRE(tally.by_class().count("unary") == 1);
  CHECK(tally.by_class().at("unary").errors == 2);
  CHECK(tally.by_class().at("unary").brackets == 2);
  CHECK(tally.sentences() == 2);
}

}  // namespace
}  // namespace treegate
