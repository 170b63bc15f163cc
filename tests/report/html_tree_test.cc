// Tree drawing for the HTML report: no two node boxes overlap, no box covers another word's
// line, the words of trees over one sentence share columns and a baseline, every word is drawn
// once, data is escaped, and trees too large to draw fall back to text without recursion.
#include <doctest/doctest.h>

#include <algorithm>
#include <random>
#include <string>

#include "evaluator/bracket_io.h"
#include "harness/report/html_tree.h"

namespace html = treegate::report::html;
using treegate::kNoNode;
using treegate::NodeId;
using treegate::Tree;

namespace {

std::size_t count(const std::string& s, const std::string& what) {
  std::size_t n = 0;
  for (auto p = s.find(what); p != std::string::npos; p = s.find(what, p + 1)) ++n;
  return n;
}

// A random tree over `words` words: random labels of 1..9 characters, random branching, unary
// chains, and function tags, built top-down from a random split of the word range.
Tree random_tree(std::mt19937& rng, std::size_t words) {
  Tree t;
  auto pick = [&](int lo, int hi) { return std::uniform_int_distribution<int>(lo, hi)(rng); };
  auto label = [&] {
    static const char* kLabels[] = {"S",    "NP",   "VP", "PP",  "SBAR", "NP-SBJ-1",
                                    "ADJP", "WHNP", "X",  "PRN", "QP",   "UCP"};
    return std::string(kLabels[pick(0, 11)]);
  };
  struct Span {
    NodeId parent;
    std::size_t lo, hi;
  };
  std::vector<Span> stack{{kNoNode, 0, words}};
  std::vector<std::pair<NodeId, std::size_t>> leaves;  // (parent, word), added in word order
  while (!stack.empty()) {
    Span s = stack.back();
    stack.pop_back();
    NodeId node = t.add_node(label(), s.parent);
    while (pick(0, 5) == 0) node = t.add_node(label(), node);  // unary chains
    if (s.hi - s.lo == 1) {
      leaves.push_back({t.add_node(pick(0, 1) ? "NN" : "IN", node), s.lo});
      continue;
    }
    std::vector<std::size_t> cuts{s.lo};
    for (std::size_t w = s.lo + 1; w < s.hi; ++w) {
      if (pick(0, 2) == 0) cuts.push_back(w);
    }
    if (cuts.size() == 1) cuts.push_back(s.lo + (s.hi - s.lo) / 2);
    cuts.push_back(s.hi);
    for (std::size_t k = cuts.size() - 1; k-- > 0;) stack.push_back({node, cuts[k], cuts[k + 1]});
  }
  std::sort(leaves.begin(), leaves.end(), [](auto& a, auto& b) { return a.second < b.second; });
  for (auto& [parent, w] : leaves) {
    t.add_leaf(w % 7 == 3 ? "extraordinarily" : "w" + std::to_string(w), parent);
  }
  return t;
}

bool overlap(const html::NodeBox& a, const html::NodeBox& b) {
  return a.x - a.w / 2 < b.x + b.w / 2 && b.x - b.w / 2 < a.x + a.w / 2 && a.y < b.y + b.h &&
         b.y < a.y + a.h;
}

void check_layout(const Tree& t, const html::PanelLayout& p) {
  REQUIRE(p.drawn);
  REQUIRE(p.word_x.size() == t.num_words());
  for (std::size_t i = 0; i < p.boxes.size(); ++i) {
    const auto& a = p.boxes[i];
    CHECK(a.x - a.w / 2 >= 0);
    CHECK(a.x + a.w / 2 <= p.width);
    CHECK(a.y + a.h < p.word_y - 12);
    for (std::size_t j = i + 1; j < p.boxes.size(); ++j) {
      if (overlap(a, p.boxes[j])) {
        FAIL_CHECK("boxes of nodes " << a.node << " and " << p.boxes[j].node << " overlap");
      }
    }
  }
  // A word's line runs straight down from its parent's row; no box below that row covers it.
  for (std::size_t i = 0; i < t.size(); ++i) {
    const auto& leaf = t.node(static_cast<NodeId>(i));
    if (!leaf.is_leaf()) continue;
    const double x = p.word_x[static_cast<std::size_t>(leaf.word)];
    double parent_y = 0;
    for (const auto& b : p.boxes) {
      if (b.node == leaf.parent) parent_y = b.y;
    }
    for (const auto& b : p.boxes) {
      if (b.y > parent_y && b.x - b.w / 2 < x && x < b.x + b.w / 2) {
        FAIL_CHECK("node " << b.node << " covers the line of word " << leaf.word);
      }
    }
  }
  for (std::size_t w = 1; w < p.word_x.size(); ++w) CHECK(p.word_x[w] > p.word_x[w - 1]);
}

}  // namespace

