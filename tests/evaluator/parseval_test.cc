// PARSEVAL scoring: worked examples derived by hand from the published definitions, the
// default scheme's conventions one by one, and properties over random trees.
#include <doctest/doctest.h>

#include <algorithm>
#include <random>
#include <sstream>

#include "evaluator/bracket_io.h"
#include "evaluator/score_streams.h"
#include "evaluator/tally.h"

using namespace treegate;

namespace {

SentenceScore score(const std::string& gold, const std::string& test, Scheme scheme = {}) {
  Scorer scorer(std::move(scheme));
  return scorer.score(parse_tree(gold), parse_tree(test));
}

// A random tree over `n` words w0..w(n-1), labels from a small set; no punctuation tags.
std::string random_tree(std::mt19937& rng, int n) {
  static const char* labels[] = {"S", "NP", "VP", "PP", "ADJP", "SBAR"};
  static const char* tags[] = {"DT", "NN", "VB", "IN", "JJ"};
  std::vector<std::string> items;
  for (int i = 0; i < n; ++i) {
    items.push_back(std::string("(") + tags[rng() % 5] + " w" + std::to_string(i) + ")");
  }
  while (items.size() > 1) {
    const std::size_t start = rng() % items.size();
    const std::size_t len = 1 + rng() % std::min<std::size_t>(3, items.size() - start);
    std::string joined = std::string("(") + labels[rng() % 6];
    for (std::size_t i = start; i < start + len; ++i) joined += " " + items[i];
    joined += ")";
    items.erase(items.begin() + static_cast<long>(start),
                items.begin() + static_cast<long>(start + len));
    items.insert(items.begin() + static_cast<long>(start), joined);
  }
  return items[0];
}

}  // namespace

// Labeled precision, recall and F1 as defined in Jurafsky & Martin, "Speech and Language
// Processing", 3rd ed. draft, chapter "Constituency Parsing", section on evaluating parsers
// (definitions recalled from memory): recall = correct constituents in the hypothesis / all
// constituents in the reference; precision = correct constituents / all constituents in the
// hypothesis; F1 = 2PR / (P + R). A constituent is correct when a reference constituent has
// the same start, end and label.
TEST_CASE("worked example: labeled precision, recall, F1") {
  // Reference brackets over words 0..7: S[0,8] NP[0,2] VP[2,8] NP[3,8] NP[3,5] PP[5,8] NP[6,8]
  // (7). Hypothesis attaches the PP to the VP: S[0,8] NP[0,2] VP[2,8] NP[3,5] PP[5,8] NP[6,8]
  // (6). All 6 are correct: P = 6/6 = 100, R = 6/7 = 85.714..., F1 = 2*1*(6/7)/(1+6/7) = 12/13.
  const auto s = score(
      "(S (NP (DT a) (NN b)) (VP (VB c) (NP (NP (DT d) (NN e)) (PP (IN f) (NP (DT g) (NN h))))))",
      "(S (NP (DT a) (NN b)) (VP (VB c) (NP (DT d) (NN e)) (PP (IN f) (NP (DT g) (NN h)))))");
  CHECK(s.status == SentenceStatus::kScored);
  CHECK(s.gold_brackets == 7);
  CHECK(s.test_brackets == 6);
  CHECK(s.matched == 6);
  CHECK(precision_pct(s.matched, s.test_brackets, s.gold_brackets) == doctest::Approx(100.0));
  CHECK(recall_pct(s.matched, s.test_brackets, s.gold_brackets) == doctest::Approx(600.0 / 7));
  CHECK(f1_pct(s.matched, s.test_brackets, s.gold_brackets) == doctest::Approx(1200.0 / 13));
  CHECK(s.crossing == 0);
  CHECK(!s.exact_match());
}

