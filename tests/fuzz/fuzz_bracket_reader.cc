// libFuzzer target: the bracketed-tree reader, the writers and PARSEVAL scoring of two trees.
// Reads every tree of the input (resuming after syntax errors as `score` does), and checks
// properties that must hold for any input: a tree read back from its one-line form is the same
// tree, and a tree scored against itself is an exact match with no crossing brackets.
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <sstream>
#include <string>
#include <vector>

#include "evaluator/bracket_io.h"
#include "evaluator/errors.h"
#include "evaluator/parseval.h"
#include "evaluator/tally.h"

namespace {

void check(bool ok, const char* what) {
  if (!ok) {
    __builtin_printf("property failed: %s\n", what);
    std::abort();
  }
}

void check_round_trip(const treegate::Tree& tree, treegate::LabelTable& labels) {
  const std::string once = treegate::to_bracketed(tree);
  const treegate::Tree again = treegate::parse_tree(once, "<round-trip>", labels);
  check(treegate::to_bracketed(again) == once, "to_bracketed -> parse_tree round trip");
  check(again.size() == tree.size() && again.num_words() == tree.num_words(),
        "round trip keeps node and word counts");
  (void)treegate::to_indented(tree);
}

void check_self_score(treegate::Scorer& scorer, const treegate::Tree& tree) {
  treegate::BracketSets sets;
  const treegate::SentenceScore s = scorer.score(tree, tree, &sets);
  if (s.status != treegate::SentenceStatus::kScored) return;
  check(s.exact_match(), "a tree scored against itself matches exactly");
  check(s.crossing == 0, "a tree scored against itself has no crossing brackets");
  check(s.tags_correct == s.words, "a tree scored against itself has every tag right");
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  treegate::LabelTable labels;  // one per input, so the fuzzer's memory stays flat
  std::istringstream in(std::string(reinterpret_cast<const char*>(data), size));
  treegate::ReadLimits limits;
  limits.max_depth = 5000;
  limits.max_nodes = 200000;
  treegate::BracketReader reader(in, "fuzz.trees", labels, limits);
  treegate::Scorer scorer(treegate::Scheme{}, labels);
  treegate::Tally tally(scorer.scheme());
  std::vector<treegate::Tree> trees;
  treegate::Tree tree(labels);
  for (int errors = 0; errors < 1000;) {
    try {
      if (!reader.next(tree)) break;
    } catch (const treegate::InputError& e) {
      check(e.line() > 0 && e.col() > 0, "syntax errors carry line and column");
      ++errors;
      continue;
    }
    check_round_trip(tree, labels);
    check_self_score(scorer, tree);
    if (trees.size() < 64) trees.push_back(tree);
  }
  // Score every tree against the next one, as `treegate score` pairs gold and test trees.
  treegate::BracketSets sets;
  for (std::size_t i = 0; i + 1 < trees.size(); ++i) {
    const treegate::SentenceScore s = scorer.score(trees[i], trees[i + 1], &sets);
    check(s.matched <= s.gold_brackets && s.matched <= s.test_brackets, "matched <= gold, test");
    tally.add(s, sets);
  }
  (void)treegate::figures(tally.all());
  return 0;
}