TEST_CASE("html tree: random trees lay out without overlaps, words aligned across trees") {
  std::mt19937 rng(20261201);
  for (int round = 0; round < 60; ++round) {
    const std::size_t words = 1 + static_cast<std::size_t>(round * 3 % 70);
    const Tree a = random_tree(rng, words);
    const Tree b = random_tree(rng, words);
    CAPTURE(round);
    CAPTURE(treegate::to_bracketed(a));
    CAPTURE(treegate::to_bracketed(b));
    const auto layouts = html::layout_trees({&a, &b});
    REQUIRE(layouts.size() == 2);
    check_layout(a, layouts[0]);
    check_layout(b, layouts[1]);
    CHECK(layouts[0].word_x == layouts[1].word_x);
    CHECK(layouts[0].word_y == layouts[1].word_y);
  }
}

TEST_CASE("html tree: a 60-word sentence stays legible and every word is drawn once") {
  std::mt19937 rng(7);
  const Tree t = random_tree(rng, 64);
  const auto p = html::layout_trees({&t})[0];
  check_layout(t, p);
  // Legible: the text keeps its size; the drawing grows sideways (it scrolls) but not absurdly.
  CHECK(p.width < 64 * 200);
  const std::string svg = html::render_trees({{"gold", &t, {}, ""}});
  CHECK(count(svg, "class=\"leaf\"") == 64);
  CHECK(count(svg, "<svg ") == 1);
  CHECK(svg.find("data-words=\"64\"") != std::string::npos);
}

TEST_CASE("html tree: trees over different words keep a shared baseline") {
  const Tree a = treegate::parse_tree("(S (NP (DT the) (NN crane)) (VP (VBZ hums)))");
  const Tree b = treegate::parse_tree("(S (NP (NN crane)) (VP (VBZ hums)))");
  const auto layouts = html::layout_trees({&a, &b});
  CHECK(layouts[0].word_x.size() == 3);
  CHECK(layouts[1].word_x.size() == 2);
  CHECK(layouts[0].word_y == layouts[1].word_y);
}

TEST_CASE("html tree: text from data is escaped") {
  Tree t;  // built directly: words with parentheses cannot be written in bracketed form
  const NodeId s = t.add_node("S", kNoNode);
  t.add_leaf("<script>alert(1)</script>", t.add_node("NN", t.add_node("NP-<b>", s)));
  const NodeId vp = t.add_node("VP", s);
  t.add_leaf("\"&amp;\"", t.add_node("VB", vp));
  t.add_leaf("it's", t.add_node("NN", vp));
  const std::string html = html::render_trees({{"<i>gold</i>", &t, {}, "<img src=x>"}});
  CHECK(html.find("<script") == std::string::npos);
  CHECK(html.find("<img") == std::string::npos);
  CHECK(html.find("<i>") == std::string::npos);
  CHECK(html.find("&lt;script&gt;alert(1)&lt;/script&gt;") != std::string::npos);
  CHECK(html.find("NP-&lt;b&gt;") != std::string::npos);
  CHECK(html.find("&quot;&amp;amp;&quot;") != std::string::npos);
  CHECK(html.find("it&#39;s") != std::string::npos);
}

TEST_CASE("html tree: deep and huge trees are shown as text, without recursion") {
  // A unary chain 300 levels deep (over the drawing limit of 250 rows).
  Tree deep;
  NodeId node = deep.add_node("X", kNoNode);
  for (int i = 0; i < 300; ++i) node = deep.add_node("X", node);
  deep.add_leaf("w", node);
  std::string html = html::render_trees({{"deep", &deep, {}, ""}});
  CHECK(html.find("<svg") == std::string::npos);
  CHECK(html.find("too large to draw (302 nodes)") != std::string::npos);

  // A million levels: more nodes than the limit; the bracketed text is cut short.
  Tree huge;
  node = huge.add_node("X", kNoNode);
  for (int i = 0; i < 1'000'000; ++i) node = huge.add_node("X", node);
  huge.add_leaf("w", node);
  html = html::render_trees({{"huge", &huge, {}, ""}});
  CHECK(html.find("cut short") != std::string::npos);
  CHECK(html.size() < 30'000);

  // 200 levels: drawn, with the chain in one column.
  Tree tall;
  node = tall.add_node("X", kNoNode);
  for (int i = 0; i < 199; ++i) node = tall.add_node("X", node);
  tall.add_leaf("w", node);
  const auto p = html::layout_trees({&tall})[0];
  check_layout(tall, p);
  CHECK(p.boxes.size() == 200);
}

TEST_CASE("html tree: an empty tree shows its note") {
  const Tree gold = treegate::parse_tree("(S (NN x))");
  const Tree none;
  const std::string html =
      html::render_trees({{"gold", &gold, {}, ""}, {"predicted", &none, {}, "no parse"}});
  CHECK(count(html, "<svg ") == 1);
  CHECK(html.find("<p class=\"note\">no parse</p>") != std::string::npos);
}