// Crossing brackets as defined for PARSEVAL by Black et al. (1991), "A procedure for
// quantitatively comparing the syntactic coverage of English grammars": the number of
// constituents of the candidate parse that cross a constituent of the treebank parse, where
// two spans cross when they overlap and neither contains the other.
TEST_CASE("worked example: crossing brackets") {
  // Gold: S[0,5] A[0,2] B[2,5] C[3,5]. Test: S[0,5] A[0,3] C[3,5].
  // A[0,3] overlaps B[2,5] (0 < 2 < 3 < 5) and neither contains the other: 1 crossing.
  // S and C contain or are contained by every gold span: no crossing. Matched: S, C.
  const auto s = score("(S (A (X a) (X b)) (B (X c) (C (X d) (X e))))",
                       "(S (A (X a) (X b) (X c)) (C (X d) (X e)))");
  CHECK(s.crossing == 1);
  CHECK(s.matched == 2);
  CHECK(s.gold_brackets == 4);
  CHECK(s.test_brackets == 3);
  // Two test brackets crossing the same gold bracket count twice; one crossing two counts once.
  const auto t =
      score("(S (A (X a) (X b)) (B (X c) (X d)))", "(S (X a) (C (X b) (D (X c) (X d))))");
  // Gold A[0,2] B[2,4]; test C[1,4] crosses A; D[2,4] crosses nothing.
  CHECK(t.crossing == 1);
  const auto u =
      score("(S (A (X a) (X b)) (X c) (B (X d) (X e)))", "(S (X a) (C (X b) (X c) (X d)) (X e))");
  // Test C[1,4] crosses both A[0,2] and B[3,5]: one crossing constituent.
  CHECK(u.crossing == 1);
}

TEST_CASE("default scheme: root wrapper, preterminals, punctuation, function tags, ADVP=PRT") {
  SUBCASE("a root wrapper and preterminals are not brackets") {
    const auto s = score("(ROOT (S (NP (NN a)) (VP (VB b))))", "(TOP (S (NP (NN a)) (VP (VB b))))");
    CHECK(s.gold_brackets == 3);
    CHECK(s.matched == 3);
    CHECK(score("( (S (NN a) (VB b)))", "(S (NN a) (VB b))").matched == 1);
  }
  SUBCASE("gold punctuation positions are ignored in both trees") {
    // Test puts the final period inside the VP; without the period both VPs span word 1 only.
    const auto s = score("(S (NP (NN a)) (VP (VB b)) (. .))", "(S (NP (NN a)) (VP (VB b) (NN .)))");
    CHECK(s.words == 2);
    CHECK(s.matched == 3);
    CHECK(s.exact_match());
    CHECK(s.tags_correct == 2);
  }
  SUBCASE("function tags and indices are stripped; labels starting with '-' kept") {
    const auto s = score("(S (NP-SBJ-1 (NN a)) (VP (VB b) (NP=2 (NN c))))",
                         "(S (NP (NN a)) (VP (VB b) (NP (NN c))))");
    CHECK(s.matched == 4);
    Scheme keep;
    keep.strip_function_tags = false;
    CHECK(score("(S (NP-SBJ (NN a)) (VP (VB b)))", "(S (NP (NN a)) (VP (VB b)))", keep).matched ==
          2);
  }
  SUBCASE("empty elements and the constituents they leave empty are removed") {
    const auto s =
        score("(S (NP-SBJ (-NONE- *T*-1)) (VP (VB a) (NP (NN b))))", "(S (VP (VB a) (NP (NN b))))");
    CHECK(s.gold_brackets == 3);
    CHECK(s.matched == 3);
    CHECK(s.words == 2);
  }
  SUBCASE("ADVP and PRT count as one label") {
    CHECK(score("(S (VP (VB a) (PRT (RP b))))", "(S (VP (VB a) (ADVP (RB b))))").matched == 3);
    Scheme none;
    none.equivalent_labels.clear();
    CHECK(score("(S (VP (VB a) (PRT (RP b))))", "(S (VP (VB a) (ADVP (RB b))))", none).matched ==
          2);
  }
  SUBCASE("brackets are a multiset: a doubled unary must be matched twice") {
    const auto s = score("(S (NP (NP (NN a))) (VP (VB b)))", "(S (NP (NN a)) (VP (VB b)))");
    CHECK(s.gold_brackets == 4);
    CHECK(s.test_brackets == 3);
    CHECK(s.matched == 3);
  }
}

