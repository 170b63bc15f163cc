// Marks of matched, wrong and missing brackets agree with the PARSEVAL scorer's counts, on a
// textbook attachment example and on treebank sentences against a changed parse.
#include <doctest/doctest.h>

#include <cstdlib>

#include "evaluator/bracket_io.h"
#include "harness/report/html_diff.h"
#include "harness/report/html_tree.h"

namespace html = treegate::report::html;

namespace {

std::size_t marked(const std::vector<std::uint8_t>& marks, std::uint8_t flag) {
  std::size_t n = 0;
  for (auto m : marks) n += (m & flag) ? 1 : 0;
  return n;
}

}  // namespace

TEST_CASE("html diff: prepositional-phrase attachment, noun vs verb") {
  // The two parses of "astronomers saw stars with ears" (Manning & Schuetze 1999, "Foundations
  // of Statistical Natural Language Processing", ch. 11, trees t1 and t2; recalled from memory).
  // Gold attaches the PP to the noun; the prediction attaches it to the verb phrase. PARSEVAL:
  // gold NP "stars with ears" (words 3-5) is missing; test VP "saw stars" (2-3) is wrong.
  const auto gold = treegate::parse_tree(
      "(S (NP (NNS astronomers)) (VP (V saw) (NP (NP (NNS stars)) (PP (P with) (NP (NNS "
      "ears))))))");
  const auto test = treegate::parse_tree(
      "(S (NP (NNS astronomers)) (VP (VP (V saw) (NP (NNS stars))) (PP (P with) (NP (NNS "
      "ears)))))");
  treegate::Scorer scorer{treegate::Scheme{}};
  const auto d = html::diff_trees(gold, test, scorer);
  CHECK(d.score.matched == 6);
  CHECK(d.missing == std::vector<std::string>{"NP 3\xE2\x80\x93"
                                              "5 (stars with ears)"});
  CHECK(d.wrong == std::vector<std::string>{"VP 2\xE2\x80\x93"
                                            "3 (saw stars)"});
  CHECK(marked(d.gold_marks, html::kMissing) == 1);
  CHECK(marked(d.test_marks, html::kWrong) == 1);
  CHECK(marked(d.gold_marks, html::kMatched) == 6);
  CHECK(marked(d.test_marks, html::kMatched) == 6);
  const std::string svg = html::render_trees(
      {{"gold", &gold, d.gold_marks, ""}, {"predicted", &test, d.test_marks, ""}});
  CHECK(svg.find("m-missing") != std::string::npos);
  CHECK(svg.find("m-wrong") != std::string::npos);
}

TEST_CASE("html diff: marks follow the scheme (punctuation ignored, root wrapper, tags)") {
  const auto gold = treegate::parse_tree(
      "(ROOT (S (NP (DT The) (NN crane)) (VP (VBZ lifts) (NP (DT the) (NN crate))) (. .)))");
  const auto test = treegate::parse_tree(
      "(ROOT (S (NP (DT The) (NN crane)) (VP (VBZ lifts) (NP (DT the) (VB crate)) (. .))))");
  treegate::Scorer scorer{treegate::Scheme{}};
  const auto d = html::diff_trees(gold, test, scorer);
  // The full stop is ignored, so VP spans the same scored words in both: all matched.
  CHECK(d.score.matched == 4);
  CHECK(d.missing.empty());
  CHECK(d.wrong.empty());
  CHECK(marked(d.test_marks, html::kTagWrong) == 1);  // VB for NN
  CHECK(d.test_marks[0] == 0);                        // the ROOT wrapper is no bracket
}

TEST_CASE("html diff: on treebank trees the marks add up to the scorer's counts") {
  const char* shared = std::getenv("TREEGATE_SHARED");
  const std::string dir = shared ? shared : TREEGATE_SOURCE_DIR "/../shared";
  const std::string path = dir + "/data/gum-ccby-train/trees/GUM_academic_art.ptb";
  std::vector<treegate::Tree> trees;
  try {
    trees = treegate::read_tree_file(path);
  } catch (const std::exception& e) {
    if (std::getenv("CI")) FAIL("treebank sample missing: " << std::string(e.what()));
    MESSAGE("not run: " << std::string(e.what()));
    return;
  }
  treegate::Scorer scorer{treegate::Scheme{}};
  for (const auto& gold : trees) {
    // A changed parse: every NP with two or more children loses its first child's bracket by
    // flattening (we just score the gold tree against a tree with one level removed).
    treegate::Tree test;
    std::vector<treegate::NodeId> map(gold.size(), treegate::kNoNode);
    for (std::size_t i = 0; i < gold.size(); ++i) {
      const auto id = static_cast<treegate::NodeId>(i);
      const auto& n = gold.node(id);
      treegate::NodeId parent = n.parent == treegate::kNoNode
                                    ? treegate::kNoNode
                                    : map[static_cast<std::size_t>(n.parent)];
      if (n.is_leaf()) {
        map[i] = test.add_leaf(gold.word(static_cast<std::size_t>(n.word)), parent);
      } else if (i > 0 && gold.label(id).substr(0, 2) == "NP" && !gold.is_preterminal(id) &&
                 parent != treegate::kNoNode && i % 3 == 0) {
        map[i] = parent;  // drop this NP
      } else {
        map[i] = test.add_node(gold.label(id), parent);
      }
    }
    const auto d = html::diff_trees(gold, test, scorer);
    REQUIRE(d.score.status == treegate::SentenceStatus::kScored);
    CHECK(marked(d.gold_marks, html::kMatched) == d.score.matched);
    CHECK(marked(d.test_marks, html::kMatched) == d.score.matched);
    CHECK(d.missing.size() == d.score.gold_brackets - d.score.matched);
    CHECK(d.wrong.size() == d.score.test_brackets - d.score.matched);
    // Real trees lay out without overlapping boxes, with shared columns.
    const auto layouts = html::layout_trees({&gold, &test});
    REQUIRE(layouts[0].drawn);
    CHECK(layouts[0].word_x == layouts[1].word_x);
    for (const auto& layout : layouts) {
      for (std::size_t i = 0; i < layout.boxes.size(); ++i) {
        for (std::size_t j = i + 1; j < layout.boxes.size(); ++j) {
          const auto& a = layout.boxes[i];
          const auto& b = layout.boxes[j];
          const bool overlap = a.x - a.w / 2 < b.x + b.w / 2 && b.x - b.w / 2 < a.x + a.w / 2 &&
                               a.y < b.y + b.h && b.y < a.y + a.h;
          CHECK_FALSE(overlap);
        }
      }
    }
  }
  CHECK(trees.size() > 10);
}
