// Hostile input for PARSEVAL scoring. Regression test for a bug found while probing huge trees:
// counting crossing brackets compared every test bracket with every gold bracket, so one wide
// tree of 300,000 brackets (a 3 MB file) took about a minute, and 3,000,000 brackets hours.
#include <doctest/doctest.h>

#include <random>
#include <string>

#include "evaluator/bracket_io.h"
#include "evaluator/parseval.h"

namespace treegate {
namespace {

// A random tree over `words` (the same words for every call), with random labels from a
// small set so that gold and test brackets sometimes match and sometimes cross.
std::string random_tree(std::mt19937& rng, const std::vector<std::string>& words) {
  std::vector<std::string> parts;
  for (const auto& w : words) parts.push_back("(T " + w + ")");
  const char* labels[] = {"A", "B", "C"};
  while (parts.size() > 1) {
    const std::size_t i = rng() % (parts.size() - 1);
    const std::size_t n = 2 + rng() % std::min<std::size_t>(3, parts.size() - i - 1);
    std::string joined = std::string("(") + labels[rng() % 3];
    for (std::size_t k = i; k < i + n && k < parts.size(); ++k) joined += " " + parts[k];
    joined += ")";
    parts.erase(parts.begin() + static_cast<long>(i),
                parts.begin() + static_cast<long>(std::min(i + n, parts.size())));
    parts.insert(parts.begin() + static_cast<long>(i), joined);
  }
  return "(S " + parts.front() + ")";
}

TEST_CASE("crossing_count_quadratic_regression: crossing equals the pairwise definition") {
  // The definition (Black et al. 1991, "A procedure for quantitatively comparing the syntactic
  // coverage of English grammars"): a test constituent crosses when it overlaps a gold
  // constituent without either containing the other. Counted here pair by pair, as a check
  // of the faster count in the scorer.
  std::mt19937 rng(12345);
  LabelTable labels;
  Scorer scorer(Scheme{}, labels);
  int with_crossing = 0;
  for (int round = 0; round < 400; ++round) {
    std::vector<std::string> words;
    const std::size_t n = 2 + rng() % 14;
    for (std::size_t i = 0; i < n; ++i) words.push_back("w" + std::to_string(i));
    const Tree gold = parse_tree(random_tree(rng, words), "gold", labels);
    const Tree test = parse_tree(random_tree(rng, words), "test", labels);
    BracketSets sets;
    const SentenceScore s = scorer.score(gold, test, &sets);
    REQUIRE(s.status == SentenceStatus::kScored);
    std::uint32_t expected = 0;
    for (const Bracket& t : sets.test) {
      bool any = false;
      for (const Bracket& g : sets.gold) any = any || crosses(t, g);
      expected += any ? 1 : 0;
    }
    CHECK(s.crossing == expected);
    with_crossing += expected > 0 ? 1 : 0;
  }
  CHECK(with_crossing > 50);  // the random trees do exercise crossing brackets
}

TEST_CASE("crossing_count_quadratic_regression: 150,000 crossing pairs score in linear time") {
  // Gold pairs words (1 2) (3 4) ...; test pairs them (2 3) (4 5) ...: every test pair crosses
  // two gold pairs. The old pairwise count took 150,000 x 150,000 steps here.
  const int n = 150000;
  std::string gold = "(S", test = "(S (NN a)";
  for (int i = 0; i < n; ++i) gold += " (W (NN a) (NN a))";
  for (int i = 0; i + 1 < n; ++i) test += " (P (NN a) (NN a))";
  gold += ")";
  test += " (NN a))";
  LabelTable labels;
  Scorer scorer(Scheme{}, labels);
  const SentenceScore s =
      scorer.score(parse_tree(gold, "g", labels), parse_tree(test, "t", labels));
  REQUIRE(s.status == SentenceStatus::kScored);
  CHECK(s.gold_brackets == n + 1);
  CHECK(s.test_brackets == n);
  CHECK(s.matched == 1);
  CHECK(s.crossing == n - 1);
}

}  // namespace
}  // namespace treegate