TEST_CASE("errors and unparsed sentences") {
  const auto mismatch = score("(S (NN a) (NN b))", "(S (NN a) (NN c))");
  CHECK(mismatch.status == SentenceStatus::kYieldMismatch);
  CHECK(mismatch.reason == "word 2 differs: gold 'b', test 'c'");
  const auto shorter = score("(S (NN a) (NN b))", "(S (NN a))");
  CHECK(shorter.reason == "gold has 2 words, test has 1; they agree up to word 1");
  const auto none = score("(S (NP (NN a)) (VP (VB b)))", "()");
  CHECK(none.status == SentenceStatus::kNoParse);
  CHECK(none.gold_brackets == 3);
  CHECK(none.test_brackets == 0);
  Scheme scheme;
  CHECK(none.counts(scheme));
  scheme.count_unparsed = false;
  CHECK(!none.counts(scheme));
  CHECK(score("(S (-NONE- *))", "(S (NN a))").status == SentenceStatus::kError);
}

TEST_CASE("corpus tally: micro-averaged figures, crossing percentages, cutoff") {
  std::istringstream gold(
      "(S (A (X a) (X b)) (B (X c) (C (X d) (X e))))\n"
      "(S (NP (NN a)) (VP (VB b)))\n"
      "(S (NN a) (NN b))\n");
  std::istringstream test(
      "(S (A (X a) (X b) (X c)) (C (X d) (X e)))\n"
      "()\n"
      "(S (NN a) (NN c))\n");
  Scheme scheme;
  scheme.length_cutoff = 2;
  const Tally tally = score_streams(gold, "g", test, "t", scheme);
  const Counts& c = tally.all();
  CHECK(c.sentences == 3);
  CHECK(c.scored == 2);  // the unparsed one counts; the yield mismatch does not
  CHECK(c.errors == 1);
  CHECK(c.unparsed == 1);
  CHECK(c.gold == 7);  // 4 + 3
  CHECK(c.test == 3);
  CHECK(c.matched == 2);
  const Figures f = figures(c);
  CHECK(f.precision == doctest::Approx(200.0 / 3));
  CHECK(f.recall == doctest::Approx(200.0 / 7));
  CHECK(f.crossing_avg == doctest::Approx(0.5));
  CHECK(f.zero_crossing_pct == doctest::Approx(50.0));
  CHECK(f.le2_crossing_pct == doctest::Approx(100.0));
  CHECK(tally.within_cutoff().scored == 1);  // only the 2-word sentence
  CHECK(tally.per_label().size() == 6);      // S A B C NP VP
}

TEST_CASE("different tree counts name both counts") {
  std::istringstream gold("(S (NN a))\n(S (NN b))\n(S (NN c))\n");
  std::istringstream test("(S (NN a))\n");
  try {
    score_streams(gold, "g.trees", test, "t.trees", Scheme{});
    FAIL("no error");
  } catch (const std::exception& e) {
    CHECK(std::string(e.what()) == "different numbers of trees: g.trees has 3, t.trees has 1");
  }
}

