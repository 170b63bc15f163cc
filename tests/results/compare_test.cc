// compare_runs on two small hand-built runs: every transition, figures recomputed by hand from
// PARSEVAL's definitions (Black et al. 1991: labeled precision = matched / test brackets,
// recall = matched / gold brackets), error classes on both sides, significance, JSON shape.
#include "harness/results/compare.h"

#include <doctest/doctest.h>

#include <nlohmann/json.hpp>

namespace treegate::results {
namespace {

// "She saw the crane with a hook": gold attaches the PP to the noun (NP 3-7).
const char* kGold =
    "(S (NP (PRP She)) (VP (VBD saw) (NP (NP (DT the) (NN crane)) (PP (IN with) (NP (DT a) (NN "
    "hook))))))";
// The PP on the verb phrase: 6 of gold's 7 brackets, 6 test brackets.
const char* kVerbPp =
    "(S (NP (PRP She)) (VP (VBD saw) (NP (DT the) (NN crane)) (PP (IN with) (NP (DT a) (NN "
    "hook)))))";
// A relabelled PP (as an ADJP): 6 of 7 matched, 7 test brackets.
const char* kRelabel =
    "(S (NP (PRP She)) (VP (VBD saw) (NP (NP (DT the) (NN crane)) (ADJP (IN with) (NP (DT a) "
    "(NN hook))))))";
// Gold without the NP over "She": 6 of 7 matched, 6 test brackets (the same F1 as kVerbPp).
const char* kNoSubject =
    "(S (PRP She) (VP (VBD saw) (NP (NP (DT the) (NN crane)) (PP (IN with) (NP (DT a) (NN "
    "hook))))))";

CaseRecord record(const std::string& id, const std::string& predicted, Outcome outcome,
                  double seconds, std::vector<std::string> tags = {"pp"}) {
  CaseRecord c;
  c.suite = "attach";
  c.id = id;
  c.constructions = std::move(tags);
  c.gold = kGold;
  c.predicted = predicted;
  c.outcome = outcome;
  c.seconds = seconds;
  return c;
}

RunResults run_of(std::vector<CaseRecord> cases) {
  RunResults r;
  r.header.suites.push_back({"attach", "attach.yaml", "0", cases.size()});
  r.cases = std::move(cases);
  return r;
}

TEST_CASE("transitions, figures and error classes of two hand-built runs") {
  const RunResults old_run = run_of({
      record("fixed", kVerbPp, Outcome::kFail, 0.010),
      record("broken", kGold, Outcome::kPass, 0.010),
      record("worse", kVerbPp, Outcome::kFail, 0.010),
      record("same-f1", kVerbPp, Outcome::kFail, 0.010),
      record("unchanged", kGold, Outcome::kPass, 0.010),
      record("gone", kGold, Outcome::kPass, 0.010),
  });
  const RunResults new_run = run_of({
      record("fixed", kGold, Outcome::kPass, 0.020),
      record("broken", kVerbPp, Outcome::kFail, 0.020),
      record("worse", kRelabel, Outcome::kFail, 0.020),
      record("same-f1", kNoSubject, Outcome::kFail, 0.020),
      record("unchanged", kGold, Outcome::kPass, 0.020),
      record("added", kGold, Outcome::kPass, 0.020),
  });
  CompareOptions options;
  options.significance.iterations = 2000;
  const Comparison c = compare_runs(old_run, "old.jsonl", new_run, "new.jsonl", options);
  CHECK(c.paired == 5);
  CHECK(c.only_old_ids == std::vector<std::string>{"attach#gone"});
  CHECK(c.only_new_ids == std::vector<std::string>{"attach#added"});
  auto count = [&](Transition t) { return c.transition_counts[static_cast<int>(t)]; };
  CHECK(count(Transition::kFixed) == 1);
  CHECK(count(Transition::kBroken) == 1);
  CHECK(count(Transition::kWorse) == 1);
  CHECK(count(Transition::kBetter) == 0);
  CHECK(count(Transition::kChangedSameF1) == 1);  // 6 of 6 test brackets on both sides
  CHECK(count(Transition::kUnchanged) == 1);
  // "worse": old 6 matched of 6 test; new 6 matched of 7 test; gold 7: F1 falls, both fail.
  CHECK(c.cases[2].transition == Transition::kWorse);
  // By hand: OLD matched 6+7+6+6+7 = 32, test 6+7+6+6+7 = 32, gold 35.
  CHECK(c.overall.old_side.matched == 32);
  CHECK(c.overall.old_side.test == 32);
  CHECK(c.overall.old_side.gold == 35);
  // NEW matched 7+6+6+6+7 = 32, test 7+6+7+6+7 = 33, gold 35.
  CHECK(c.overall.new_side.matched == 32);
  CHECK(c.overall.new_side.test == 33);
  CHECK(c.overall.new_side.f1() == doctest::Approx(100.0 * 2 * 32 / (33 + 35)));
  REQUIRE(c.suites.size() == 1);
  CHECK(c.suites[0].new_side.cases == 5);
  REQUIRE(c.lengths.size() == 1);
  CHECK(c.lengths[0].key == "1-10");
  // Error classes: OLD has 3 PP attachment errors (fixed, worse, same-f1); NEW has one
  // (broken), one label error (worse) and one unary error (same-f1).
  std::map<std::string, ErrorClassRow> classes;
  for (const auto& r : c.error_classes) classes[r.name] = r;
  CHECK(classes["PP attachment"].old_side.errors == 3);
  CHECK(classes["PP attachment"].new_side.errors == 1);
  CHECK(classes["label"].new_side.errors == 1);
  CHECK(classes["label"].new_side.brackets == 2);
  CHECK(classes["unary"].new_side.errors == 1);
  CHECK(classes["unary"].old_side.errors == 0);
  // The broken case lists gold's NP 3-7 as missing in NEW.
  const CaseChange& broken = c.cases[1];
  REQUIRE(broken.new_side.wrong.size() == 1);
  CHECK(broken.new_side.wrong[0].label == "NP");
  CHECK(broken.new_side.wrong[0].first == 3);
  CHECK(broken.new_side.wrong[0].last == 7);
  CHECK(broken.new_side.wrong[0].missing);
  CHECK(c.old_speed.total == doctest::Approx(0.05));
  CHECK(c.new_speed.median == doctest::Approx(0.02));
  const auto j = nlohmann::json::parse(comparison_json(c));
  CHECK(j["transitions"]["broken"] == 1);
  CHECK(j["cases"].size() == 4);  // unchanged cases are counted, not listed
  CHECK(j["significance"]["iterations"] == 2000);
  const std::string text = comparison_text(c);
  CHECK(text.find("broken (passed in OLD, fails in NEW): 1") != std::string::npos);
  CHECK(text.find("new wrong: missing NP 3-7") != std::string::npos);
}

TEST_CASE("a run compared with itself: all unchanged, p = 1") {
  const RunResults run = run_of(
      {record("a", kVerbPp, Outcome::kFail, 0.01), record("b", kGold, Outcome::kPass, 0.01)});
  const Comparison c = compare_runs(run, "a", run, "b");
  CHECK(c.transition_counts[static_cast<int>(Transition::kUnchanged)] == 2);
  CHECK(c.significance.p == 1.0);
  CHECK(c.overall.f1_delta() == 0.0);
}

TEST_CASE("an unreadable predicted tree is a warning and counts as no parse") {
  const RunResults a = run_of({record("a", kGold, Outcome::kPass, 0.01)});
  const RunResults b = run_of({record("a", "(S (NP", Outcome::kError, 0.01)});
  const Comparison c = compare_runs(a, "a", b, "b");
  REQUIRE(c.warnings.size() == 1);
  CHECK(c.warnings[0].find("unreadable tree") != std::string::npos);
  CHECK(c.overall.new_side.test == 0);
  CHECK(c.transition_counts[static_cast<int>(Transition::kBroken)] == 1);
}

}  // namespace
}  // namespace treegate::results