TEST_CASE("properties over random trees") {
  std::mt19937 rng(20261201);
  std::vector<std::string> golds, tests;
  for (int i = 0; i < 300; ++i) {
    const int n = 1 + static_cast<int>(rng() % 20);
    golds.push_back(random_tree(rng, n));
    tests.push_back(random_tree(rng, n));
  }
  SUBCASE("a tree scored against itself: 100/100/100, no crossing") {
    for (const auto& g : golds) {
      const auto s = score(g, g);
      CHECK(s.matched == s.gold_brackets);
      CHECK(s.matched == s.test_brackets);
      CHECK(s.crossing == 0);
      CHECK(s.exact_match());
    }
  }
  SUBCASE("swapping gold and test swaps precision and recall") {
    for (std::size_t i = 0; i < golds.size(); ++i) {
      const auto a = score(golds[i], tests[i]);
      const auto b = score(tests[i], golds[i]);
      CHECK(a.matched == b.matched);
      CHECK(a.gold_brackets == b.test_brackets);
      CHECK(a.test_brackets == b.gold_brackets);
    }
  }
  SUBCASE("totals do not depend on the order of the trees") {
    auto run = [](const std::vector<std::size_t>& order, const std::vector<std::string>& g,
                  const std::vector<std::string>& t) {
      std::string gs, ts;
      for (std::size_t i : order) {
        gs += g[i] + "\n";
        ts += t[i] + "\n";
      }
      std::istringstream gi(gs), ti(ts);
      return score_streams(gi, "g", ti, "t", Scheme{}).all();
    };
    std::vector<std::size_t> order(golds.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
    const Counts a = run(order, golds, tests);
    std::shuffle(order.begin(), order.end(), rng);
    const Counts b = run(order, golds, tests);
    CHECK(a.matched == b.matched);
    CHECK(a.gold == b.gold);
    CHECK(a.test == b.test);
    CHECK(a.crossing == b.crossing);
    CHECK(a.exact == b.exact);
  }
}

TEST_CASE("brackets come out sorted whatever order the tree's nodes were added in") {
  // The same tree twice: nodes added depth-first (pre-order ids, as the reader does), and
  // constituents breadth-first (ids in level order) with the words added last, in yield
  // order. The scorer relies on pre-order ids only for speed.
  std::mt19937 rng(7);
  const Tree depth_first = parse_tree(random_tree(rng, 150));  // with unary chains
  Tree breadth_first;
  std::vector<NodeId> new_id(depth_first.size(), kNoNode);
  std::vector<NodeId> queue{depth_first.root()};
  for (std::size_t q = 0; q < queue.size(); ++q) {
    const NodeId old_id = queue[q];
    const Node& n = depth_first.node(old_id);
    const NodeId parent =
        n.parent == kNoNode ? kNoNode : new_id[static_cast<std::size_t>(n.parent)];
    new_id[static_cast<std::size_t>(old_id)] =
        breadth_first.add_node(depth_first.label(old_id), parent);
    for (NodeId c = n.first_child; c != kNoNode; c = depth_first.node(c).next_sibling) {
      if (!depth_first.node(c).is_leaf()) queue.push_back(c);
    }
  }
  for (std::size_t i = 0; i < depth_first.size(); ++i) {  // leaves in id order = yield order
    const Node& n = depth_first.node(static_cast<NodeId>(i));
    if (n.is_leaf()) {
      breadth_first.add_leaf(depth_first.word(static_cast<std::size_t>(n.word)),
                             new_id[static_cast<std::size_t>(n.parent)]);
    }
  }
  REQUIRE(to_bracketed(breadth_first) == to_bracketed(depth_first));
  Scorer scorer{Scheme{}};
  const std::vector<Bracket> a = scorer.brackets_of(depth_first);
  const std::vector<Bracket> b = scorer.brackets_of(breadth_first);
  CHECK(a.size() > 100);
  CHECK(std::is_sorted(a.begin(), a.end()));
  CHECK(std::is_sorted(b.begin(), b.end()));
  REQUIRE(a.size() == b.size());
  for (std::size_t i = 0; i < a.size(); ++i) {
    CHECK(a[i].label == b[i].label);
    CHECK(a[i].start == b[i].start);
    CHECK(a[i].end == b[i].end);
  }
}
